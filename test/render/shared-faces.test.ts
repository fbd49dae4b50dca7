/**
 * The parsed faces shared by the documents of a run (`RenderOptions.faces`): fontkit parses
 * each face once and shapes each distinct string once (`loadFonts` memoizes `layout`). The
 * bytes must be those of a render with faces of its own, whatever was drawn before with
 * the same faces; and a caller that scales a run in place (pdfkit does) must not change the
 * run the next caller gets.
 */
import {createHash} from 'node:crypto'
import {create} from 'fontkit'
import {describe, expect, it} from 'vitest'
import {parseFonts, renderPdf} from '../../src/render/pdf/index.js'
import {fontSet, standardTheme} from './helpers.js'
import {sampleReport, SYMBOLS} from './sample.js'
import {flowReport} from './flow-sample.js'

const DATE = new Date(Date.UTC(2026, 2, 14, 9, 30))
const sha = (b: Uint8Array): string => createHash('sha256').update(b).digest('hex')

interface Run {
  glyphs: {id: number}[]
  positions: {xAdvance: number; yAdvance: number; xOffset: number; yOffset: number}[]
}
type Layout = {layout: (text: string, features?: unknown) => Run}

describe('faces shared between documents', () => {
  it('give the same bytes as faces of its own, after other documents used them', async () => {
    const fonts = fontSet()
    const own = await renderPdf(sampleReport(), {theme: standardTheme(), fonts, images: new Map(), date: DATE})
    const faces = await parseFonts(fonts)
    await renderPdf(flowReport(), {theme: standardTheme(), fonts, faces, images: new Map(), date: DATE})
    const shared = await renderPdf(sampleReport(), {theme: standardTheme(), fonts, faces, images: new Map(), date: DATE})
    const again = await renderPdf(sampleReport(), {theme: standardTheme(), fonts, faces, images: new Map(), date: DATE})
    expect(sha(shared.pdf)).toBe(sha(own.pdf))
    expect(sha(again.pdf)).toBe(sha(own.pdf))
  })

  it('shape as fontkit does, and hand out runs whose positions a caller may scale', async () => {
    const fonts = fontSet()
    const faces = await parseFonts(fonts)
    const memo = faces.regular as unknown as Layout
    const plain = create(fonts.regular) as unknown as Layout
    const expected = plain.layout(SYMBOLS)
    const first = memo.layout(SYMBOLS)
    expect(first.glyphs.map((g) => g.id)).toEqual(expected.glyphs.map((g) => g.id))
    expect(first.positions.map((p) => ({...p}))).toEqual(expected.positions.map((p) => ({...p})))
    // pdfkit scales the positions of the run it gets in place.
    for (const p of first.positions) p.xAdvance *= 0.5
    const second = memo.layout(SYMBOLS)
    expect(second.positions.map((p) => p.xAdvance)).toEqual(expected.positions.map((p) => p.xAdvance))
    expect(second.positions[0]).not.toBe(first.positions[0])
  })
})
