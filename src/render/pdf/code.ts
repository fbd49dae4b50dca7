/**
 * Fenced code: monospaced on a light background, long lines wrapped (never clipped), and
 * split across pages, each piece with its own background. Tabs become four spaces.
 */
import {drawText, keepSpace, measureText, newPage, spaceLeft, type RenderContext, type TextStyle} from './context.js'
import {splitToHeight} from './split.js'

/** A code block up to this many lines moves to the next page whole rather than split. */
const SHORT_CODE_LINES = 24

/** The height that must stay on the page with the start of a code block (all of a short one). */
export function codeKeepHeight(ctx: RenderContext, value: string): number {
  const {theme} = ctx
  const pad = theme.spacing.codePadding
  const style: TextStyle = {font: 'mono', size: theme.fontSizes.code, color: theme.colours.text}
  const width = ctx.frame.width - 2 * pad
  const text = value.replace(/\t/g, '    ').replace(/\s+$/, '') || ' '
  const line = measureText(ctx, 'Ag', style, width)
  const h = measureText(ctx, text, style, width)
  return (h <= line * SHORT_CODE_LINES ? h : line * 3) + 2 * pad + theme.fontSizes.small + 1
}

export function drawCode(ctx: RenderContext, value: string, lang: string | null): void {
  const {doc, theme} = ctx
  const pad = theme.spacing.codePadding
  const style: TextStyle = {font: 'mono', size: theme.fontSizes.code, color: theme.colours.text}
  const width = ctx.frame.width - 2 * pad
  let rest = value.replace(/\t/g, '    ').replace(/\s+$/, '')
  if (rest === '') rest = ' '
  const line = measureText(ctx, 'Ag', style, width)
  // A block of up to SHORT_CODE_LINES lines is never split: it moves to the next page whole.
  keepSpace(ctx, codeKeepHeight(ctx, value))
  if (lang !== null && lang !== '') {
    const label: TextStyle = {font: 'regular', size: theme.fontSizes.small, color: theme.colours.muted}
    // Named as code, so a short info string ("c") does not read as a stray letter.
    drawText(ctx, `Code · ${lang}`, label, ctx.frame.x, doc.y, ctx.frame.width)
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
