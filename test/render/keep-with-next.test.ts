/**
 * Keep-with-next in the PDF, read back with pdfjs: a table's totals never start a page
 * alone, a short code block is never split and its introducing paragraph stays with it.
 * Each case pushes the element to the foot of a page with filler paragraphs of a growing
 * count, so some count puts the break exactly where a split would happen.
 */
import {describe, expect, it} from 'vitest'
import {renderPdf} from '../../src/render/pdf/index.js'
import {fontSet, readPdf, report, standardTheme} from './helpers.js'

const filler = (n: number): string => Array.from({length: n}, (_, i) => `Filler paragraph f${i} that takes one line of the page.`).join('\n\n')

async function pagesOf(body: string): Promise<string[]> {
  const out = await renderPdf(report({body}), {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(0)})
  return (await readPdf(out.pdf)).pages.slice(1)
}

const pageOf = (pages: string[], s: string): number => pages.findIndex((p) => p.includes(s))

describe('keep-with-next', () => {
  const table = ['| Contributor | Output |', '|---|--:|', ...Array.from({length: 8}, (_, i) => `| row r${i} | ${i} µV |`),
    '| **Total, rms** | 9 µV |', '| **Total, peak-to-peak** | 59 µV |'].join('\n')
  const code = ['The firmware applies this calibration (introduction i0):', '', '```c',
    ...Array.from({length: 10}, (_, i) => `line_c${i} = step(${i});`), '```'].join('\n')

  it('moves a table’s totals with the row before them, never alone at the top of a page', async () => {
    let sawBreakInTable = false
    for (let n = 44; n <= 62; n += 1) {
      const pages = await pagesOf(`${filler(n)}\n\n${table}\n`)
      const first = pageOf(pages, 'row r0 ')
      const total = pageOf(pages, 'Total, rms')
      expect(pageOf(pages, 'Total, peak-to-peak')).toBe(total)
      expect(pages[total]).toContain('row r7')
      if (total !== first) sawBreakInTable = true
    }
    // The sweep did put a page break inside the table at least once.
    expect(sawBreakInTable).toBe(true)
  }, 60_000)

  it('keeps a short code block whole and with its introduction', async () => {
    let moved = false
    for (let n = 34; n <= 52; n += 2) {
      const pages = await pagesOf(`${filler(n)}\n\n${code}\n`)
      const intro = pageOf(pages, 'introduction i0')
      expect(pageOf(pages, 'line_c0')).toBe(intro)
      expect(pageOf(pages, 'line_c9')).toBe(intro)
      if (intro > 0) moved = true
    }
    expect(moved).toBe(true)
  }, 60_000)
})
