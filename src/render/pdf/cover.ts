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

function heading(ctx: RenderContext, text: string, depth: Heading['depth']): void {
  ctx.blocks.heading(ctx, {type: 'heading', depth, children: [{type: 'text', value: text}]}, [])
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

/** The archetype line(s) and what the overall verdict leaves out. */
function drawCaveats(ctx: RenderContext, report: ReportDocument): void {
  const style = {font: 'regular' as const, size: ctx.theme.fontSizes.body, color: ctx.theme.colours.text}
  for (const a of report.cover.archetypes) {
    plain(ctx, `Stage ${a.stage} uses the archetype ${a.opamp}: its figures are for the class, not a part; replace them with the chosen part's datasheet values before sign-off.`, style)
  }
  if (report.cover.baseline.length > 0) {
    plain(ctx, `Baseline stage${report.cover.baseline.length > 1 ? 's' : ''} ${report.cover.baseline.join(', ')}: kept for comparison, shown with ${report.cover.baseline.length > 1 ? 'their' : 'its'} verdicts but not counted in the overall verdict or the exit code.`, style)
  }
  ctx.doc.y += ctx.theme.spacing.paragraph - 3
}

/** The open cautions, warnings and safety notes by title, each with its page (written once the body is drawn). */
function drawOpenNotes(ctx: RenderContext, report: ReportDocument): void {
  const {theme, doc} = ctx
  const notes = report.cover.notes
  const style = {font: 'regular' as const, size: theme.fontSizes.table, color: theme.colours.text}
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
    const where = n.stage === null ? 'every stage' : `stage ${n.stage}`
    const text = `${SEVERITY_WORDS[n.severity]} · ${where} · ${n.title} (${n.rule})${n.accepted === null ? '' : ` — accepted by the author: ${n.accepted}`}`
    const h = measureText(ctx, text, style, width)
    keepSpace(ctx, h + 2)
    const y = doc.y
    drawText(ctx, text, style, ctx.frame.x, y, width)
    ctx.pageRefs.push({anchor: n.anchor, page: lastPageIndex(doc), right: ctx.frame.x + ctx.frame.width, y, style})
    doc.y = y + h + 2
  }
  doc.y += theme.spacing.paragraph
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
  const {doc, theme} = ctx
  const {meta} = report
  const title = meta.title ?? 'Untitled design note'
  const titleStyle = {font: 'bold' as const, size: theme.fontSizes.title, color: theme.colours.text}
  ctx.outline?.stack.push({depth: 1, item: doc.outline.addItem('Cover and sign-off')})
  doc.y = doc.page.margins.top + theme.spacing.headingBefore
  drawText(ctx, title, titleStyle, ctx.frame.x, doc.y, ctx.frame.width)
  doc.y += 4
  if (meta.project !== null) {
    drawText(ctx, meta.project, {font: 'regular', size: theme.fontSizes.h3, color: theme.colours.muted}, ctx.frame.x, doc.y, ctx.frame.width)
  }
  doc.y += theme.spacing.headingBefore
  const particulars: [string, string][] = [
    ['Document', meta.document ?? '—'],
    ['Revision', meta.revision ?? '—'],
    ['Date', meta.date ?? isoDate(date)],
    ['Author', meta.author ?? '—'],
    ['Status', STATUS_WORDS[meta.status]],
  ]
  drawTable(ctx, {header: null, rows: particulars.map(([k, v]) => [{text: k, font: 'bold'}, {text: v}]), align: ['left', 'left']})
  doc.y += theme.spacing.paragraph
  heading(ctx, 'Requirement verdicts', 2)
  if (report.cover.verdicts.length > 0) {
    drawTable(ctx, {
      header: ['Stage', 'Requirement', 'Value', 'Limit', 'Verdict'].map((text) => ({text})),
      rows: report.cover.verdicts.map((v) => [
        {text: v.counted ? v.stage : `${v.stage} (baseline)`}, {text: v.requirement}, {text: v.value}, {text: v.limit},
        {text: v.counted ? VERDICT_WORDS[v.verdict] : `${VERDICT_WORDS[v.verdict]} (not counted)`, font: 'bold', shape: v.verdict},
      ]),
      align: ['left', 'left', 'right', 'right', 'left'],
    })
    doc.y += theme.spacing.paragraph
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
  ctx.blocks.render(ctx, report.closing.children)
}
