/**
 * The cover and sign-off page(s): title, project and the document's particulars, the
 * requirement verdicts of every stage (each verdict a word and a drawn shape), an overall
 * status line, the sign-off table (the author as "Prepared by", one row per reviewer, two
 * blank rows when none are named) and the closing statements. Flows onto further pages
 * when it does not fit on one.
 */
import type {Heading} from 'mdast'
import type {ReportDocument, Verdict} from '../../report/types.js'
import {drawText, keepSpace, measureText, type RenderContext} from './context.js'
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

/** Limits are counted with the requirements (DESIGN §4.6); say so when there are any. */
const limitsNote = (doc: ReportDocument): string =>
  doc.cover.verdicts.some((v) => v.requirement.endsWith('(limit)')) ? ' (physical limits included)' : ''

function overallText(doc: ReportDocument): string {
  const {verdicts, overall} = doc.cover
  const notMet = verdicts.filter((v) => v.verdict === 'not-met').length
  if (verdicts.length === 0) return 'Overall: no requirements were stated'
  switch (overall) {
    case 'met': return `Overall: all ${verdicts.length} requirements met${limitsNote(doc)}`
    case 'not-met': return `Overall: ${notMet} of ${verdicts.length} requirements not met${limitsNote(doc)}`
    case 'not-evaluated': return 'Overall: requirements not evaluated'
  }
}

function drawOverall(ctx: RenderContext, doc: ReportDocument): void {
  const {theme} = ctx
  const size = theme.fontSizes.body
  const style = {font: 'bold' as const, size, color: theme.colours.text}
  const kind = doc.cover.verdicts.length === 0 ? 'not-evaluated' : doc.cover.overall
  keepSpace(ctx, size * 1.6)
  const y = ctx.doc.y + 2
  drawShape(ctx.doc, kind, ctx.frame.x, y, size * 1.1, theme.callouts[kind].accent)
  drawText(ctx, overallText(doc), style, ctx.frame.x + size * 1.1 + 6, y, ctx.frame.width - size * 2)
  ctx.doc.y += theme.spacing.paragraph
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
        {text: v.stage}, {text: v.requirement}, {text: v.value}, {text: v.limit},
        {text: VERDICT_WORDS[v.verdict], font: 'bold', shape: v.verdict},
      ]),
      align: ['left', 'left', 'right', 'right', 'left'],
    })
    doc.y += theme.spacing.paragraph
  }
  drawOverall(ctx, report)
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
