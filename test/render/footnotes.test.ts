/**
 * Footnotes: numbered in order of first reference, printed under "Notes" at the end of the
 * body in that order, unreferenced definitions last.
 */
import {describe, expect, it} from 'vitest'
import {renderPdf} from '../../src/render/pdf/index.js'
import {fontSet, readPdf, report, standardTheme} from './helpers.js'

describe('renderPdf() footnotes', () => {
  it('numbers by first reference and prints the notes in that order', async () => {
    const body = [
      'First claim[^beta] and second claim[^alpha], then beta again[^beta].',
      '[^alpha]: Alpha note text.',
      '[^beta]: Beta note text.',
      '[^gamma]: Gamma note never referenced.',
    ].join('\n\n')
    const out = await renderPdf(report({body}), {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(0)})
    const text = (await readPdf(out.pdf)).pages.slice(1).join(' ')
    expect(text).toMatch(/First claim ?1 and second claim ?2, then beta again ?1\./)
    expect(text).toMatch(/Notes 1\. Beta note text\. 2\. Alpha note text\. 3\. Gamma note never referenced\./)
  })
})
