/**
 * `renderPdf`: the report tree to PDF bytes, in five steps.
 *
 *   1. open the document (metadata in the constructor, so the file ID is stable) and
 *      register the DejaVu fonts from bytes;
 *   2. the cover and sign-off page(s);
 *   3. the body from a new page, then its footnotes under "Notes";
 *   4. the appendix from a new page;
 *   5. the cover's page references (now that every note has its page), header and footer on
 *      every buffered page; collect the bytes.
 *
 * No file I/O, no clock, no environment: fonts, images and the date arrive as values, so
 * the same input gives the same bytes.
 */
import type {ReportDocument} from '../../report/types.js'
import {drawHeading, renderBlocks} from './blocks.js'
import {compileFigures, type CompiledFigures} from '../chart/compile.js'
import {newPage, resolvePageRefs, type RenderContext} from './context.js'
import {drawCover} from './cover.js'
import {loadFonts, registerFonts, type FontSet, type LoadedFonts} from './fonts.js'
import {collectDefinitions, drawFootnotes} from './footnotes.js'
import {drawFurniture} from './furniture.js'
import {createGlyphChecker} from './glyphs.js'
import {collectPdf, createPdf, lastPageIndex, type PdfInfo} from './pdfkit.js'
import type {Theme} from './theme.js'
import {createWarnings} from './warnings.js'

export interface RenderOptions {
  theme: Theme
  fonts: FontSet
  /** Raster images by the URL the note uses (PNG or JPEG bytes). */
  images: ReadonlyMap<string, Uint8Array>
  /** Creation and modification date written into the PDF; also the cover date when the note has none. */
  date: Date
  /** The document's figures already compiled (src/render/chart); compiled here when absent. */
  figures?: CompiledFigures
  /**
   * `fonts` already parsed (`loadFonts`), to share between the documents of a run: each face
   * is parsed once and each distinct string shaped once. Parsed here when absent.
   */
  faces?: LoadedFonts
}

export interface RenderOutput {
  pdf: Uint8Array
  /** Things the reader should know about (missing glyphs or images, unknown nodes, SVG problems). */
  warnings: string[]
  pageCount: number
}

function infoOf(report: ReportDocument, date: Date): PdfInfo {
  const {meta} = report
  const subject = ['Design review', meta.document, meta.revision === null ? null : `rev ${meta.revision}`]
    .filter((s): s is string => s !== null).join(' ')
  const info: PdfInfo = {
    Title: meta.title ?? 'Untitled design note',
    Author: meta.author ?? '',
    Subject: subject,
    CreationDate: date,
    ModDate: date,
    Producer: 'ampreview',
    Creator: `ampreview ${report.toolVersion}`,
  }
  if (meta.project !== null) info.Keywords = meta.project
  return info
}

export async function renderPdf(report: ReportDocument, opts: RenderOptions): Promise<RenderOutput> {
  const {theme} = opts
  // 0. Charts: compiled from their specs, unless the caller did.
  const figures = opts.figures ?? await compileFigures(report, {regular: opts.fonts.regular, bold: opts.fonts.bold})
  // 1. Document and fonts.
  const fonts = opts.faces ?? await loadFonts(opts.fonts)
  const doc = createPdf({
    autoFirstPage: false,
    bufferPages: true,
    size: theme.page === 'letter' ? 'LETTER' : 'A4',
    margins: {...theme.margins},
    font: null,
    info: infoOf(report, opts.date),
    pdfVersion: '1.7',
    displayTitle: true,
    lang: 'en',
  })
  registerFonts(doc, fonts)
  const warnings = createWarnings()
  doc.addPage()
  const ctx: RenderContext = {
    doc,
    blocks: {render: renderBlocks, heading: drawHeading},
    figures: figures.byNode,
    theme,
    fonts,
    glyphs: createGlyphChecker(fonts, warnings),
    warnings,
    images: opts.images,
    footnotes: {definitions: new Map(), numbers: new Map()},
    definitions: new Map(),
    outline: {stack: []},
    frame: {x: theme.margins.left, width: doc.page.width - theme.margins.left - theme.margins.right},
    listDepth: 0,
    heights: new Map(),
    tight: false,
    anchors: new Map(),
    pageRefs: [],
  }
  doc.y = theme.margins.top
  // 2. Cover and sign-off.
  collectDefinitions(ctx, report.closing)
  drawCover(ctx, report, opts.date)
  const coverPages = lastPageIndex(doc) + 1
  // 3. Body and its notes.
  newPage(ctx)
  ctx.outline = {stack: []}
  collectDefinitions(ctx, report.body)
  renderBlocks(ctx, report.body.children)
  drawFootnotes(ctx)
  // 4. Appendix.
  if (report.appendix.children.length > 0) {
    newPage(ctx)
    ctx.outline = {stack: []}
    ctx.footnotes = {definitions: new Map(), numbers: new Map()}
    collectDefinitions(ctx, report.appendix)
    renderBlocks(ctx, report.appendix.children)
    drawFootnotes(ctx)
  }
  // 5. The cover's page references, furniture, then the bytes.
  resolvePageRefs(ctx)
  drawFurniture(ctx, report.meta, coverPages)
  const pageCount = doc.bufferedPageRange().count
  const pdf = await collectPdf(doc)
  // Chart warnings come first, where they stood when charts compiled in the report phase.
  return {pdf, warnings: [...(opts.figures ? [] : figures.warnings), ...warnings.list()], pageCount}
}
