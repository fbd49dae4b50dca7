/**
 * Chart fonts: the family name every chart spec uses, and text measurement with the real
 * DejaVu advance widths so that vega's layout is exact and the same on every machine.
 *
 * Sits under `src/report/vega.ts`, which installs `measureText` as vega's text metric.
 * The font bytes come from the caller (no file I/O here); `src/render` registers the same
 * bytes with pdfkit under the names its font callback maps `CHART_FONT_FAMILY` to.
 */
import {create, type Font} from 'fontkit'

/** The font family named in every chart's config, hence in every SVG `font-family`. */
export const CHART_FONT_FAMILY = 'DejaVu Sans'

/** Font bytes for chart text: the regular and the bold face of `CHART_FONT_FAMILY`. */
export interface ChartFonts {
  /** DejaVuSans.ttf. */
  regular: Uint8Array
  /** DejaVuSans-Bold.ttf. */
  bold: Uint8Array
}

/** The two faces charts use. */
export type ChartFace = keyof ChartFonts

/** Advance widths of one face, per em, cached per code point. */
interface FaceMetrics {
  font: Font
  /** Code point → advance width in em. */
  advances: Map<number, number>
}

/** One parse per font byte array (the caller passes the same arrays for every chart). */
const metricsCache = new WeakMap<Uint8Array, FaceMetrics>()

function faceMetrics(bytes: Uint8Array): FaceMetrics {
  let metrics = metricsCache.get(bytes)
  if (metrics === undefined) {
    metrics = {font: create(bytes), advances: new Map()}
    metricsCache.set(bytes, metrics)
  }
  return metrics
}

/** Advance width of one code point, em (the `.notdef` advance when the glyph is missing). */
function advance(metrics: FaceMetrics, codePoint: number): number {
  let em = metrics.advances.get(codePoint)
  if (em === undefined) {
    em = metrics.font.glyphForCodePoint(codePoint).advanceWidth / metrics.font.unitsPerEm
    metrics.advances.set(codePoint, em)
  }
  return em
}

/**
 * Which face a CSS/vega font weight selects: `bold`, `bolder` and numeric weights of 600
 * and above are bold; anything else (absent, `normal`, `lighter`, 100–500) is regular.
 */
export function faceOfWeight(weight: unknown): ChartFace {
  if (weight === 'bold' || weight === 'bolder') return 'bold'
  const numeric = typeof weight === 'number' ? weight : typeof weight === 'string' ? Number(weight) : NaN
  return Number.isFinite(numeric) && numeric >= 600 ? 'bold' : 'regular'
}

/**
 * Width of `text` set in `face` at `size` px: the sum of the glyph advances, px.
 * Kerning is not applied (neither vega's SVG nor svg-to-pdfkit kerns).
 */
export function measureText(fonts: ChartFonts, face: ChartFace, size: number, text: string): number {
  if (!(size > 0) || text.length === 0) return 0
  const metrics = faceMetrics(fonts[face])
  let em = 0
  for (const char of text) em += advance(metrics, char.codePointAt(0) ?? 0)
  return em * size
}

/** True when every character of `text` has a glyph in `face` (for reporting missing glyphs). */
export function hasGlyphs(fonts: ChartFonts, face: ChartFace, text: string): boolean {
  const {font} = faceMetrics(fonts[face])
  for (const char of text) if (!font.hasGlyphForCodePoint(char.codePointAt(0) ?? 0)) return false
  return true
}
