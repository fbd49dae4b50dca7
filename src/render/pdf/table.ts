/**
 * Tables: column widths from content, wrapped cells, alignment, a filled header row that is
 * repeated on every page the table reaches, and rows taller than what is left of a page
 * split cell by cell (never truncated). Used for GFM tables and the cover's tables.
 * pdfkit's own `doc.table` repeats no header and cuts tall rows, so it is not used.
 */
import type {AlignType, Table} from 'mdast'
import {
  applyStyle, atPageTop, drawText, keepTogether, measureText, newPage, spaceLeft, type RenderContext, type TextStyle,
} from './context.js'
import type {FontKey} from './fonts.js'
import {drawShape} from './shapes.js'
import {maxCharsInBox} from './long-words.js'
import {splitToHeight} from './split.js'
import {textContent} from './text-content.js'
import type {CalloutKind} from './theme.js'

export type CellAlign = 'left' | 'center' | 'right'

export interface Cell {
  text: string
  /** (default: `regular`, `bold` in the header) */
  font?: FontKey
  /** A shape drawn before the text (verdicts). */
  shape?: CalloutKind
}

export interface TableSpec {
  header: Cell[] | null
  rows: Cell[][]
  align: CellAlign[]
  /** Minimum row height, pt (sign-off rows leave room to sign). */
  minRowHeight?: number
  /** Fixed column widths as fractions of the frame width (default: from content). */
  fractions?: number[]
}

interface Layout {
  widths: number[]
  pad: number
  shapeSize: number
  size: number
}

function cellStyle(ctx: RenderContext, cell: Cell, header: boolean): TextStyle {
  return {font: cell.font ?? (header ? 'bold' : 'regular'), size: ctx.theme.fontSizes.table, color: ctx.theme.colours.text}
}

function shapeExtra(layout: Layout, cell: Cell): number {
  return cell.shape === undefined ? 0 : layout.shapeSize + 3
}

function columnWidths(ctx: RenderContext, spec: TableSpec, pad: number, shapeSize: number): number[] {
  const total = ctx.frame.width
  const all = spec.header === null ? spec.rows : [spec.header, ...spec.rows]
  const cols = Math.max(...all.map((r) => r.length), 1)
  const min = new Array<number>(cols).fill(2 * pad + 8)
  const max = new Array<number>(cols).fill(2 * pad + 8)
  all.forEach((row, r) => {
    row.forEach((cell, c) => {
      const style = cellStyle(ctx, cell, r === 0 && spec.header !== null)
      applyStyle(ctx, style)
      const extra = 2 * pad + (cell.shape === undefined ? 0 : shapeSize + 3)
      const text = ctx.glyphs.clean(keepTogether(cell.text), style.font)
      // A loop, not a spread: a cell of 100,000 words would overflow the stack as arguments.
      // Words are what a line may not break: a number with its unit (no-break space) and an
      // identifier (no-break hyphens) are one word each.
      let longestWord = 0
      for (const w of text.split(/[ \t\n\r]+/)) if (w !== '') longestWord = Math.max(longestWord, ctx.doc.widthOfString(w))
      min[c] = Math.max(min[c] as number, Math.min(longestWord + extra, total * 0.45))
      max[c] = Math.max(max[c] as number, ctx.doc.widthOfString(text) + extra + 1)
    })
  })
  const sum = (a: number[]): number => a.reduce((s, v) => s + v, 0)
  const sumMin = sum(min)
  const sumMax = sum(max)
  if (sumMax <= total) return max.map((w) => w + ((total - sumMax) * w) / sumMax)
  if (sumMin >= total) return min.map((w) => (w * total) / sumMin)
  return min.map((w, i) => w + (((max[i] as number) - w) * (total - sumMin)) / (sumMax - sumMin))
}

/**
 * A cell's height; a cell holding more characters than can fit in `cap` points is not
 * measured (it is certainly taller) and counts as just over `cap`, so a huge cell split
 * over many pages is never measured whole once a page.
 */
function cellHeight(ctx: RenderContext, layout: Layout, cell: Cell, width: number, header: boolean, cap = Infinity): number {
  const inner = width - 2 * layout.pad - shapeExtra(layout, cell)
  const style = cellStyle(ctx, cell, header)
  const line = measureText(ctx, 'Ag', style, inner)
  if (cell.text.length > maxCharsInBox(inner, cap, style.size, line)) return cap + 1
  return Math.max(line, cell.text === '' ? 0 : measureText(ctx, cell.text, style, inner))
}

function rowHeight(ctx: RenderContext, layout: Layout, row: Cell[], header: boolean, minRow: number, cap = Infinity): number {
  let tallest = 0
  layout.widths.forEach((w, c) => { tallest = Math.max(tallest, cellHeight(ctx, layout, row[c] ?? {text: ''}, w, header, cap)) })
  return Math.max(minRow, tallest + 2 * layout.pad)
}

