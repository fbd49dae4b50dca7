/**
 * Fenced code: monospaced on a light background, long lines wrapped (never clipped), and
 * split across pages, each piece with its own background. Tabs become four spaces.
 */
import {drawText, keepSpace, measureText, newPage, spaceLeft, type RenderContext, type TextStyle} from './context.js'
import {splitToHeight} from './split.js'

export function drawCode(ctx: RenderContext, value: string, lang: string | null): void {
  const {doc, theme} = ctx
  const pad = theme.spacing.codePadding
  const style: TextStyle = {font: 'mono', size: theme.fontSizes.code, color: theme.colours.text}
  const width = ctx.frame.width - 2 * pad
  let rest = value.replace(/\t/g, '    ').replace(/\s+$/, '')
  if (rest === '') rest = ' '
  const line = measureText(ctx, 'Ag', style, width)
  keepSpace(ctx, Math.min(measureText(ctx, rest, style, width), line * 3) + 2 * pad)
  if (lang !== null && lang !== '') {
    const label: TextStyle = {font: 'regular', size: theme.fontSizes.small, color: theme.colours.muted}
    drawText(ctx, lang, label, ctx.frame.x, doc.y, ctx.frame.width)
    doc.y += 1
  }
  while (rest !== '') {
    if (spaceLeft(ctx) < line + 2 * pad + 1) newPage(ctx)
    const {head, tail} = splitToHeight(ctx, rest, style, width, spaceLeft(ctx) - 2 * pad - 1, true)
    const piece = head === '' ? rest.slice(0, 1) : head
    const h = measureText(ctx, piece, style, width) + 2 * pad
    const y = doc.y
    doc.save().rect(ctx.frame.x, y, ctx.frame.width, h).fill(theme.colours.codeFill).restore()
    drawText(ctx, piece, style, ctx.frame.x + pad, y + pad, width)
    doc.y = y + h
    rest = head === '' ? rest.slice(1) : tail
    if (rest !== '') newPage(ctx)
  }
  doc.y += theme.spacing.paragraph
}
