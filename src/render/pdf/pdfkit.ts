/**
 * A small typed face of pdfkit 0.20 and svg-to-pdfkit 0.1.8: only the calls `src/render`
 * makes. `@types/pdfkit` lags the library (and `@types/svg-to-pdfkit` types the document as
 * its constructor), so the rest of the renderer talks to these interfaces instead.
 * Creating a document and collecting its bytes also live here.
 */
import PDFDocument from 'pdfkit'
import SVGtoPDF from 'svg-to-pdfkit'

export type PageSize = 'A4' | 'LETTER' | [number, number]

export interface Margins {
  top: number
  bottom: number
  left: number
  right: number
}

export interface PdfInfo {
  Title: string
  Author: string
  Subject: string
  Keywords?: string
  CreationDate: Date
  ModDate: Date
  Producer: string
  Creator: string
}

export interface PdfOptions {
  autoFirstPage: false
  bufferPages: true
  size: PageSize
  margins: Margins
  /** `null`: load no default font (pdfkit would otherwise load Helvetica). */
  font: null
  info: PdfInfo
  pdfVersion: '1.7'
  displayTitle: boolean
  lang: string
}

export interface TextOptions {
  width?: number
  height?: number
  align?: 'left' | 'center' | 'right' | 'justify'
  lineGap?: number
  lineBreak?: boolean
  continued?: boolean
  link?: string | null
  underline?: boolean
  strike?: boolean
  baseline?: 'alphabetic' | 'top' | 'middle' | 'bottom'
}

export interface OutlineItem {
  addItem(title: string): OutlineItem
}

export interface PdfPage {
  width: number
  height: number
  margins: Margins
}

/** An opened image (PNG or JPEG): natural size in pixels. */
export interface PdfImage {
  width: number
  height: number
}

/** A font pdfkit can embed: raw bytes or a fontkit font object. */
export type FontSource = Uint8Array | object

export interface PdfDoc {
  x: number
  y: number
  readonly page: PdfPage
  readonly outline: OutlineItem
  registerFont(name: string, src: FontSource): this
  font(name: string, size?: number): this
  fontSize(size: number): this
  fillColor(color: string, opacity?: number): this
  strokeColor(color: string, opacity?: number): this
  lineWidth(width: number): this
  lineCap(cap: 'butt' | 'round' | 'square'): this
  lineJoin(join: 'miter' | 'round' | 'bevel'): this
  text(text: string, x: number, y: number, options?: TextOptions): this
  text(text: string, options?: TextOptions): this
  widthOfString(text: string, options?: TextOptions): number
  heightOfString(text: string, options?: TextOptions): number
  currentLineHeight(includeGap?: boolean): number
  addPage(): this
  switchToPage(index: number): PdfPage
  bufferedPageRange(): {start: number; count: number}
  save(): this
  restore(): this
  moveTo(x: number, y: number): this
  lineTo(x: number, y: number): this
  closePath(): this
  rect(x: number, y: number, w: number, h: number): this
  circle(x: number, y: number, r: number): this
  polygon(...points: [number, number][]): this
  fill(color?: string): this
  stroke(color?: string): this
  fillAndStroke(fill?: string, stroke?: string): this
  openImage(src: Uint8Array | string): PdfImage
  image(src: Uint8Array | PdfImage, x: number, y: number, options: {width: number; height: number}): this
  on(event: 'data', listener: (chunk: Uint8Array) => void): this
  on(event: 'end', listener: () => void): this
  on(event: 'error', listener: (error: Error) => void): this
  end(): void
}

/** Lowest y text may reach on the current page. */
export function maxY(doc: PdfDoc): number {
  return doc.page.height - doc.page.margins.bottom
}

/** Index of the last buffered page, where drawing happens. */
export function lastPageIndex(doc: PdfDoc): number {
  const range = doc.bufferedPageRange()
  return range.start + range.count - 1
}

type PdfConstructor = new (options: PdfOptions) => PdfDoc

export function createPdf(options: PdfOptions): PdfDoc {
  const Ctor = PDFDocument as unknown as PdfConstructor
  return new Ctor(options)
}

/** The no-break hyphen the renderer draws inside identifiers and "p-p" (context.ts `keepTogether`). */
export const NO_BREAK_HYPHEN = '\u2011'

/**
 * A reader who copies `phase-margin-low` or `cm-headroom-neg` from the PDF must get the
 * hyphen-minus a note is written with, not the no-break hyphen drawn to keep the word on one
 * line: the text map (ToUnicode) of every embedded font maps that glyph back to U+002D. The
 * map is pdfkit's per-font `unicode` table (glyph → code points, filled as text is encoded
 * and written when the document ends), the one place pdfkit lets the two differ.
 */
function copyNoBreakHyphensAsHyphens(doc: PdfDoc): void {
  const families = (doc as unknown as {_fontFamilies?: Record<string, {unicode?: number[][]}>})._fontFamilies ?? {}
  for (const font of Object.values(families)) {
    const map = font.unicode
    if (!Array.isArray(map)) continue
    for (let gid = 0; gid < map.length; gid++) {
      const points = map[gid]
      if (Array.isArray(points) && points.includes(0x2011)) map[gid] = points.map((c) => (c === 0x2011 ? 0x2d : c))
    }
  }
}

/** Ends the document and resolves with its bytes once the stream has finished. */
export function collectPdf(doc: PdfDoc): Promise<Uint8Array> {
  copyNoBreakHyphensAsHyphens(doc)
  return new Promise((resolve, reject) => {
    const chunks: Uint8Array[] = []
    doc.on('data', (chunk) => chunks.push(chunk))
    doc.on('error', reject)
    doc.on('end', () => {
      const length = chunks.reduce((n, c) => n + c.length, 0)
      const out = new Uint8Array(length)
      let offset = 0
      for (const c of chunks) {
        out.set(c, offset)
        offset += c.length
      }
      resolve(out)
    })
    doc.end()
  })
}

export interface SvgOptions {
  width: number
  height: number
  preserveAspectRatio: string
  assumePt: boolean
  fontCallback: (family: string, bold: boolean, italic: boolean) => string
  imageCallback: (link: string) => string
  warningCallback: (warning: string) => void
}

type SvgDraw = (doc: PdfDoc, svg: string, x: number, y: number, options: SvgOptions) => void

/** Draws SVG text onto the document with svg-to-pdfkit. */
export function drawSvg(doc: PdfDoc, svg: string, x: number, y: number, options: SvgOptions): void {
  const draw = SVGtoPDF as unknown as SvgDraw
  draw(doc, svg, x, y, options)
}
