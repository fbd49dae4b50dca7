/**
 * Numbers as a reviewer reads them, checked on the samples' PDFs read back with pdfjs and on
 * their report trees: slew rates in V/µs (the JSON in V/s), one prefix a budget column,
 * distinct digits for narrow ranges, no line break inside a number with its unit, a rule id,
 * a key or "p-p", and the note's own image numbered with the charts.
 */
import {describe, expect, it} from 'vitest'
import type {RootContent, Table} from 'mdast'
import {getDocument} from 'pdfjs-dist/legacy/build/pdf.mjs'
import {column} from '../../src/report/format.js'
import {formatSlew} from '../../src/units/format.js'
import {RULE_IDS} from '../../src/rules/index.js'
import {readPdf} from '../render/helpers.js'
import {pdfOf, reportOf, ROOT, sample} from './helpers.js'
import {readdirSync} from 'node:fs'
import {join} from 'node:path'

const SAMPLES = readdirSync(join(ROOT, 'sample-designs')).filter((f) => f.endsWith('.md')).sort()

describe('formatSlew()', () => {
  it.each([
    [2e6, '2 V/µs'],
    [5e5, '0.5 V/µs'],
    [1.5e7, '15 V/µs'],
    [1e4, '0.01 V/µs'],
    [9.99e3, '9.99 kV/s'],
    [62.8e-3, '62.8 mV/s'],
    [139, '139 V/s'],
    [0, '0 V/µs']
  ])('writes %d V/s as %s', (v, text) => {
    expect(formatSlew(v)).toBe(text)
  })
})

describe('column()', () => {
  it('keeps the trailing zeros of three significant digits (2.70 mV beside 0.550 mV)', () => {
    expect(column([2.7e-3, 0.55e-3, 9e-6], 'V')).toEqual(['2.70 mV', '0.550 mV', '0.00900 mV'])
  })
  it('sets every value in the prefix of the largest, three significant digits each', () => {
    expect(column([150e-6, 67.5e-6, 4.53e-9, 113e-9, 0, 227e-6, null], 'V')).toEqual(['150 µV', '67.5 µV', '0.00453 µV', '0.113 µV', '0 µV', '227 µV', '—'])
  })
  it('takes the prefix a rounded largest value needs (999.7 µV is 1 mV)', () => {
    expect(column([999.7e-6, 12e-6], 'V')).toEqual(['1.00 mV', '0.0120 mV'])
  })
  it('lets a value too small for seven decimals in that prefix keep its own', () => {
    expect(column([1, 2e-12], 'V')).toEqual(['1.00 V', '2 pV'])
  })
})

/** Texts of a table's cells, row by row (inline code and emphasis flattened). */
function cells(t: Table): string[][] {
  const text = (n: RootContent): string => ('value' in n && typeof n.value === 'string' ? n.value : 'children' in n ? (n.children as RootContent[]).map(text).join('') : '')
  return t.children.map((row) => row.children.map((c) => c.children.map(text).join('')))
}

function tables(nodes: RootContent[]): Table[] {
  return nodes.flatMap((n) => (n.type === 'table' ? [n] : 'children' in n && Array.isArray(n.children) ? tables(n.children as RootContent[]) : []))
}

const VALUE_COLUMNS = ['At output', 'Referred to input', 'At output after calibration', 'Output rms', 'At converter input', 'Referred to chain input', 'At converter input, rms', 'After calibration']
/** The unit of a printed value ("0.00453 µV" → "µV"). */
const unitOf = (cell: string): string | null => /^−?[\d.]+ (\S+)$/.exec(cell)?.[1] ?? null

describe('budget columns', () => {
  it.each(SAMPLES)('%s: every value column of a budget table is in one prefix', async (name) => {
    const {document} = await reportOf(sample(name))
    let checked = 0
    for (const t of tables(document.body.children)) {
      const [head, ...rows] = cells(t)
      head!.forEach((h, c) => {
        if (!VALUE_COLUMNS.includes(h)) return
        // The peak-to-peak total is another quantity than the rms column it sits in.
        const units = rows.filter((r) => !r[0]!.includes('peak-to-peak')).map((r) => unitOf(r[c]!)).filter((u) => u !== null)
        expect(new Set(units).size, `${h}: ${units.join(', ')}`).toBe(1)
        checked++
      })
    }
    expect(checked).toBeGreaterThan(0)
  })
})

