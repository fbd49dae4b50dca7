/**
 * The state one render carries: the pdfkit document, theme, fonts, warnings, footnote and
 * outline bookkeeping, and the frame (left edge and width) blocks draw into. Also the few
 * helpers every block uses: setting a text style, keeping space, starting a new page.
 */
import type {Definition, FootnoteDefinition, Heading, RootContent} from 'mdast'
import type {DrawnFigure} from '../chart/compile.js'
import type {FigureNode} from '../../report/types.js'
import {FONT_NAMES, type FontKey, type LoadedFonts} from './fonts.js'
import type {GlyphChecker} from './glyphs.js'
import {breakLongWords} from './long-words.js'
import {maxY, NO_BREAK_HYPHEN, type OutlineItem, type PdfDoc, type TextOptions} from './pdfkit.js'
import type {Theme} from './theme.js'
import type {Warnings} from './warnings.js'

export interface Frame {
  x: number
  width: number
}

export interface FootnoteState {
  definitions: Map<string, FootnoteDefinition>
  /** Identifier → number, assigned at first reference. */
  numbers: Map<string, number>
}

export interface OutlineState {
  /** Open outline items by heading depth. */
  stack: {depth: number; item: OutlineItem}[]
}

/**
 * The block dispatcher (./blocks.ts), handed down in the context so that the blocks that
 * contain blocks (callouts, lists, footnotes, the cover's closing text, measuring) need not
 * import it: no import loop inside src/render.
 */
export interface BlockDispatcher {
  render(ctx: RenderContext, nodes: RootContent[]): void
  heading(ctx: RenderContext, node: Heading, rest: RootContent[]): void
}

export interface RenderContext {
  doc: PdfDoc
  blocks: BlockDispatcher
  /** Every figure of the document, compiled (src/render/chart/compile.ts). */
  figures: ReadonlyMap<FigureNode, DrawnFigure>
  theme: Theme
  fonts: LoadedFonts
  glyphs: GlyphChecker
  warnings: Warnings
  images: ReadonlyMap<string, Uint8Array>
  footnotes: FootnoteState
  /** Link reference definitions of the tree being drawn, by normalised identifier. */
  definitions: Map<string, Definition>
  outline: OutlineState | null
  frame: Frame
  /** Nesting depth of the list being drawn (0 outside lists). */
  listDepth: number
  /** Inside a tight list: paragraphs take no paragraph gap. */
  tight: boolean
  /** Anchor → 1-based page where the anchored node was drawn. */
  anchors: Map<string, number>
  /** Page numbers to write once every anchor is placed (the cover's list of notes). */
  pageRefs: PageRef[]
  /** Heights measured in this document (`measureText`, `estimateText`), by style, options and text. */
  heights: Map<string, number>
}

/** A page number to write later, right-aligned at `right`, on 0-based page `page`. */
export interface PageRef {
  anchor: string
  page: number
  right: number
  y: number
  style: TextStyle
}

/** Write every pending page reference (call after the body and appendix are drawn). */
export function resolvePageRefs(ctx: RenderContext): void {
  for (const ref of ctx.pageRefs) {
    const page = ctx.anchors.get(ref.anchor)
    const text = page === undefined ? '—' : `page ${page}`
    ctx.doc.switchToPage(ref.page)
    applyStyle(ctx, ref.style)
    const w = ctx.doc.widthOfString(text)
    ctx.doc.text(text, ref.right - w, ref.y, {lineBreak: false})
  }
}

export interface TextStyle {
  font: FontKey
  size: number
  color: string
}

/** Sets font, size and colour on the document. */
export function applyStyle(ctx: RenderContext, style: TextStyle): void {
  ctx.doc.font(FONT_NAMES[style.font]).fontSize(style.size).fillColor(style.color)
}

export function bodyStyle(ctx: RenderContext): TextStyle {
  return {font: 'regular', size: ctx.theme.fontSizes.body, color: ctx.theme.colours.text}
}

/**
 * Text as pdfkit gets it, in the style already applied: glyphs checked, and words wider
 * than the line cut into line-wide pieces (long-words.ts: pdfkit's own cutting is quadratic).
 */
export function layoutText(ctx: RenderContext, text: string, font: FontKey, size: number, width: number, report = true): string {
  return breakLongWords(ctx.glyphs.clean(keepTogether(text), font, report), width, size, (ch) => ctx.doc.widthOfString(ch))
}

/** A unit symbol (with its prefix) that follows a number, for `keepTogether`. */
const UNIT_AFTER_NUMBER = /(\d) (?=(?:[fpnuµμmkMGT]?(?:V|A|Hz|F|Ω|°C|°|K|dB|%|ppm|s|×)|LSB|bits?)(?![A-Za-z]))/g

/**
 * No line break between a number and its unit ("12.4 mV" stays on one line): the space
 * becomes a no-break space (U+00A0, which DejaVu Sans, Bold and Mono all carry; checked in
 * test/render/keep-together.test.ts with fontkit). A reader copying the text gets a space.
 */
