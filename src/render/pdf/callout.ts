/**
 * Callouts: a practice or safety note, or a verdict line. A filled box with a left bar in
 * the kind's accent, a drawn shape and the label word in bold (so the kind never rests on
 * colour alone), then the children. A callout is kept whole on one page when it fits on
 * one; a longer one flows across pages with its bar on each and no fill.
 */
import {applyStyle, atPageTop, drawText, indented, newPage, pageBodyHeight, spaceLeft, type RenderContext} from './context.js'
import type {CalloutNode} from '../../report/types.js'
import {measureBlocks} from './measure.js'
import {lastPageIndex} from './pdfkit.js'
import {drawShape} from './shapes.js'
import {drawBar} from './spans.js'

const BAR = 3

export function drawCallout(ctx: RenderContext, node: CalloutNode): void {
  const {doc, theme} = ctx
  const kind = node.severity
  const colours = theme.callouts[kind]
  const pad = theme.spacing.calloutPadding
  const size = theme.fontSizes.body
  const icon = size * 1.05
  const inset = BAR + pad
  const labelStyle = {font: 'bold' as const, size, color: theme.colours.text}
  applyStyle(ctx, labelStyle)
  const labelH = Math.max(icon, doc.currentLineHeight(true))
  const bodyWidth = ctx.frame.width - inset - pad
  const childrenH = node.children.length === 0 ? 0 : measureBlocks(ctx, node.children, bodyWidth) - theme.spacing.paragraph
  const height = pad + labelH + (node.children.length === 0 ? 0 : 4 + childrenH) + pad
  if (height > spaceLeft(ctx) && !atPageTop(ctx) && height <= pageBodyHeight(ctx)) newPage(ctx)
  const whole = height <= spaceLeft(ctx)
  if (node.anchor !== undefined) ctx.anchors.set(node.anchor, lastPageIndex(doc) + 1)
  const x = ctx.frame.x
  const top = doc.y
  const start = {page: lastPageIndex(doc), y: top}
  if (whole) {
    doc.save().rect(x, top, ctx.frame.width, height).fill(colours.fill).restore()
    doc.save().rect(x, top, BAR, height).fill(colours.accent).restore()
  }
  drawShape(doc, kind, x + inset, top + pad + (labelH - icon) / 2, icon, colours.accent)
  drawText(ctx, node.label, labelStyle, x + inset + icon + 5, top + pad + (labelH - size * 1.17) / 2, bodyWidth - icon - 5)
  doc.y = top + pad + labelH + 4
  indented(ctx, inset, () => ctx.blocks.render(ctx, node.children), pad)
  if (whole) doc.y = top + height
  else {
    const end = {page: lastPageIndex(doc), y: doc.y - theme.spacing.paragraph + pad}
    drawBar(ctx, start, end, x, BAR, colours.accent)
    doc.y += pad
  }
  doc.y += theme.spacing.paragraph
}
