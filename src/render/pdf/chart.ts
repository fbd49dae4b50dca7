/**
 * Figures: SVG charts drawn with svg-to-pdfkit, scaled down to the frame width (aspect
 * kept) and kept whole on one page, captioned "Figure N — caption" below. Every SVG font
 * family maps to our DejaVu faces (otherwise svg-to-pdfkit falls back to Helvetica, which
 * is not embedded and drops µ, Ω and −); SVG warnings become render warnings; only
 * `data:` images are allowed inside an SVG, so it can never read a file.
 */
import {applyStyle, bodyStyle, keepSpace, keepTogether, measureText, pageBodyHeight, type RenderContext, type TextStyle} from './context.js'
import {FONT_NAMES, svgFontName} from './fonts.js'
import {drawSvg} from './pdfkit.js'
import type {FigureNode} from '../../report/types.js'
import type {DrawnFigure} from '../chart/compile.js'

const CAPTION_GAP = 4

/** A data URL pdfkit opens as bytes; anything else is refused (an empty base64 payload). */
const REFUSED_IMAGE = 'data:application/octet-stream;base64,'

const ENTITIES: Record<string, string> = {amp: '&', lt: '<', gt: '>', quot: '"', apos: "'"}

/** The character data of an SVG (outside `<style>`), entities decoded, for the glyph check. */
function svgCharacters(svg: string): string {
  const body = svg.replace(/<style[\s\S]*?<\/style>/gi, '').replace(/<!\[CDATA\[[\s\S]*?\]\]>/g, '')
  const segments = [...body.matchAll(/>([^<]+)</g)].map((m) => m[1] ?? '')
  return segments.join(' ').replace(/&(#x[0-9a-f]+|#[0-9]+|[a-z]+);/gi, (whole, name: string) => {
    if (name.startsWith('#x') || name.startsWith('#X')) return String.fromCodePoint(parseInt(name.slice(2), 16))
    if (name.startsWith('#')) return String.fromCodePoint(parseInt(name.slice(1), 10))
    return ENTITIES[name] ?? whole
  })
}

function captionStyle(ctx: RenderContext): TextStyle {
  return {font: 'regular', size: ctx.theme.fontSizes.small, color: ctx.theme.colours.text}
}

function captionText(node: FigureNode): string {
  return node.caption.trim() === '' ? `Figure ${node.number}` : `Figure ${node.number} — ${node.caption}`
}

/** The figure as compiled before layout (src/render/chart/compile.ts). */
function drawn(ctx: RenderContext, node: FigureNode): DrawnFigure {
  const d = ctx.figures.get(node)
  if (d === undefined) throw new Error(`Figure ${node.number} was not compiled before rendering`)
  return d
}

function drawnSize(ctx: RenderContext, node: FigureNode): {width: number; height: number} {
  const d = drawn(ctx, node)
  const w = d.width > 0 ? d.width : ctx.frame.width
  const h = d.height > 0 ? d.height : w * 0.6
  const captionH = measureText(ctx, captionText(node), captionStyle(ctx), ctx.frame.width) + CAPTION_GAP
  const scale = Math.min(1, ctx.frame.width / w, (pageBodyHeight(ctx) - captionH - 2) / h)
  return {width: w * scale, height: h * scale}
}

/** Height the figure takes with its caption, pt. */
export function figureHeight(ctx: RenderContext, node: FigureNode): number {
  return drawnSize(ctx, node).height + CAPTION_GAP + measureText(ctx, captionText(node), captionStyle(ctx), ctx.frame.width)
}

export function drawFigure(ctx: RenderContext, node: FigureNode): void {
  const {doc, theme} = ctx
  const {width, height} = drawnSize(ctx, node)
  keepSpace(ctx, figureHeight(ctx, node))
  const x = ctx.frame.x + (ctx.frame.width - width) / 2
  const y = doc.y
  const {svg} = drawn(ctx, node)
  // Warn about characters the figure's text needs and DejaVu lacks (the SVG is drawn as is).
  ctx.glyphs.clean(svgCharacters(svg), 'regular')
  drawSvg(doc, svg, x, y, {
    width,
    height,
    preserveAspectRatio: 'xMidYMid meet',
    assumePt: true,
    fontCallback: svgFontName,
    imageCallback: (link) => {
      if (/^data:[^,]*;base64,/i.test(link.trim())) return link.replace(/\s+/g, '')
      ctx.warnings.add(`Figure ${node.number}: external image \`${link}\` in SVG refused (data: URLs only)`)
      return REFUSED_IMAGE
    },
    warningCallback: (warning) => ctx.warnings.add(`Figure ${node.number}: ${warning}`),
  })
  // svg-to-pdfkit leaves its last font, size and colours behind.
  applyStyle(ctx, bodyStyle(ctx))
  doc.strokeColor(theme.colours.text).lineWidth(1)
  doc.y = y + height + CAPTION_GAP
  const style = captionStyle(ctx)
  applyStyle(ctx, style)
  doc.font(FONT_NAMES.bold).text(ctx.glyphs.clean(`Figure ${node.number}`, 'bold'), ctx.frame.x, doc.y, {
    width: ctx.frame.width, lineGap: theme.lineGap, continued: node.caption.trim() !== '', link: null, underline: false, strike: false,
  })
  if (node.caption.trim() !== '') {
    doc.font(FONT_NAMES.regular).text(ctx.glyphs.clean(keepTogether(` — ${node.caption}`), 'regular'), {continued: false})
  }
  doc.y += theme.spacing.paragraph + 2
}
