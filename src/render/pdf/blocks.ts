/**
 * The block renderer: walks a tree's children in order and draws each node in the current
 * frame at `doc.y`. Headings (with outline entries, kept with what follows), paragraphs,
 * block quotes, rules, HTML as text, and dispatch to the modules for lists, tables, code,
 * images, figures and callouts. Unknown nodes print their text and raise a warning.
 */
import type {Blockquote, Heading, Paragraph, PhrasingContent, RootContent} from 'mdast'
import {drawCallout} from './callout.js'
import {drawFigure, figureHeight} from './chart.js'
import {codeKeepHeight, drawCode} from './code.js'
import {
  atPageTop, bodyStyle, drawText, estimateText, indented, keepSpace, measureText, newPage, spaceLeft, type RenderContext,
} from './context.js'
import {drawImage} from './image.js'
import {noteImageFigure} from '../../report/types.js'
import {drawRuns, runsOf, runsText} from './inline.js'
import {drawList} from './list.js'
import {drawSchematic, schematicHeight} from './schematic.js'
import {lastPageIndex} from './pdfkit.js'
import {drawBar} from './spans.js'
import {drawTable, tableSpecOf} from './table.js'
import {textContent} from './text-content.js'

/** A paragraph up to this many lines is never split with a line or two left over. */
const SHORT_PARAGRAPH_LINES = 8

/** Gap after a paragraph in a tight list item, pt. */
const TIGHT_GAP = 2

const HEADING_SIZES = ['h1', 'h2', 'h3', 'h4'] as const

export function headingSize(ctx: RenderContext, depth: number): number {
  return ctx.theme.fontSizes[HEADING_SIZES[Math.min(Math.max(depth, 1), 4) - 1] ?? 'h4']
}

function lines(ctx: RenderContext, n: number, size = ctx.theme.fontSizes.body): number {
  return n * (size * 1.17 + ctx.theme.lineGap)
}

/** How many blocks deep a keep-with-next looks (heading → introduction → heading → its table). */
const KEEP_DEPTH = 4

/** Blocks a short paragraph before them introduces. */
const INTRODUCED = new Set<string>(['figure', 'schematic', 'table', 'code', 'caption', 'heading'])

/** The least height that must stay on the page with a heading or caption placed before `node`. */
export function keepHeight(ctx: RenderContext, node: RootContent | undefined, rest: RootContent[], depth = 0): number {
  if (node === undefined) return 0
  // What a block brings with it is followed a few blocks deep, never along a whole run of
  // short sections (each would otherwise hold the next, and all of them one another).
  const then = (): number => (depth >= KEEP_DEPTH ? 0 : keepHeight(ctx, rest[0], rest.slice(1), depth + 1))
  switch (node.type) {
    case 'figure': return figureHeight(ctx, node)
    case 'schematic': return schematicHeight(ctx, node)
    case 'caption': return lines(ctx, 1, ctx.theme.fontSizes.small) + (depth >= KEEP_DEPTH ? lines(ctx, 2) : keepHeight(ctx, rest[0], rest.slice(1), depth + 1))
    // A heading placed here brings what it keeps with it (its own keep-with-next).
    case 'heading': return lines(ctx, 1, headingSize(ctx, node.depth)) + ctx.theme.spacing.headingBefore + ctx.theme.spacing.headingAfter +
      Math.max(lines(ctx, 2), then())
    case 'table': return lines(ctx, 2, ctx.theme.fontSizes.table) + 4 * ctx.theme.spacing.cellPadding
    case 'code': return codeKeepHeight(ctx, node.value)
    case 'paragraph': {
      const h = estimateText(ctx, textContent(node), bodyStyle(ctx), ctx.frame.width)
      // A line or two that introduces a figure, a table or code (a stage's "Voltage follower
      // on …" before its schematic) goes with it: a heading then never ends a page with
      // only its introduction under it.
      const next = rest[0]
      if (h <= lines(ctx, 2) && next !== undefined && INTRODUCED.has(next.type) && depth < KEEP_DEPTH) {
        return h + ctx.theme.spacing.paragraph + then()
      }
      return h <= lines(ctx, SHORT_PARAGRAPH_LINES) ? h : lines(ctx, 3)
    }
    default: return lines(ctx, 3)
  }
}

function addOutline(ctx: RenderContext, title: string, depth: number): void {
  const state = ctx.outline
  if (state === null || title.trim() === '') return
  while (state.stack.length > 0 && (state.stack[state.stack.length - 1]?.depth ?? 0) >= depth) state.stack.pop()
  const parent = state.stack[state.stack.length - 1]?.item ?? ctx.doc.outline
  state.stack.push({depth, item: parent.addItem(title.trim())})
}

export function drawHeading(ctx: RenderContext, node: Heading, rest: RootContent[]): void {
  const {doc, theme} = ctx
  const size = headingSize(ctx, node.depth)
  const runs = runsOf(ctx, node.children, {size, color: theme.colours.text, bold: true})
  const height = estimateText(ctx, runsText(runs), {font: 'bold', size, color: theme.colours.text}, ctx.frame.width)
  if (!atPageTop(ctx)) doc.y += theme.spacing.headingBefore
  keepSpace(ctx, height + theme.spacing.headingAfter + keepHeight(ctx, rest[0], rest.slice(1)))
  addOutline(ctx, textContent(node), node.depth)
  drawRuns(ctx, runs, ctx.frame.x, doc.y, ctx.frame.width)
  if (node.depth === 1) {
    const y = doc.y + 1.5
    doc.save().lineWidth(0.8).moveTo(ctx.frame.x, y).lineTo(ctx.frame.x + ctx.frame.width, y).stroke(theme.colours.rule).restore()
    doc.y = y + 1.5
  }
  doc.y += theme.spacing.headingAfter
}

