/**
 * `renderPdf()` on the sample report, read back with pdfjs: text, tables, symbols,
 * furniture, outline, figure text, callouts, links and the cover.
 */
import {beforeAll, describe, expect, it} from 'vitest'
import {renderPdf, type RenderOutput} from '../../src/render/pdf/index.js'
import {fontSet, nfkc, readPdf, standardTheme, type ReadBack} from './helpers.js'
import {SYMBOLS, sampleReport} from './sample.js'

const DATE = new Date(Date.UTC(2026, 2, 14))

describe('renderPdf() on the sample report', () => {
  let out: RenderOutput
  let pdf: ReadBack
  const all = (): string => pdf.pages.join(' ')
  const pagesWith = (s: string): number[] =>
    pdf.pages.flatMap((text, i) => (text.includes(nfkc(s)) ? [i + 1] : []))

  beforeAll(async () => {
    out = await renderPdf(sampleReport(), {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: DATE})
    pdf = await readPdf(out.pdf)
  })

  it('reports the page count pdfjs finds', () => {
    expect(out.pageCount).toBe(pdf.numPages)
    expect(out.pageCount).toBeGreaterThanOrEqual(4)
  })

  it('prints "page N of M" on every page', () => {
    pdf.pages.forEach((text, i) => expect(text).toContain(`page ${i + 1} of ${pdf.numPages}`))
  })

  it('prints document number and revision in the header of every body page', () => {
    pdf.pages.slice(1).forEach((text) => expect(text).toContain('DR-0042 · Rev B'))
  })

  it.each([
    'Front end of the invented bridge amplifier', 'Noise and drift', 'Resistor table', 'Closing remarks',
    'After the break', 'Appendix A — Method',
  ])('prints the heading "%s"', (heading) => {
    expect(all()).toContain(heading)
  })

  it('prints the Unicode symbols (compared after NFKC)', () => {
    for (const symbol of SYMBOLS.split(', ')) expect(all()).toContain(nfkc(symbol))
  })

  it('prints every one of the 60 table rows', () => {
    for (let n = 1; n <= 60; n++) expect(all()).toMatch(new RegExp(`\\bR${n}\\b`))
  })

  it('repeats the table header on each page the table continues on', () => {
    const rowPages = [...new Set([1, 20, 40, 60].map((n) => pdf.pages.findIndex((t) => new RegExp(`\\bR${n} `).test(t)) + 1))]
    expect(rowPages.length).toBeGreaterThanOrEqual(2)
    for (const p of rowPages) expect(pdf.pages[p - 1]).toMatch(/Designator Value Note/)
  })

  it('draws the SVG figure text with embedded fonts ("Gain", "−2µ") and its caption', () => {
    expect(all()).toContain('Gain')
    expect(all()).toContain(nfkc('−2µ'))
    expect(all()).toContain('Figure 1 — Loop gain of the bridge stage')
  })

  it('prints callout labels and their text', () => {
    expect(all()).toContain('CAUTION')
    expect(all()).toContain('NOT MET')
    expect(all()).toContain(nfkc('The bias current at −40 °C was'))
    expect(all()).toContain('Output error 3.4 mV exceeds the 3 mV limit.')
  })

  it('adds outline entries for headings, nested by depth', () => {
    const titles = pdf.outline.map((o) => o.title)
    expect(titles).toEqual(['Cover and sign-off', 'Front end of the invented bridge amplifier', 'Appendix A — Method'])
    const body = pdf.outline[1]
    expect(body?.items.map((i) => i.title)).toEqual(['Noise and drift', 'After the break', 'Notes'])
    const noise = body?.items[0] as {items: {title: string; items: {title: string}[]}[]}
    expect(noise.items.map((i) => i.title)).toEqual(['Resistor table'])
    expect(noise.items[0]?.items.map((i) => i.title)).toEqual(['Closing remarks'])
  })

  it('makes links clickable', () => {
    expect(pdf.links).toContain('https://example.com/parts/wx7')
  })

  it('prints HTML as plain text', () => {
    expect(all()).toContain('<span class="raw">inline html shown as text</span>')
  })

  it('prints the footnote under "Notes" after the body, before the appendix', () => {
    const notes = pagesWith('Values are invented for this test.')
    expect(notes).toHaveLength(1)
    expect(pdf.pages[(notes[0] ?? 1) - 1]).toContain('Notes 1.')
    expect(notes[0]).toBeLessThan(pagesWith('Appendix A — Method')[0] ?? 0)
  })

  it('wraps a long code line without losing any of it', () => {
    for (let i = 1; i <= 40; i++) expect(all()).toMatch(new RegExp(`\\btok${i}\\b`))
  })

  it('starts the body after the cover and the appendix on a page of its own', () => {
    expect(pagesWith('Front end of the invented bridge amplifier')[0]).toBe(2)
    const appendix = pagesWith('Appendix A — Method')[0] ?? 0
    expect(pdf.pages[appendix - 1]).not.toContain('Values are invented')
  })

  it('starts a new page at an explicit page break', () => {
    const after = pagesWith('After the break')[0] ?? 0
    expect(pdf.pages[after - 2]).toContain('NOT MET')
    expect(pdf.pages[after - 1]).not.toContain('NOT MET')
  })

  it('sets the document title in the metadata', () => {
    expect(pdf.title).toBe('Bridge front end of the invented scale WX-7')
  })

  it('gives no warnings for a document DejaVu fully covers', () => {
    expect(out.warnings).toEqual([])
  })

  describe('cover', () => {
    it('shows the particulars, verdict words and the overall line', () => {
      const cover = pdf.pages[0] ?? ''
      for (const s of ['DR-0042', 'Weigh-cell concept', '2026-03-14', 'Ada Kestrel', 'For review', 'NOT MET', 'MET', 'NOT EVALUATED']) {
        expect(cover).toContain(nfkc(s))
      }
      expect(cover).toContain('Overall: 1 of the 3 requirements of 1 stage not met')
    })

    it('lists the author as "Prepared by" and one row per reviewer', () => {
      const text = pdf.pages.slice(0, 2).join(' ')
      expect(text).toMatch(/Prepared by Ada Kestrel/)
      expect(text).toMatch(/Reviewer Tomas Vell/)
      expect(text).toMatch(/Approver Ines Marlow/)
    })

    it('ends with the sign-off and closing statements', () => {
      const text = pdf.pages.slice(0, 2).join(' ')
      expect(text).toContain('By signing above')
      expect(text).toContain('confirmed by measurement on the built hardware')
    })
  })
})
