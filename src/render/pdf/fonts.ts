/**
 * Fonts: the six DejaVu faces arrive as bytes (`FontSet`), are parsed with fontkit (once per
 * render, or once per run when the caller passes them parsed) and registered under our own
 * names. The standard 14 PDF fonts are never used:
 * they are not embedded and cover WinAnsi only.
 */
import type {PdfDoc} from './pdfkit.js'

/** DejaVu Sans, Sans-Bold, Sans-Oblique, Sans-BoldOblique, Sans Mono, Sans Mono Bold (TTF bytes). */
export interface FontSet {
  regular: Uint8Array
  bold: Uint8Array
  italic: Uint8Array
  boldItalic: Uint8Array
  mono: Uint8Array
  monoBold: Uint8Array
}

export type FontKey = keyof FontSet

/** Names the fonts are registered under in the PDF document. */
export const FONT_NAMES: Record<FontKey, string> = {
  regular: 'DejaVuSans',
  bold: 'DejaVuSans-Bold',
  italic: 'DejaVuSans-Oblique',
  boldItalic: 'DejaVuSans-BoldOblique',
  mono: 'DejaVuSansMono',
  monoBold: 'DejaVuSansMono-Bold',
}

/** Names used in warnings. */
export const FONT_LABELS: Record<FontKey, string> = {
  regular: 'DejaVu Sans',
  bold: 'DejaVu Sans Bold',
  italic: 'DejaVu Sans Oblique',
  boldItalic: 'DejaVu Sans Bold Oblique',
  mono: 'DejaVu Sans Mono',
  monoBold: 'DejaVu Sans Mono Bold',
}

const FONT_KEYS = Object.keys(FONT_NAMES) as FontKey[]

/** The part of a fontkit font we use. */
export interface GlyphFont {
  hasGlyphForCodePoint(codePoint: number): boolean
}

export type LoadedFonts = Record<FontKey, GlyphFont>

interface Fontkit {
  create(bytes: Uint8Array): unknown
}

function isGlyphFont(value: unknown): value is GlyphFont {
  return typeof value === 'object' && value !== null &&
    typeof (value as {hasGlyphForCodePoint?: unknown}).hasGlyphForCodePoint === 'function'
}

/** The part of a fontkit glyph run pdfkit reads (and scales in place, see `memoizeLayout`). */
interface GlyphRun {
  glyphs: unknown[]
  positions: object[]
}

interface LayoutFont {
  layout(text: string, features?: unknown, ...rest: unknown[]): GlyphRun
}

const hasLayout = (font: GlyphFont): font is GlyphFont & LayoutFont =>
  typeof (font as Partial<LayoutFont>).layout === 'function'

/** A copy of a glyph run that shares its glyphs but not its positions. */
function copyRun(run: GlyphRun): GlyphRun {
  const copy = Object.assign(Object.create(Object.getPrototypeOf(run) as object) as GlyphRun, run)
  copy.glyphs = run.glyphs.slice()
  copy.positions = run.positions.map((p) => Object.assign(Object.create(Object.getPrototypeOf(p) as object) as object, p))
  return copy
}

/**
 * The font with its shaping memoized: `layout(text, features)` (what pdfkit calls for every
 * word it measures or draws) shapes each distinct string once and hands out copies, since
 * pdfkit scales the positions of the run it gets in place. Shaping is a pure function of the
 * font and its arguments, so the memo changes the time only, never a glyph or a position.
 * The memo lives as long as the font object: one render, or a run when the caller passes
 * the parsed faces to several renders (`RenderOptions.faces`).
 */
function memoizeLayout(font: GlyphFont & LayoutFont): GlyphFont {
  const memo = new Map<string, GlyphRun>()
  const layout = (text: string, features?: unknown, ...rest: unknown[]): GlyphRun => {
    // Script, language or direction given: not what pdfkit asks for; shaped as asked, not kept.
    if (rest.length > 0) return font.layout(text, features, ...rest)
    const key = features === undefined ? `\u0000${text}` : `${JSON.stringify(features)}\u0000${text}`
    let run = memo.get(key)
    if (run === undefined) {
      run = font.layout(text, features)
      memo.set(key, run)
    }
    return copyRun(run)
  }
  return new Proxy(font, {get: (target, property) => (property === 'layout' ? layout : Reflect.get(target, property, target) as unknown)})
}

/**
 * Parses the six faces with fontkit (the same module instance pdfkit uses), each with its
 * shaping memoized (`memoizeLayout`).
 */
export async function loadFonts(fonts: FontSet): Promise<LoadedFonts> {
  // fontkit ships no type declarations; a non-literal specifier keeps the import untyped
  // here, and the shape is checked below.
  const specifier: string = 'fontkit'
  const mod = (await import(specifier)) as Partial<Fontkit>
  const create = mod.create
  if (typeof create !== 'function') throw new Error('fontkit: `create` not found')
  const out = {} as LoadedFonts
  for (const key of FONT_KEYS) {
    const font = create(fonts[key])
    if (!isGlyphFont(font) || !hasLayout(font)) throw new Error(`Font \`${key}\` could not be read as TrueType`)
    out[key] = memoizeLayout(font)
  }
  return out
}

export function registerFonts(doc: PdfDoc, fonts: LoadedFonts): void {
  for (const key of FONT_KEYS) doc.registerFont(FONT_NAMES[key], fonts[key])
}

/** Maps any SVG font family to one of ours (svg-to-pdfkit `fontCallback`). */
export function svgFontName(family: string, bold: boolean, italic: boolean): string {
  if (/mono|courier|consol|menlo/i.test(family)) return FONT_NAMES[bold ? 'monoBold' : 'mono']
  if (bold && italic) return FONT_NAMES.boldItalic
  if (bold) return FONT_NAMES.bold
  if (italic) return FONT_NAMES.italic
  return FONT_NAMES.regular
}
