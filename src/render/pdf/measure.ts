/**
 * Measuring blocks by drawing them: the children are rendered into a scratch pdfkit
 * document with one very tall page, using the same fonts, theme and frame width, and the
 * height they took is read back. Nothing in the real document changes (warnings, footnote
 * numbers, outline and figure counts are copies). Used where a box must be filled before
 * its content is drawn (callouts).
 */
import type {RootContent} from 'mdast'
import type {RenderContext} from './context.js'
import {registerFonts} from './fonts.js'
import {createGlyphChecker} from './glyphs.js'
import {createPdf} from './pdfkit.js'
import {silentWarnings} from './warnings.js'

const SCRATCH_HEIGHT = 100_000

export function measureBlocks(ctx: RenderContext, nodes: RootContent[], width: number): number {
  const epoch = new Date(0)
  const doc = createPdf({
    autoFirstPage: false,
    bufferPages: true,
    size: [ctx.doc.page.width, SCRATCH_HEIGHT],
    margins: {top: 0, bottom: 0, left: 0, right: 0},
    font: null,
    info: {Title: '', Author: '', Subject: '', CreationDate: epoch, ModDate: epoch, Producer: '', Creator: ''},
    pdfVersion: '1.7',
    displayTitle: false,
    lang: 'en',
  })
  registerFonts(doc, ctx.fonts)
  doc.addPage()
  doc.y = 0
  const warnings = silentWarnings()
  const scratch: RenderContext = {
    ...ctx,
    doc,
    warnings,
    glyphs: createGlyphChecker(ctx.fonts, warnings),
    footnotes: {definitions: ctx.footnotes.definitions, numbers: new Map(ctx.footnotes.numbers)},
    outline: null,
    frame: {x: ctx.frame.x, width},
  }
  scratch.blocks.render(scratch, nodes)
  return doc.y
}
