/**
 * Page furniture, drawn last on every buffered page: a header (document number · revision
 * at left, title at right, a rule) and a footer (revision and status at left, "page N of M"
 * at right). The cover gets only the rule and the footer. The bottom margin is zeroed while
 * drawing and text is placed with `lineBreak: false`, so no blank page can appear.
 */
import type {DocumentMeta} from '../../note/types.js'
import {applyStyle, type RenderContext, type TextStyle} from './context.js'
import type {FontKey} from './fonts.js'

export const STATUS_WORDS: Record<DocumentMeta['status'], string> = {
  draft: 'Draft',
  'for-review': 'For review',
  approved: 'Approved',
}

/** Cuts `text` with an ellipsis so it is at most `width` wide in the current font. */
function fitWidth(ctx: RenderContext, text: string, width: number): string {
  if (ctx.doc.widthOfString(text) <= width) return text
  let cut = text
  while (cut.length > 1 && ctx.doc.widthOfString(`${cut}…`) > width) cut = cut.slice(0, -1)
  return `${cut.trimEnd()}…`
}

function place(ctx: RenderContext, text: string, font: FontKey, x: number, y: number, align: 'left' | 'right', maxWidth: number): void {
  const style: TextStyle = {font, size: ctx.theme.fontSizes.small, color: ctx.theme.colours.muted}
  applyStyle(ctx, style)
  const shown = fitWidth(ctx, ctx.glyphs.clean(text, font), maxWidth)
  const left = align === 'left' ? x : x - ctx.doc.widthOfString(shown)
  ctx.doc.text(shown, left, y, {lineBreak: false})
}

export function drawFurniture(ctx: RenderContext, meta: DocumentMeta, coverPages: number): void {
  const {doc, theme} = ctx
  const range = doc.bufferedPageRange()
  const total = range.count
  const docId = [meta.document ?? 'Unnumbered', meta.revision === null ? null : `Rev ${meta.revision}`].filter((s) => s !== null).join(' · ')
  const status = STATUS_WORDS[meta.status]
  for (let i = 0; i < total; i++) {
    const page = doc.switchToPage(range.start + i)
    const margins = page.margins
    const savedBottom = margins.bottom
    margins.bottom = 0
    const left = margins.left
    const right = page.width - margins.right
    const width = right - left
    const gap = theme.spacing.furnitureGap
    const ruleY = margins.top - gap
    const size = theme.fontSizes.small
    if (i >= coverPages) {
      place(ctx, docId, 'bold', left, ruleY - size * 1.5, 'left', width * 0.45)
      place(ctx, meta.title ?? '', 'regular', right, ruleY - size * 1.5, 'right', width * 0.52)
    }
    doc.save().lineWidth(0.6).moveTo(left, ruleY).lineTo(right, ruleY).stroke(theme.colours.rule).restore()
    const footY = page.height - savedBottom + gap
    doc.save().lineWidth(0.4).moveTo(left, footY - 4).lineTo(right, footY - 4).stroke(theme.colours.rule).restore()
    const footLeft = [meta.revision === null ? null : `Rev ${meta.revision}`, status].filter((s) => s !== null).join(' · ')
    place(ctx, footLeft, 'regular', left, footY, 'left', width * 0.6)
    place(ctx, `page ${i + 1} of ${total}`, 'regular', right, footY, 'right', width * 0.35)
    margins.bottom = savedBottom
  }
}