describe('the reference-buffer PDF, read back', async () => {
  const {pdf, outcome} = await pdfOf(sample('reference-buffer.md'))
  const pages = (await readPdf(pdf)).pages.map((p) => p.normalize('NFKC'))
  const all = pages.join(' ')

  it('writes slew rates in V/µs (a slow signal’s need in V/s): the needed rate, the part’s and the margin', () => {
    expect(pages[0]).toContain('Slew rate needed (limit) 62.8 mV/s ≤ 2 V/μs MET')
    expect(all).toContain('Slew rate 2 V/μs op-amp, used')
    expect(all).toMatch(/2 V\/μs \(100 %\); full-power bandwidth/)
    expect(all).not.toMatch(/[kMG]V\/s\b/)
  })

  it('keeps the JSON in V/s', () => {
    const slew = outcome.stages[0]!.requirements.find((r) => r.key === 'slew')! as {value: number; limit: number}
    expect(slew.limit).toBe(2e6)
    expect(slew.value).toBeCloseTo(2 * Math.PI * 10 * 1e-3, 9)
  })

  it('prints a column of the DC budget in one prefix', () => {
    expect(all).toContain('Bias current × resistance mismatch (ib) 0.00453 μV 0.00453 μV 0.0 %')
    expect(all).toContain('Offset current (ios) 0.113 μV 0.113 μV 0.0 %')
  })

  it('tells the ends of a narrow range apart, with the U+2212 minus in margins', () => {
    expect(pages[0]).toContain('Output swing (limit) 2.499 ... 2.501 V within 50 mV ... 4.7 V')
    expect(all).toContain('−76.5 μV (−51 %)')
    expect(all).toContain('−42.3° (−94 %)')
    expect(all).not.toMatch(/\(-\d/)
  })
})

/** The text of every line the PDF draws, in order (pdfjs items, one line or run each). */
async function lines(pdf: Uint8Array): Promise<string[]> {
  const doc = await getDocument({data: pdf.slice(), useSystemFonts: false, disableFontFace: true}).promise
  const out: string[] = []
  for (let p = 1; p <= doc.numPages; p++) {
    for (const it of (await (await doc.getPage(p)).getTextContent()).items) {
      if ('str' in it && it.str.trim() !== '') out.push(it.str.normalize('NFKC').trim())
    }
  }
  await doc.destroy()
  return out
}

describe('no line break inside a unit, an id, a key or p-p', () => {
  it.each(SAMPLES)('%s', async (name) => {
    const drawn = await lines((await pdfOf(sample(name))).pdf)
    expect(drawn.length).toBeGreaterThan(200)
    const ids = new Set<string>(RULE_IDS)
    for (let i = 0; i + 1 < drawn.length; i++) {
      const [a, b] = [drawn[i]!, drawn[i + 1]!]
      // A line that ends inside a word at a hyphen ("bias-over-", "p-") would continue with a lowercase letter.
      if (/[a-z0-9]-$/.test(a)) expect(`${a} | ${b}`).not.toMatch(/-\s\|\s[a-z]/)
      // A verdict's mark never stands alone on its line ("–" above "skipped").
      if (/^[✓✗–]$/.test(a)) expect(b).not.toMatch(/^(met|NOT MET|NOT|skipped|not evaluated)\b/)
      // A number never ends a line whose next starts with its unit.
      if (/\d$/.test(a)) expect(b).not.toMatch(/^[fpnµμmkMG]?(V|A|Hz|F|Ω|dB|%|ppm)\b/)
    }
    // Copied text has plain hyphens (the no-break hyphen maps back to U+002D), so rule ids read back whole.
    const text = drawn.join(' ')
    expect(text).not.toContain('\u2011')
    const printed = [...ids].filter((id) => text.includes(`${id}`))
    if (name === 'reference-buffer.md') expect(printed).toEqual(expect.arrayContaining(['phase-margin-low', 'bias-over-temperature-missing', 'follower-feedback-resistor']))
  }, 60_000)
})

describe('the note’s own image', () => {
  it('is Figure 1 of the load-cell report, captioned with its alt text, the charts numbered after it', async () => {
    const pages = (await readPdf((await pdfOf(sample('load-cell-bridge.md'))).pdf)).pages.map((p) => p.normalize('NFKC'))
    const all = pages.join(' ')
    expect(all).toContain('Figure 1 — Block diagram of the WM-3 analogue front end')
    expect(all).toContain('Figure 2 — Schematic of stage bridge-ina')
    expect(all).toContain('Figure 3 — DC error contributors of stage bridge-ina')
    const numbers = [...all.matchAll(/Figure (\d+) —/g)].map((m) => Number(m[1]))
    expect(numbers).toEqual(numbers.map((_, i) => i + 1))
  }, 60_000)
})
