/**
 * Lists: bullets by nesting depth, numbers for ordered lists (from `start`), and a drawn box
 * (ticked or not) for task items. Item content is drawn by the block renderer in a frame
 * indented past the marker, so nested lists, code and quotes work inside items.
 */
import type {List} from 'mdast'
import {applyStyle, drawText, estimateText, indented, keepSpace, spaceLeft, type RenderContext} from './context.js'
import {textContent} from './text-content.js'
import {drawTaskBox} from './shapes.js'

const BULLETS = ['•', '◦', '▪']

export function drawList(ctx: RenderContext, node: List): void {
  const {doc, theme} = ctx
  const size = theme.fontSizes.body
  const style = {font: 'regular' as const, size, color: theme.colours.text}
  const start = node.start ?? 1
  const ordered = node.ordered === true
  const markers = node.children.map((_, i) => (ordered ? `${start + i}.` : BULLETS[ctx.listDepth % BULLETS.length] ?? '•'))
  applyStyle(ctx, style)
  const widest = Math.max(...markers.map((m) => doc.widthOfString(m)), 0)
  const indent = Math.max(theme.spacing.listIndent, widest + 6)
  const lineHeight = size * 1.17 + theme.lineGap
  node.children.forEach((item, i) => {
    // The marker goes with its item: an item whose first paragraph would move whole to the
    // next page (the paragraph rule of blocks.ts: spill under 2.5 lines, at most 8 lines)
    // takes its marker with it rather than leave it alone at the page's foot.
    const first = item.children[0]
    let need = lineHeight
    if (first?.type === 'paragraph') {
      const h = estimateText(ctx, textContent(first), style, ctx.frame.width - indent)
      const spill = h - spaceLeft(ctx)
      if (spill > 0 && spill < lineHeight * 2.5 && h <= lineHeight * 8) need = h
    }
    keepSpace(ctx, need)
    const y = doc.y
    if (typeof item.checked === 'boolean') {
      const box = size * 0.78
      drawTaskBox(doc, ctx.frame.x + indent - box - 5, y + size * 0.12, box, item.checked, theme.colours.text)
    } else {
      drawText(ctx, markers[i] ?? '', style, ctx.frame.x, y, indent - 5, {align: 'right'})
    }
    doc.y = y
    const saved = {depth: ctx.listDepth, tight: ctx.tight}
    ctx.listDepth += 1
    ctx.tight = node.spread !== true && item.spread !== true
    try {
      indented(ctx, indent, () => ctx.blocks.render(ctx, item.children))
    } finally {
      ctx.listDepth = saved.depth
      ctx.tight = saved.tight
    }
  })
  if (!ctx.tight) doc.y += theme.spacing.paragraph
}
