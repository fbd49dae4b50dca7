/**
 * The cover and sign-off page(s): title, project and the document's particulars, the
 * requirement verdicts of every stage (each verdict a word and a drawn shape), an overall
 * status line, the sign-off table (the author as "Prepared by", one row per reviewer, two
 * blank rows when none are named) and the closing statements. Flows onto further pages
 * when it does not fit on one.
 */
import type {Heading} from 'mdast'
import {overallSentence, SEVERITY_WORDS} from '../../report/cover-text.js'
import type {ReportDocument, Verdict} from '../../report/types.js'
import {lastPageIndex} from './pdfkit.js'
import {drawText, keepSpace, measureText, type RenderContext, type TextStyle} from './context.js'
import {STATUS_WORDS} from './furniture.js'
import {drawShape} from './shapes.js'
import {drawTable, type Cell} from './table.js'

export const VERDICT_WORDS: Record<Verdict, string> = {
  met: 'MET',
  'not-met': 'NOT MET',
  'not-evaluated': 'NOT EVALUATED',
}

/** `date` as YYYY-MM-DD in UTC (never the process time zone). */
export function isoDate(date: Date): string {
  return date.toISOString().slice(0, 10)
}

/** A cover heading: outline level `depth`, set in the h3 size (the cover keeps to one page). */
function heading(ctx: RenderContext, text: string, depth: Heading['depth']): void {
  const saved = ctx.theme
  ctx.theme = {...saved, fontSizes: {...saved.fontSizes, h2: saved.fontSizes.h3}, spacing: {...saved.spacing, headingBefore: saved.spacing.headingBefore * 0.3}}
  try {
    ctx.blocks.heading(ctx, {type: 'heading', depth, children: [{type: 'text', value: text}]}, [])
  } finally {
    ctx.theme = saved
  }
}

export function overallText(doc: ReportDocument): string {
  return overallSentence(doc.cover)
}

function drawOverall(ctx: RenderContext, doc: ReportDocument): void {
  const {theme} = ctx
  const size = theme.fontSizes.body
  const style = {font: 'bold' as const, size, color: theme.colours.text}
  const kind = doc.cover.counted.requirements === 0 ? 'not-evaluated' : doc.cover.overall
  keepSpace(ctx, size * 1.6)
  const y = ctx.doc.y + 2
  drawShape(ctx.doc, kind, ctx.frame.x, y, size * 1.1, theme.callouts[kind].accent)
  drawText(ctx, overallText(doc), style, ctx.frame.x + size * 1.1 + 6, y, ctx.frame.width - size * 2)
  ctx.doc.y += theme.spacing.paragraph
}

function plain(ctx: RenderContext, text: string, style: TextStyle, indent = 0): void {
  const h = measureText(ctx, text, style, ctx.frame.width - indent)
  keepSpace(ctx, h)
  drawText(ctx, text, style, ctx.frame.x + indent, ctx.doc.y, ctx.frame.width - indent)
  ctx.doc.y += 3
}

/** The archetype line and what the overall verdict leaves out, in one paragraph. */
function drawCaveats(ctx: RenderContext, report: ReportDocument): void {
  const style = {font: 'regular' as const, size: ctx.theme.fontSizes.small, color: ctx.theme.colours.text}
  const arch = report.cover.archetypes
  const sentences: string[] = []
  if (arch.length === 1) {
    sentences.push(`Stage ${arch[0]!.stage} uses the archetype ${arch[0]!.opamp}: its figures are for the class, not a part. Replace its figures with the chosen part's datasheet values before sign-off.`)
  } else if (arch.length > 1) {
    const each = arch.map((a) => `${a.stage} (archetype ${a.opamp})`)
    sentences.push(`Stages ${each.slice(0, -1).join(', ')} and ${each.at(-1)!} use archetypes: their figures are for the class, not a part. Replace them with the chosen parts' datasheet values before sign-off.`)
  }
  const base = report.cover.baseline
  if (base.length > 0) {
    sentences.push(`Baseline stage${base.length > 1 ? 's' : ''} ${base.join(', ')}: kept for comparison, not counted in the overall verdict or the exit code.`)
  }
  if (sentences.length > 0) plain(ctx, sentences.join(' '), style)
  ctx.doc.y += ctx.theme.spacing.paragraph - 3
}

/** The open cautions, warnings and safety notes by title, each with its page (written once the body is drawn). */
function drawOpenNotes(ctx: RenderContext, report: ReportDocument): void {
  const {theme, doc} = ctx
  const notes = report.cover.notes
  const style = {font: 'regular' as const, size: theme.fontSizes.small, color: theme.colours.text}
  if (notes.length === 0) {
    // One line, no heading: the cover of a clean note stays on one page.
    plain(ctx, 'Open notes: none (no caution, warning or safety note was raised).', {...style, size: theme.fontSizes.body})
    doc.y += theme.spacing.paragraph - 3
    return
  }
  heading(ctx, 'Open notes', 2)
  const pageWidth = 46
  const width = ctx.frame.width - pageWidth
  for (const n of notes) {
    const where = n.stage === null ? 'every stage' : n.stage
    const text = `${SEVERITY_WORDS[n.severity]} · ${where} · ${n.title} (${n.rule})${n.accepted === null ? '' : ` — accepted by the author: ${n.accepted}`}`
    const h = measureText(ctx, text, style, width)
    keepSpace(ctx, h + 1)
    const y = doc.y
    drawText(ctx, text, style, ctx.frame.x, y, width)
    ctx.pageRefs.push({anchor: n.anchor, page: lastPageIndex(doc), right: ctx.frame.x + ctx.frame.width, y, style})
    doc.y = y + h + 1
  }
  doc.y += theme.spacing.paragraph / 2
}

