import {describe, expect, it} from 'vitest'
import {createHash} from 'node:crypto'
import {mkdtempSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join} from 'node:path'
import {toString} from 'mdast-util-to-string'
import type {RootContent} from 'mdast'
import {readPdf} from '../render/helpers.js'
import {compiledReportOf, pdfOf, reportOf, sample} from './helpers.js'
import type {CompiledFigures} from '../../src/render/chart/compile.js'

/**
 * The report tree with each figure replaced by the length and hash of its chart compiled
 * to SVG (as both renderers compile it), for a readable snapshot.
 */
function summarise(nodes: RootContent[], figures: CompiledFigures): unknown[] {
  return nodes.map((n) => {
    if (n.type === 'figure') {
      const svg = figures.byNode.get(n)?.svg ?? ''
      return {type: 'figure', number: n.number, caption: n.caption, svg: `${svg.length} chars, sha256 ${createHash('sha256').update(svg).digest('hex').slice(0, 12)}`}
    }
    if ('children' in n && Array.isArray(n.children)) {
      const {position: _p, ...rest} = n as typeof n & {position?: unknown}
      return {...rest, children: summarise(n.children as RootContent[], figures)}
    }
    const {position: _p, ...rest} = n as typeof n & {position?: unknown}
    return rest
  })
}

/** Every row of inline data in a vega-lite spec (top level and layers); a URL would be none. */
function inlineValues(spec: unknown): unknown[] {
  if (typeof spec !== 'object' || spec === null) return []
  const o = spec as Record<string, unknown>
  const data = o['data'] as {values?: unknown} | undefined
  const own = Array.isArray(data?.values) ? data.values : []
  const layers = Array.isArray(o['layer']) ? o['layer'] : Array.isArray(o['vconcat']) ? o['vconcat'] : Array.isArray(o['hconcat']) ? o['hconcat'] : []
  return [...own, ...layers.flatMap(inlineValues)]
}

describe('report tree', () => {
  it('of the reference-buffer sample matches the reviewed snapshot', async () => {
    const {document, warnings, figures} = await compiledReportOf(sample('reference-buffer.md'))
    expect(warnings).toEqual([])
    expect(figures.warnings).toEqual([])
    const tree = {cover: document.cover, body: summarise(document.body.children, figures), appendix: summarise(document.appendix.children, figures)}
    await expect(`${JSON.stringify(tree, null, 1)}\n`).toMatchFileSnapshot('__snapshots__/reference-buffer.tree.json')
  })

  it('numbers figures 1 … N in document order, four per stage', async () => {
    const {document} = await reportOf(sample('reference-buffer.md'))
    const numbers: number[] = []
    const walk = (ns: RootContent[]): void => ns.forEach((n) => {
      if (n.type === 'figure') numbers.push(n.number)
      if ('children' in n && Array.isArray(n.children)) walk(n.children as RootContent[])
    })
    walk(document.body.children)
    expect(numbers).toEqual([1, 2, 3, 4, 5, 6, 7, 8])
  })

  it('carries each chart as its vega-lite spec with inline data, so tests and renderers read the data from the tree', async () => {
    const {document} = await reportOf(sample('reference-buffer.md'))
    const charts: {caption: string; values: unknown[]}[] = []
    const walk = (ns: RootContent[]): void => ns.forEach((n) => {
      if (n.type === 'figure' && n.chart !== undefined) charts.push({caption: n.caption, values: inlineValues(n.chart)})
      if ('children' in n && Array.isArray(n.children)) walk(n.children as RootContent[])
    })
    walk(document.body.children)
    expect(charts).toHaveLength(8)
    for (const c of charts) expect(c.values.length, c.caption).toBeGreaterThan(0)
  })
})

describe('the PDF of the load-cell sample, read back with pdfjs', async () => {
  const {outcome, pdf} = await pdfOf(sample('load-cell-bridge.md'))
  const text = (await readPdf(pdf)).pages.join('\n')

  it('builds without errors and with every requirement met', () => {
    expect(outcome.diagnostics.filter((d) => d.severity === 'error')).toEqual([])
    expect(outcome.exitCode).toBe(0)
  })

  it('warns only with the practice notes of the stage (no chart or render warning)', () => {
    const warnings = outcome.diagnostics.filter((d) => d.severity === 'warning').map((d) => d.message)
    expect(warnings.length).toBeGreaterThan(0)
    for (const w of warnings) expect(w).toMatch(/^Stage `(bridge-ina|adc-driver)`: .* \[[a-z-]+\]$/s)
  })

  it.each([
    'Output-referred error (V)', 'Output noise density (V/√Hz)', 'Frequency (Hz)', 'Loop gain |T| (dB)'
  ])('carries the chart axis title “%s”', (title) => {
    expect(text).toContain(title.normalize('NFKC'))
  })

  it.each([
    'Figure 1 — DC error contributors of stage bridge-ina',
    'Figure 2 — Output noise density of stage bridge-ina',
    'Figure 3 — Cumulative output noise rms of stage bridge-ina',
    'Figure 4 — DC error contributors of stage adc-driver',
    'Figure 7 — Loop gain of stage adc-driver'
  ])('carries the caption “%s”', (caption) => {
    expect(text).toContain(caption)
  })

  it('shows the verdicts as words and the overall status on the cover', () => {
    expect(text).toContain('MET')
    // Two stages since the instrumentation rework: requirements and checked limits, as the cover counts them.
    expect(text).toMatch(/Overall: all \d+ requirements met \(physical limits included\)/)
  })

  it('carries the compensation-resistor note with its three-way table', () => {
    expect(text).toContain('bias-compensation-resistor')
    expect(text).toContain('does not earn its place')
    expect(text).toContain('Without rcomp')
  })

  it('carries the mains safety note, deferring to codes and licensed practice', () => {
    expect(text).toContain('SAFETY')
    expect(text).toMatch(/local codes/)
    expect(text).toMatch(/licensed/)
  })

  it('ends the sign-off with the calculated-estimates statement', () => {
    expect(text).toMatch(/calculated estimates/)
  })
})

describe('notes shared by several stages', () => {
  const stage = (id: string): string => `\`\`\`stage ${id}
topology: noninverting
opamp: precision-bipolar
rf: 9.09k 0.1%
rg: 1k 0.1%
input: -0.1 .. 0.1 V
supply: ±12 V
band: 0.1 .. 100 Hz
\`\`\`
`
  const NOTE = `---\ntitle: Two stages\ncontext: [mains-connected]\n---\n\n# Two stages\n\n${stage('first')}\n${stage('second')}`

  it('are printed once, before the prose, and each stage points to them', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'ampreview-shared-'))
    writeFileSync(join(dir, 'n.md'), NOTE)
    const {document} = await reportOf(join(dir, 'n.md'))
    const texts = document.body.children.map((n) => toString(n))
    const safety = texts.filter((t) => t.includes('hazardous-voltage') && t.includes('Mains-connected'))
    expect(safety).toHaveLength(1)
    expect(texts[0]).toBe('Notes that apply to every stage')
    const pointers = texts.filter((t) => t.startsWith('Also applies to this stage: SAFETY hazardous-voltage'))
    expect(pointers).toHaveLength(2)
  })
})