function drawRow(ctx: RenderContext, spec: TableSpec, layout: Layout, row: Cell[], y: number, height: number, kind: 'header' | 'odd' | 'even'): void {
  const {doc, theme, frame} = ctx
  if (kind !== 'even') {
    doc.save().rect(frame.x, y, frame.width, height)
      .fill(kind === 'header' ? theme.colours.tableHeaderFill : theme.colours.tableStripeFill).restore()
  }
  let x = frame.x
  layout.widths.forEach((w, c) => {
    const cell = row[c] ?? {text: ''}
    const extra = shapeExtra(layout, cell)
    if (cell.shape !== undefined) {
      drawShape(doc, cell.shape, x + layout.pad, y + layout.pad + 0.5, layout.shapeSize, theme.callouts[cell.shape].accent)
    }
    if (cell.text !== '') {
      drawText(ctx, cell.text, cellStyle(ctx, cell, kind === 'header'), x + layout.pad + extra, y + layout.pad,
        w - 2 * layout.pad - extra, {align: spec.align[c] ?? 'left'})
    }
    x += w
  })
  doc.save().lineWidth(kind === 'header' ? 0.9 : 0.4).moveTo(frame.x, y + height).lineTo(frame.x + frame.width, y + height)
    .stroke(theme.colours.rule).restore()
  doc.y = y + height
}

/** Draws a table at `doc.y` in the current frame; leaves `doc.y` below it. */
export function drawTable(ctx: RenderContext, spec: TableSpec): void {
  const {doc, theme} = ctx
  const pad = theme.spacing.cellPadding
  const size = theme.fontSizes.table
  const layout: Layout = {widths: [], pad, shapeSize: size * 0.95, size}
  layout.widths = spec.fractions === undefined
    ? columnWidths(ctx, spec, pad, layout.shapeSize)
    : spec.fractions.map((f) => f * ctx.frame.width)
  const minRow = spec.minRowHeight ?? 0
  const header = spec.header
  const headerH = header === null ? 0 : rowHeight(ctx, layout, header, true, 0)
  const drawHeader = (): void => {
    if (header !== null) drawRow(ctx, spec, layout, header, doc.y, headerH, 'header')
  }
  const first = spec.rows[0]
  const firstH = first === undefined ? 0 : Math.min(rowHeight(ctx, layout, first, false, minRow), 60)
  if (headerH + firstH > spaceLeft(ctx) && !atPageTop(ctx)) newPage(ctx)
  drawHeader()
  // Keep-with-next for totals: the trailing rows whose first cell is bold (a table's totals)
  // move to the next page together with the row before them, never alone.
  let tail = spec.rows.length
  while (tail > 0 && spec.rows[tail - 1]?.[0]?.font === 'bold') tail--
  const keepFrom = tail < spec.rows.length ? Math.max(tail - 1, 0) : -1
  spec.rows.forEach((original, r) => {
    const kind = r % 2 === 0 ? 'even' : 'odd'
    let row = original
    if (r === keepFrom && r > 0) {
      const fresh = doc.page.height - doc.page.margins.top - doc.page.margins.bottom - headerH
      const together = spec.rows.slice(r).reduce((sum, x) => sum + rowHeight(ctx, layout, x, false, minRow, fresh), 0)
      if (together <= fresh && together > spaceLeft(ctx)) {
        newPage(ctx)
        drawHeader()
      }
    }
    for (;;) {
      const fresh = doc.page.height - doc.page.margins.top - doc.page.margins.bottom - headerH
      const h = rowHeight(ctx, layout, row, false, minRow, fresh)
      if (h <= spaceLeft(ctx)) {
        drawRow(ctx, spec, layout, row, doc.y, h, kind)
        return
      }
      const oneLine = rowHeight(ctx, layout, row.map(() => ({text: 'Ag'})), false, 0)
      if (h <= fresh || spaceLeft(ctx) < oneLine + 1) {
        newPage(ctx)
        drawHeader()
        if (h <= fresh) continue
      }
      // Taller than a page: fill what is left with the head of each cell, carry the rest.
      const avail = spaceLeft(ctx) - 2 * pad - 1
      const heads: Cell[] = []
      const tails: Cell[] = []
      layout.widths.forEach((w, c) => {
        const cell = row[c] ?? {text: ''}
        const inner = w - 2 * pad - shapeExtra(layout, cell)
        const split = splitToHeight(ctx, cell.text, cellStyle(ctx, cell, false), inner, avail)
        heads.push({...cell, text: split.head})
        tails.push({...(cell.font === undefined ? {} : {font: cell.font}), text: split.tail})
      })
      drawRow(ctx, spec, layout, heads, doc.y, spaceLeft(ctx), kind)
      newPage(ctx)
      drawHeader()
      row = tails
    }
  })
}

function alignOf(a: AlignType | undefined): CellAlign {
  return a === 'center' || a === 'right' ? a : 'left'
}

function cellOf(cell: Table['children'][number]['children'][number]): Cell {
  const kids = cell.children
  const bold = kids.length > 0 && kids.every((k) => k.type === 'strong')
  const mono = kids.length > 0 && kids.every((k) => k.type === 'inlineCode')
  const text = textContent(cell).replace(/\s*\n\s*/g, ' ')
  return bold ? {text, font: 'bold'} : mono ? {text, font: 'mono'} : {text}
}

/** A GFM table as a `TableSpec`: first row is the header, alignment from `align`. */
export function tableSpecOf(node: Table): TableSpec {
  const [head, ...body] = node.children
  const cols = Math.max(...node.children.map((r) => r.children.length), 0)
  const align = Array.from({length: cols}, (_, i) => alignOf(node.align?.[i] ?? undefined))
  return {
    header: head === undefined ? null : head.children.map(cellOf),
    rows: body.map((row) => row.children.map(cellOf)),
    align,
  }
}