function signOffRows(doc: ReportDocument): Cell[][] {
  const rows: Cell[][] = [[{text: 'Prepared by'}, {text: doc.meta.author ?? ''}, {text: ''}, {text: ''}]]
  for (const r of doc.meta.reviewers) rows.push([{text: r.role === '' ? 'Reviewer' : r.role}, {text: r.name}, {text: ''}, {text: ''}])
  if (doc.meta.reviewers.length === 0) {
    rows.push([{text: 'Reviewer'}, {text: ''}, {text: ''}, {text: ''}], [{text: 'Approver'}, {text: ''}, {text: ''}, {text: ''}])
  }
  return rows
}

export function drawCover(ctx: RenderContext, report: ReportDocument, date: Date): void {
  const saved = ctx.theme
  // Tables on the cover are set with a little less cell padding than in the body.
  ctx.theme = {...saved, spacing: {...saved.spacing, cellPadding: Math.min(saved.spacing.cellPadding, 2.5)}}
  try {
    drawCoverPage(ctx, report, date)
  } finally {
    ctx.theme = saved
  }
}

function drawCoverPage(ctx: RenderContext, report: ReportDocument, date: Date): void {
  const {doc, theme} = ctx
  const {meta} = report
  const title = meta.title ?? 'Untitled design note'
  const titleStyle = {font: 'bold' as const, size: theme.fontSizes.title, color: theme.colours.text}
  ctx.outline?.stack.push({depth: 1, item: doc.outline.addItem('Cover and sign-off')})
  doc.y = doc.page.margins.top + theme.spacing.headingBefore / 2
  drawText(ctx, title, titleStyle, ctx.frame.x, doc.y, ctx.frame.width)
  doc.y += 4
  if (meta.project !== null) {
    drawText(ctx, meta.project, {font: 'regular', size: theme.fontSizes.h3, color: theme.colours.muted}, ctx.frame.x, doc.y, ctx.frame.width)
  }
  doc.y += theme.spacing.headingBefore / 2
  const particulars: [string, string][] = [
    ['Document', meta.document ?? '—'],
    ['Revision', meta.revision ?? '—'],
    ['Date', meta.date ?? isoDate(date)],
    ['Author', meta.author ?? '—'],
    ['Status', STATUS_WORDS[meta.status]],
  ]
  // Three particulars a row: the cover keeps its room for the verdicts, notes and signatures.
  const rows3: Cell[][] = []
  for (let i = 0; i < particulars.length; i += 3) {
    const row: Cell[] = []
    for (const [k, v] of particulars.slice(i, i + 3)) row.push({text: k, font: 'bold'}, {text: v})
    while (row.length < 6) row.push({text: ''})
    rows3.push(row)
  }
  drawTable(ctx, {header: null, rows: rows3, align: ['left', 'left', 'left', 'left', 'left', 'left'], fractions: [0.12, 0.26, 0.1, 0.2, 0.08, 0.24]})
  doc.y += theme.spacing.paragraph
  heading(ctx, 'Requirement verdicts', 2)
  if (report.cover.verdicts.length > 0) {
    // Compact rows: the small size and tight padding, the verdict one word (a baseline
    // stage says so in its stage cell and in the lines below), so that a row is one line.
    const saved = ctx.theme
    ctx.theme = {...saved, fontSizes: {...saved.fontSizes, table: saved.fontSizes.small}, spacing: {...saved.spacing, cellPadding: Math.min(saved.spacing.cellPadding, 1.2)}}
    try {
      drawTable(ctx, {
        header: ['Stage', 'Requirement', 'Value', 'Limit', 'Verdict'].map((text) => ({text})),
        rows: report.cover.verdicts.map((v) => [
          {text: v.counted ? v.stage : `${v.stage} (baseline)`}, {text: v.requirement}, {text: v.value}, {text: v.limit},
          {text: VERDICT_WORDS[v.verdict], font: 'bold', shape: v.verdict},
        ]),
        align: ['left', 'left', 'right', 'right', 'left'],
      })
    } finally {
      ctx.theme = saved
    }
    doc.y += theme.spacing.paragraph / 2
  }
  drawOverall(ctx, report)
  drawCaveats(ctx, report)
  drawOpenNotes(ctx, report)
  heading(ctx, 'Sign-off', 2)
  const rows = signOffRows(report)
  const rowH = Math.max(theme.spacing.signatureRowHeight, measureText(ctx, 'Ag', {font: 'regular', size: theme.fontSizes.table, color: theme.colours.text}, 100))
  drawTable(ctx, {
    header: ['Role', 'Name', 'Signature', 'Date'].map((text) => ({text})),
    rows,
    align: ['left', 'left', 'left', 'left'],
    minRowHeight: rowH,
    fractions: [0.2, 0.3, 0.32, 0.18],
  })
  doc.y += theme.spacing.paragraph
  // The closing statements in the table size, their headings one level smaller: the whole
  // cover fits on one page for an ordinary note; a long one still flows on.
  const saved = ctx.theme
  const f = saved.fontSizes
  ctx.theme = {...saved, fontSizes: {...f, body: f.small, h1: f.h4, h2: f.h4, h3: f.h4}, spacing: {...saved.spacing, headingBefore: saved.spacing.headingBefore / 3, headingAfter: saved.spacing.headingAfter / 2, paragraph: saved.spacing.paragraph / 2}}
  try {
    ctx.blocks.render(ctx, report.closing.children)
  } finally {
    ctx.theme = saved
  }
}
