/**
 * Raster images from the note (PNG or JPEG): bytes come from `RenderOptions.images` by the
 * node's `url`, never from disk. Scaled down to the frame width and the page height, kept
 * whole on a page. A missing or unreadable image prints a framed placeholder with its alt
 * text and raises a warning.
 */
import {drawText, keepSpace, measureText, pageBodyHeight, type RenderContext} from './context.js'
import {checkImage} from './image-check.js'
import type {PdfImage} from './pdfkit.js'

function placeholder(ctx: RenderContext, url: string, alt: string, why: string): void {
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
  doc.y = y + h + theme.spacing.paragraph
}

export function drawImage(ctx: RenderContext, url: string, alt: string): void {
  const {doc, theme} = ctx
  const bytes = ctx.images.get(url)
  if (bytes === undefined) return placeholder(ctx, url, alt, 'was not found')
  // The header is checked against the data first: pdfkit trusts it (image-check.ts).
  const check = checkImage(bytes)
  if (!check.ok) return placeholder(ctx, url, alt, `could not be used (${check.why})`)
  let image: PdfImage
  try {
    image = doc.openImage(bytes)
  } catch {
    return placeholder(ctx, url, alt, 'could not be read (PNG or JPEG expected)')
  }
  const scale = Math.min(1, ctx.frame.width / image.width, (pageBodyHeight(ctx) * 0.9) / image.height)
  const width = image.width * scale
  const height = image.height * scale
  keepSpace(ctx, height)
  const y = doc.y
  doc.image(image, ctx.frame.x + (ctx.frame.width - width) / 2, y, {width, height})
  doc.y = y + height + theme.spacing.paragraph
}