/** Draws phrasing content as one paragraph; images inside it become blocks of their own. */
export function drawPhrasing(ctx: RenderContext, children: PhrasingContent[]): void {
  const {doc, theme} = ctx
  let segment: PhrasingContent[] = []
  const flush = (): void => {
    const runs = runsOf(ctx, segment, {size: theme.fontSizes.body, color: theme.colours.text})
    segment = []
    const text = runsText(runs)
    if (text.trim() === '') return
    // A short paragraph that would leave a line or two on the next page moves there whole.
    const h = estimateText(ctx, text, bodyStyle(ctx), ctx.frame.width)
    const spill = h - spaceLeft(ctx)
    keepSpace(ctx, spill > 0 && spill < lines(ctx, 2.5) && h <= lines(ctx, SHORT_PARAGRAPH_LINES) ? h : lines(ctx, 1))
    drawRuns(ctx, runs, ctx.frame.x, doc.y, ctx.frame.width)
    doc.y += ctx.tight ? TIGHT_GAP : theme.spacing.paragraph
  }
  for (const child of children) {
    if (child.type === 'image') {
      flush()
      drawImage(ctx, child.url, child.alt ?? '', noteImageFigure(child))
    } else if (child.type === 'imageReference') {
      flush()
      const def = ctx.definitions.get(child.identifier.toLowerCase())
      drawImage(ctx, def?.url ?? child.identifier, child.alt ?? '', noteImageFigure(child))
    } else segment.push(child)
  }
  flush()
}

/** A paragraph; one that introduces a code block or a table (keep-with-next) stays on its page. */
function drawParagraph(ctx: RenderContext, node: Paragraph, rest: RootContent[]): void {
  const next = rest[0]
  if ((next?.type === 'code' || next?.type === 'table') && !node.children.some((c) => c.type === 'image' || c.type === 'imageReference')) {
    const h = estimateText(ctx, textContent(node), bodyStyle(ctx), ctx.frame.width)
    const need = h + ctx.theme.spacing.paragraph + keepHeight(ctx, next, rest.slice(1))
    if (h <= lines(ctx, SHORT_PARAGRAPH_LINES)) keepSpace(ctx, need)
  }
  drawPhrasing(ctx, node.children)
}

function drawBlockquote(ctx: RenderContext, node: Blockquote): void {
  const {doc, theme} = ctx
  keepSpace(ctx, lines(ctx, 1))
  const start = {page: lastPageIndex(doc), y: doc.y}
  const barX = ctx.frame.x + 2
  indented(ctx, theme.spacing.quoteIndent, () => renderBlocks(ctx, node.children))
  const end = {page: lastPageIndex(doc), y: Math.max(doc.y - theme.spacing.paragraph, start.y)}
  drawBar(ctx, start, end, barX, 2.5, theme.colours.quoteBar)
}

function drawRule(ctx: RenderContext): void {
  const {doc, theme} = ctx
  keepSpace(ctx, 12)
  const y = doc.y + 4
  doc.save().lineWidth(0.6).moveTo(ctx.frame.x, y).lineTo(ctx.frame.x + ctx.frame.width, y).stroke(theme.colours.rule).restore()
  doc.y = y + 4 + theme.spacing.paragraph
}

function drawCaption(ctx: RenderContext, text: string, rest: RootContent[]): void {
  const {doc, theme} = ctx
  const style = {font: 'bold' as const, size: theme.fontSizes.small, color: theme.colours.text}
  const h = measureText(ctx, text, style, ctx.frame.width)
  keepSpace(ctx, h + 3 + keepHeight(ctx, rest[0], rest.slice(1)))
  drawText(ctx, text, style, ctx.frame.x, doc.y, ctx.frame.width)
  doc.y += 3
}

function drawPlain(ctx: RenderContext, text: string, color: string): void {
  if (text.trim() === '') return
  keepSpace(ctx, lines(ctx, 1))
  drawText(ctx, text, {font: 'regular', size: ctx.theme.fontSizes.body, color}, ctx.frame.x, ctx.doc.y, ctx.frame.width)
  ctx.doc.y += ctx.theme.spacing.paragraph
}

export function renderBlock(ctx: RenderContext, node: RootContent, rest: RootContent[]): void {
  const {theme} = ctx
  switch (node.type) {
    case 'heading': return drawHeading(ctx, node, rest)
    case 'paragraph': return drawParagraph(ctx, node, rest)
    case 'blockquote': return drawBlockquote(ctx, node)
    case 'list': return drawList(ctx, node)
    case 'table':
      drawTable(ctx, tableSpecOf(node))
      ctx.doc.y += theme.spacing.paragraph
      return
    case 'code': return drawCode(ctx, node.value, node.lang ?? null)
    case 'thematicBreak': return drawRule(ctx)
    case 'html': return drawPlain(ctx, node.value, theme.colours.muted)
    case 'figure': return drawFigure(ctx, node)
    case 'schematic': return drawSchematic(ctx, node)
    case 'callout': return drawCallout(ctx, node)
    case 'caption': return drawCaption(ctx, node.text, rest)
    case 'pageBreak':
      if (!atPageTop(ctx)) newPage(ctx)
      return
    case 'definition':
    case 'footnoteDefinition':
    case 'yaml':
      return
    default: {
      const unknown = node as {type: string}
      ctx.warnings.add(`Unknown node \`${unknown.type}\`: printed as plain text`)
      return drawPlain(ctx, textContent(unknown), theme.colours.text)
    }
  }
}

/** Draws `nodes` in order in the current frame. */
export function renderBlocks(ctx: RenderContext, nodes: RootContent[]): void {
  nodes.forEach((node, i) => renderBlock(ctx, node, nodes.slice(i + 1)))
}
