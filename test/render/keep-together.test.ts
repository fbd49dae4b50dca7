/**
 * No line break between a number and its unit: `keepTogether` joins them with a no-break
 * space, every DejaVu face used carries that glyph (fontkit), and in a PDF drawn in a
 * narrow column no line ends with a number whose unit starts the next line (pdfjs items).
 */
import {describe, expect, it} from 'vitest'
import {create} from 'fontkit'
import {getDocument} from 'pdfjs-dist/legacy/build/pdf.mjs'
import {keepTogether} from '../../src/render/pdf/context.js'
import {renderPdf} from '../../src/render/pdf/index.js'
import {fontSet, report, standardTheme} from './helpers.js'

describe('keepTogether()', () => {
  it('joins a number and its unit with U+00A0, and leaves other spaces alone', () => {
    expect(keepTogether('worst case 12.4 mV at 25 °C, 3 dB, 66.7 ° and 5 kΩ')).toBe('worst case 12.4\u00A0mV at 25\u00A0°C, 3\u00A0dB, 66.7\u00A0° and 5\u00A0kΩ')
    expect(keepTogether('stage 2 meets 4 of its requirements')).toBe('stage 2 meets 4 of its requirements')
    expect(keepTogether('21862 LSB and 16.99 bits')).toBe('21862\u00A0LSB and 16.99\u00A0bits')
  })

  it('draws the hyphens inside ids, keys, p-p and dates as no-break hyphens, and leaves others alone', () => {
    expect(keepTogether('rule bias-over-temperature-missing, key require.output-error, 5 µV p-p on 2026-11-30'))
      .toBe('rule bias\u2011over\u2011temperature\u2011missing, key require.output\u2011error, 5\u00A0µV p\u2011p on 2026\u201111\u201130')
    expect(keepTogether('in- and −5 V, (-51 %)')).toBe('in- and −5\u00A0V, (-51\u00A0%)')
    expect(keepTogether('✓ met, ✗ NOT MET, – skipped, 8 – 10')).toBe('✓\u00A0met, ✗\u00A0NOT\u00A0MET, –\u00A0skipped, 8 – 10')
  })

  it('uses a glyph every DejaVu face carries', () => {
    const fonts = fontSet()
    for (const bytes of Object.values(fonts)) {
      const font = create(Buffer.from(bytes)) as {hasGlyphForCodePoint(c: number): boolean}
      expect(font.hasGlyphForCodePoint(0xa0)).toBe(true)
    }
  })

  it('never ends a PDF line with a number whose unit begins the next', async () => {
    const words = Array.from({length: 120}, (_, i) => `item ${i} is ${i * 7 + 1}.5 mV`).join(', ')
    const body = `| Narrow | Wide |\n|---|---|\n| ${words} | x |\n\n${words}\n`
    const out = await renderPdf(report({body}), {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(0)})
    const pdf = await getDocument({data: out.pdf.slice(), useSystemFonts: false, disableFontFace: true}).promise
    let lines = 0
    for (let p = 2; p <= pdf.numPages; p++) {
      const items = (await (await pdf.getPage(p)).getTextContent()).items.map((it) => ('str' in it ? it.str : ''))
        .filter((s) => s.trim() !== '')
      for (let i = 0; i + 1 < items.length; i++) {
        lines++
        if (/\d$/.test(items[i]!.trim())) expect(items[i + 1]!.trim()).not.toMatch(/^mV/)
      }
    }
    await pdf.destroy()
    expect(lines).toBeGreaterThan(50)
  }, 60_000)
})
