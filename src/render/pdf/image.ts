/**
 * Raster images from the note (PNG or JPEG): bytes come from `RenderOptions.images` by the
 * node's `url`, never from disk. Scaled down to the frame width and the page height, kept
 * whole on a page. A missing or unreadable image prints a framed placeholder with its alt
 * text and raises a warning.
 */
import {applyStyle, drawText, keepSpace, keepTogether, measureText, pageBodyHeight, type RenderContext, type TextStyle} from './context.js'
import {FONT_NAMES} from './fonts.js'
import {noteImageCaption} from '../../report/types.js'
import {checkImage} from './image-check.js'
import type {PdfImage} from './pdfkit.js'

function placeholder(ctx: RenderContext, url: string, alt: string, why: string, caption: string | null): void {
  const {doc, theme} = ctx
  ctx.warnings.add(`Image \`${url}\` ${why}: a placeholder was printed`)
  const style = {font: 'italic' as const, size: theme.fontSizes.small, color: theme.colours.placeholder}
  const text = `Image not available: ${alt === '' ? '(no alt text)' : alt} — ${url}`
  const pad = 10
  const h = measureText(ctx, text, style, ctx.frame.width - 2 * pad) + 2 * pad
  keepSpace(ctx, h)
  const y = doc.y
  doc.save().lineWidth(0.8).rect(ctx.frame.x, y, ctx.frame.width, h).stroke(theme.colours.placeholder).restore()
  drawText(ctx, text, style, ctx.frame.x + pad, y + pad, ctx.frame.width - 2 * pad, {align: 'center'})
  doc.y = y + h
  // The figure number stays taken: the numbering of the figures after it does not move.
  if (caption !== null) drawText(ctx, caption, captionStyle(ctx), ctx.frame.x, doc.y + CAPTION_GAP, ctx.frame.width)
  doc.y += theme.spacing.paragraph
}

/**
 * A note's image; with a figure number (src/report numbers a paragraph's images with the
 * charts) it is captioned below, "Figure N — alt text", in the charts' caption style and
 * kept on one page with its caption.
 */
export function drawImage(ctx: RenderContext, url: string, alt: string, figure?: number): void {
  const {doc, theme} = ctx
  const caption = figure === undefined ? null : noteImageCaption(figure, alt)
  const bytes = ctx.images.get(url)
  if (bytes === undefined) return placeholder(ctx, url, alt, 'was not found', caption)
  // The header is checked against the data first: pdfkit trusts it (image-check.ts).
  const check = checkImage(bytes)
  if (!check.ok) return placeholder(ctx, url, alt, `could not be used (${check.why})`, caption)
  let image: PdfImage
  try {
    image = doc.openImage(bytes)
  } catch {
    return placeholder(ctx, url, alt, 'could not be read (PNG or JPEG expected)', caption)
  }
  const captionH = caption === null ? 0 : CAPTION_GAP + measureText(ctx, caption, captionStyle(ctx), ctx.frame.width)
  const scale = Math.min(1, ctx.frame.width / image.width, (pageBodyHeight(ctx) * 0.9 - captionH) / image.height)
  const width = image.width * scale
  const height = image.height * scale
  keepSpace(ctx, height + captionH)
  const y = doc.y
  doc.image(image, ctx.frame.x + (ctx.frame.width - width) / 2, y, {width, height})
  doc.y = y + height
  if (caption !== null) drawCaption(ctx, figure!, alt)
  else doc.y += theme.spacing.paragraph
}

const CAPTION_GAP = 6

function captionStyle(ctx: RenderContext): TextStyle {
  return {font: 'regular', size: ctx.theme.fontSizes.small, color: ctx.theme.colours.text}
}

/** "Figure N" in bold, then " — alt" (as the charts' captions are set, chart.ts). */
function drawCaption(ctx: RenderContext, figure: number, alt: string): void {
  const {doc, theme} = ctx
  doc.y += CAPTION_GAP
  const rest = alt.trim()
  applyStyle(ctx, captionStyle(ctx))
  doc.font(FONT_NAMES.bold).text(ctx.glyphs.clean(`Figure ${figure}`, 'bold'), ctx.frame.x, doc.y, {
    width: ctx.frame.width, lineGap: theme.lineGap, continued: rest !== '', link: null, underline: false, strike: false,
  })
  if (rest !== '') doc.font(FONT_NAMES.regular).text(ctx.glyphs.clean(keepTogether(` — ${rest}`), 'regular'), {continued: false})
  doc.y += theme.spacing.paragraph + 2
}