export function keepTogether(text: string): string {
  return text.replace(UNIT_AFTER_NUMBER, '$1\u00A0').replace(INNER_HYPHEN, NO_BREAK_HYPHEN).replace(VERDICT_MARK, '$1\u00A0')
}

/** A verdict's mark and word stay on one line ("✓ met", "✗ NOT MET", "– skipped"). */
const VERDICT_MARK = /([✓✗]|–(?= (?:skipped|not evaluated))|NOT(?= MET)) /g

/**
 * A hyphen with a letter or digit on each side: inside a rule id (`phase-margin-low`), a key
 * (`cm-headroom-neg`, `require.output-error`), "p-p", a date or a document number. It is
 * drawn as the no-break hyphen U+2011 (every DejaVu face used carries it; a reader copying
 * the text gets U+002D, pdfkit.ts), so that none of them is split at a line end. Ordinary
 * hyphenated words stay whole too; a word wider than its line is still cut (long-words.ts).
 */
const INNER_HYPHEN = /(?<=[\p{L}\p{N}])-(?=[\p{L}\p{N}])/gu

/** The part of pdfkit's document state that a text run left open (`continued: true`) keeps. */
interface OpenRun {
  _wrapper?: unknown
  _textOptions?: unknown
}

/**
 * pdfkit's `heightOfString` of text already laid out, in the style already applied,
 * memoized in the document's `heights`: tables, keep-together and page fitting measure the
 * same cells and paragraphs many times (9,523 measurements of 3,233 distinct strings for
 * the five samples). The height depends only on the font, size, text and options (a
 * measurement is never cut by the page: pdfkit measures with an infinite height, and
 * restores x and y), except while a `continued` run is open, when pdfkit would go on with
 * that run's line wrapper and options: then it is measured, not memoized.
 */
function heightOf(ctx: RenderContext, style: TextStyle, text: string, options: TextOptions): number {
  const open = ctx.doc as unknown as OpenRun
  if (open._wrapper != null || open._textOptions != null) return ctx.doc.heightOfString(text, options)
  const key = `${style.font}\u0000${style.size}\u0000${JSON.stringify(options)}\u0000${text}`
  let height = ctx.heights.get(key)
  if (height === undefined) {
    height = ctx.doc.heightOfString(text, options)
    ctx.heights.set(key, height)
  }
  return height
}

/** Height of a one-style string `width` wide, measured as drawn. */
export function measureText(ctx: RenderContext, text: string, style: TextStyle, width: number, options: TextOptions = {}): number {
  applyStyle(ctx, style)
  return heightOf(ctx, style, layoutText(ctx, text, style.font, style.size, width), {width, lineGap: ctx.theme.lineGap, ...options})
}

/** Like `measureText`, for an estimate in a style the text is not drawn in: no glyph warnings. */
export function estimateText(ctx: RenderContext, text: string, style: TextStyle, width: number): number {
  applyStyle(ctx, style)
  return heightOf(ctx, style, layoutText(ctx, text, style.font, style.size, width, false), {width, lineGap: ctx.theme.lineGap})
}

/** Draws a one-style string at (x, y) wrapped to `width`; leaves `doc.y` below it. */
export function drawText(ctx: RenderContext, text: string, style: TextStyle, x: number, y: number, width: number, options: TextOptions = {}): void {
  applyStyle(ctx, style)
  ctx.doc.text(layoutText(ctx, text, style.font, style.size, width), x, y, {width, lineGap: ctx.theme.lineGap, ...options})
}

/** Space left on the current page below `doc.y`, pt. */
export function spaceLeft(ctx: RenderContext): number {
  return maxY(ctx.doc) - ctx.doc.y
}

/** Height available on an empty page. */
export function pageBodyHeight(ctx: RenderContext): number {
  const {page} = ctx.doc
  return page.height - page.margins.top - page.margins.bottom
}

export function atPageTop(ctx: RenderContext): boolean {
  return ctx.doc.y <= ctx.doc.page.margins.top + 0.5
}

export function newPage(ctx: RenderContext): void {
  ctx.doc.addPage()
  ctx.doc.y = ctx.doc.page.margins.top
  ctx.doc.x = ctx.frame.x
}

/** Starts a new page unless `height` fits below `doc.y` (or we are already at a page top). */
export function keepSpace(ctx: RenderContext, height: number): void {
  if (height > spaceLeft(ctx) && !atPageTop(ctx)) newPage(ctx)
}

/** Runs `fn` with the frame narrowed by `indent` on the left (and `right` on the right). */
export function indented<T>(ctx: RenderContext, indent: number, fn: () => T, right = 0): T {
  const saved = ctx.frame
  ctx.frame = {x: saved.x + indent, width: saved.width - indent - right}
  try {
    return fn()
  } finally {
    ctx.frame = saved
  }
}
