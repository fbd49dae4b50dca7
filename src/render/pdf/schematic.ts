/**
 * Schematics (DESIGN §8.9): a report `Drawing` drawn as vectors with pdfkit's own path and
 * text calls — no SVG round trip. Scaled down to the frame width when wider, kept whole on
 * one page, captioned "Figure N — caption" below like the charts.
 */
import {applyStyle, bodyStyle, keepSpace, measureText, type RenderContext, type TextStyle} from './context.js'
import {FONT_NAMES} from './fonts.js'
import type {SchematicNode} from '../../report/types.js'
import type {Point, Primitive} from '../../report/schematic/types.js'

const CAPTION_GAP = 4
const STROKE = 0.9

function captionStyle(ctx: RenderContext): TextStyle {
  return {font: 'regular', size: ctx.theme.fontSizes.small, color: ctx.theme.colours.text}
}

const captionText = (node: SchematicNode): string => `Figure ${node.number} — ${node.caption}`

const scaleOf = (ctx: RenderContext, node: SchematicNode): number => Math.min(1, ctx.frame.width / node.drawing.width)

/** Height the schematic takes with its caption, pt. */
export function schematicHeight(ctx: RenderContext, node: SchematicNode): number {
  return node.drawing.height * scaleOf(ctx, node) + CAPTION_GAP + measureText(ctx, captionText(node), captionStyle(ctx), ctx.frame.width)
}

function drawPrimitive(ctx: RenderContext, p: Primitive, at: (q: Point) => Point, s: number): void {
  const {doc, theme} = ctx
  const ink = theme.colours.text
  switch (p.kind) {
    case 'line': {
      const [first, ...rest] = p.points.map(at)
      if (first === undefined) return
      doc.moveTo(first[0], first[1])
      for (const q of rest) doc.lineTo(q[0], q[1])
      doc.stroke(ink)
      return
    }
    case 'polygon':
      doc.polygon(...p.points.map((q) => [...at(q)] as [number, number]))
      if (p.fill) doc.fillAndStroke(ink, ink)
      else doc.stroke(ink)
      return
    case 'rect': {
      const [x, y] = at([p.x, p.y])
      doc.rect(x, y, p.width * s, p.height * s).stroke(ink)
      return
    }
    case 'circle': {
      const [x, y] = at([p.cx, p.cy])
      doc.circle(x, y, p.r * s)
      if (p.fill) doc.fillAndStroke(ink, ink)
      else doc.stroke(ink)
      return
    }
    case 'text': {
      const face = p.bold ? 'bold' : 'regular'
      const clean = ctx.glyphs.clean(p.text, face)
      doc.font(FONT_NAMES[face]).fontSize(p.size * s).fillColor(ink)
      const w = doc.widthOfString(clean)
      const [x, y] = at([p.x, p.y])
      const left = p.anchor === 'start' ? x : p.anchor === 'middle' ? x - w / 2 : x - w
      doc.text(clean, left, y, {lineBreak: false, baseline: 'middle'})
    }
  }
}

export function drawSchematic(ctx: RenderContext, node: SchematicNode): void {
  const {doc, theme} = ctx
  keepSpace(ctx, schematicHeight(ctx, node))
  const s = scaleOf(ctx, node)
  const x0 = ctx.frame.x + (ctx.frame.width - node.drawing.width * s) / 2
  const y0 = doc.y
  const at = (q: Point): Point => [x0 + q[0] * s, y0 + q[1] * s]
  doc.save().lineWidth(STROKE * s).lineCap('round').lineJoin('round')
  for (const part of node.drawing.parts) for (const p of part.primitives) drawPrimitive(ctx, p, at, s)
  for (const p of node.drawing.wiring) drawPrimitive(ctx, p, at, s)
  for (const p of node.drawing.labels) drawPrimitive(ctx, p, at, s)
  doc.restore()
  applyStyle(ctx, bodyStyle(ctx))
  doc.strokeColor(theme.colours.text).lineWidth(1)
  doc.y = y0 + node.drawing.height * s + CAPTION_GAP
  applyStyle(ctx, captionStyle(ctx))
  doc.font(FONT_NAMES.bold).text(ctx.glyphs.clean(`Figure ${node.number}`, 'bold'), ctx.frame.x, doc.y, {
    width: ctx.frame.width, lineGap: theme.lineGap, continued: true, link: null, underline: false, strike: false,
  })
  doc.font(FONT_NAMES.regular).text(ctx.glyphs.clean(` — ${node.caption}`, 'regular'), {continued: false})
  doc.y += theme.spacing.paragraph + 2
}
