import {describe, expect, it} from 'vitest'
import {mkdtempSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join} from 'node:path'
import {toString} from 'mdast-util-to-string'
import type {RootContent} from 'mdast'
import {readPdf} from '../render/helpers.js'
import {compiledReportOf, pdfOf, reportOf, sample} from './helpers.js'

/** The outline of a tree: each heading as "#… text", and our own nodes by kind and number. */
function outline(nodes: RootContent[]): string[] {
  return nodes.flatMap((n): string[] => {
    if (n.type === 'heading') return [`${'#'.repeat(n.depth)} ${toString(n)}`]
    if (n.type === 'figure' || n.type === 'schematic') return [`  [${n.type} ${n.number}]`]
    if (n.type === 'callout') return [`  [${n.label}]`]
    return []
  })
}

/** Every node of a type, in document order. */
function nodesOf<T extends RootContent['type']>(nodes: RootContent[], type: T): Extract<RootContent, {type: T}>[] {
  const out: Extract<RootContent, {type: T}>[] = []
  const walk = (ns: RootContent[]): void => ns.forEach((n) => {
    if (n.type === type) out.push(n as Extract<RootContent, {type: T}>)
    if ('children' in n && Array.isArray(n.children)) walk(n.children as RootContent[])
  })
  walk(nodes)
  return out
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

describe('report tree of the reference-buffer sample', async () => {
  const {document, warnings, figures} = await compiledReportOf(sample('reference-buffer.md'))
  const body = document.body.children
  const svgOf = (caption: string): string => {
    const fig = nodesOf(body, 'figure').find((f) => f.caption.startsWith(caption))
    return fig === undefined ? '' : figures.byNode.get(fig)?.svg ?? ''
  }

  it('builds without warnings', () => {
    expect(warnings).toEqual([])
    expect(figures.warnings).toEqual([])
  })

  it('carries each chart as its vega-lite spec with inline data', () => {
    const charts = nodesOf(body, 'figure')
    // Four charts a stage, two more for the baseline stage's Monte Carlo (histogram, variance shares).
    expect(charts).toHaveLength(10)
    for (const c of charts) expect(inlineValues(c.chart).length, c.caption).toBeGreaterThan(0)
  })

  it('puts the engine’s DC contributors into the bar chart’s data, largest first, absent parts left out', () => {
    const fig = nodesOf(body, 'figure').find((f) => f.caption.startsWith('DC error contributors of stage ref-buffer'))!
    const rows = inlineValues(fig.chart) as {key: string; output: number}[]
    const outputs = rows.map((r) => r.output)
    expect(outputs).toEqual([...outputs].sort((a, b) => b - a))
    expect(rows[0]).toMatchObject({key: 'vos'})
    expect(rows.map((r) => r.key)).not.toContain('idark')
  })

  it('draws only the variance shares of 0.05 % and more, and counts the rest in the caption', () => {
    const fig = nodesOf(body, 'figure').find((f) => f.caption.startsWith('Share of the error variance of stage ref-buffer'))!
    const rows = inlineValues(fig.chart) as {label: string; share: number}[]
    expect(rows.length).toBeGreaterThan(1)
    for (const r of rows) expect(r.share).toBeGreaterThanOrEqual(0.05)
    expect(rows[0]!.label).toBe('Offset voltage (vos)')
    // The stage has nine random variables (vos, drift, ib, ios, cmrr, psrr, supply, rs and rf tolerance).
    expect(fig.caption).toContain(`(${9 - rows.length} more variables under 0.05 % each not drawn)`)
  })

  it('has the reviewed section outline', async () => {
    await expect(`${outline(body).join('\n')}\n`).toMatchFileSnapshot('__snapshots__/reference-buffer.outline.txt')
  })

  it('orders each stage section: schematic, parameters, results, DC, yield when asked, noise, stability, requirements, notes', () => {
    const h3 = outline(body).filter((l) => l.startsWith('### ')).slice(0, 8)
    expect(h3).toEqual(['### Parameters', '### Results summary', '### DC error budget', '### Monte Carlo yield', '### Noise budget', '### Stability', '### Requirements', '### Practice and safety notes'])
    const lines = outline(body)
    expect(lines.indexOf('  [schematic 1]')).toBeLessThan(lines.indexOf('### Parameters'))
  })

  it('numbers schematics and charts 1 … N in document order, five per stage and two for a Monte Carlo', () => {
    const numbers = [...nodesOf(body, 'figure'), ...nodesOf(body, 'schematic')].map((n) => n.number).sort((a, b) => a - b)
    expect(numbers).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12])
    expect(nodesOf(body, 'schematic').map((n) => n.number)).toEqual([1, 8])
  })

  it.each([
    ['DC error contributors of stage ref-buffer', 'Output-referred error'],
    ['Output noise density of stage ref-buffer', 'Output noise density'],
    ['Cumulative output noise rms of stage ref-buffer', 'Cumulative'],
    ['Loop gain of stage ref-buffer', 'Loop gain |T| (dB)']
  ])('draws the chart “%s” with the axis title “%s”', (caption, axis) => {
    expect(svgOf(caption)).toContain(axis)
  })

  it('names the largest DC contributors in the bar chart', () => {
    for (const label of ['Offset voltage', 'Offset drift']) expect(svgOf('DC error contributors of stage ref-buffer')).toContain(label)
  })

  it('marks the baseline stage on the cover and counts only the design stage', () => {
    const c = document.cover
    expect(c.baseline).toEqual(['ref-buffer'])
    // Three requirements and two checked limits (output swing, slew) of the baseline stage.
    expect(c.verdicts.filter((v) => !v.counted).map((v) => v.stage)).toEqual(['ref-buffer', 'ref-buffer', 'ref-buffer', 'ref-buffer', 'ref-buffer'])
    expect(c.counted).toEqual({stages: 1, chains: 0, requirements: 5, notMet: 0})
    expect(c.overall).toBe('met')
  })

  it('lists the open notes of both stages for the cover, in document order', () => {
    expect(document.cover.notes.map((n) => `${n.severity} ${n.stage} ${n.rule}`)).toEqual([
      'warning ref-buffer phase-margin-low', 'caution ref-buffer follower-feedback-resistor',
      'caution ref-buffer bias-compensation-resistor', 'caution ref-buffer-proposed bias-over-temperature-missing'
    ])
    const anchors = new Set(nodesOf(body, 'callout').map((c) => c.anchor))
    for (const n of document.cover.notes) expect(anchors).toContain(n.anchor)
  })

  it('names both archetype stages for the cover', () => {
    expect(document.cover.archetypes).toEqual([{stage: 'ref-buffer', opamp: 'precision-cmos'}, {stage: 'ref-buffer-proposed', opamp: 'zero-drift'}])
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
    for (const w of warnings) expect(w).toMatch(/^Stage `(bridge-ina|adc-driver)`: /)
    const rules = outcome.diagnostics.filter((d) => d.severity === 'warning').map((d) => `${d.kind} ${d.rule}`)
    expect(rules).toEqual(rules.map(() => expect.stringMatching(/^note [a-z-]+$/)))
  })

  it.each([
    'Output-referred error (mV)', 'Output noise density (V/√Hz)', 'Frequency', '0.1 Hz', '10 Hz', 'Loop gain |T| (dB)'
  ])('carries the chart axis title “%s”', (title) => {
    expect(text).toContain(title.normalize('NFKC'))
  })

  it.each([
    'Figure 1 — Block diagram of the WM-3 analogue front end',
    'Figure 2 — Schematic of stage bridge-ina',
    'Figure 3 — DC error contributors of stage bridge-ina',
    'Figure 4 — Output noise density of stage bridge-ina',
    'Figure 5 — Cumulative output noise rms of stage bridge-ina',
    'Figure 6 — Schematic of stage adc-driver',
    'Figure 7 — DC error contributors of stage adc-driver',
    'Figure 10 — Loop gain of stage adc-driver'
  ])('carries the caption “%s”', (caption) => {
    expect(text).toContain(caption)
  })

  it('shows the verdicts as words and the overall status on the cover', () => {
    expect(text).toContain('MET')
    expect(text).toContain('Overall: all 15 requirements and physical limits of 2 stages and 1 chain met')
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

  it('writes a margin above 100 % as a ratio, not as a percentage', () => {
    expect(text).toContain('14 kHz (15 ×)')
    expect(text).not.toContain('1396 %')
  })

  it('writes no frequency tick as a bare prefix such as “100m”', () => {
    expect(text).not.toMatch(/(^|\s)100m(\s|$)/)
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

describe('the cover of the reference-buffer PDF, read back with pdfjs', async () => {
  const {outcome, pdf} = await pdfOf(sample('reference-buffer.md'))
  const pages = (await readPdf(pdf)).pages.map((p) => p.normalize('NFKC'))
  // The cover and sign-off may run onto a second page: the cover is every page before the body's first heading.
  const bodyStart = pages.findIndex((p, i) => i > 0 && p.includes('Purpose'))
  const cover = pages.slice(0, bodyStart > 0 ? bodyStart : 1).join(' ')

  it('exits 0: only the baseline stage misses requirements', () => {
    expect(outcome.exitCode).toBe(0)
  })

  it('says what the overall verdict counts', () => {
    // No line breaks inside an id: the text reads back whole, with U+002D hyphens.
    expect(cover).toContain('Overall: all 5 requirements and physical limits of 1 stage met (baseline stage ref-buffer not counted)')
    expect(cover).toContain('ref-buffer (baseline) DC error at output, worst case 227 μV ≤ 150 μV NOT MET')
    expect(cover).toContain('Baseline stage ref-buffer: kept for comparison, not counted in the overall verdict or the exit code.')
  })

  it('carries the archetype line for each archetype stage', () => {
    expect(cover).toContain('Stages ref-buffer (archetype precision-cmos) and ref-buffer-proposed (archetype zero-drift) use archetypes: their figures are for the class, not a part.')
  })

  it('lists each open note with the page its note is on', () => {
    // The page numbers are written after the body is drawn, in list order, at the end of the page's text.
    const refs = [...cover.matchAll(/page (\d+)(?! of)/g)].map((m) => Number(m[1]))
    const entries = [
      ['WARNING · ref-buffer · Phase margin low (phase-margin-low)', 'phase-margin-low'],
      ['CAUTION · ref-buffer · Follower feedback resistor (follower-feedback-resistor)', 'follower-feedback-resistor'],
      ['CAUTION · ref-buffer · Bias-compensation resistor (bias-compensation-resistor)', 'bias-compensation-resistor'],
      ['CAUTION · ref-buffer-proposed · Bias current over temperature not entered (bias-over-temperature-missing)', 'bias-over-temperature-missing']
    ]
    expect(refs).toHaveLength(entries.length)
    entries.forEach(([entry, rule], i) => {
      expect(cover).toContain(entry)
      const page = pages[(refs[i] ?? 0) - 1] ?? ''
      // The callout prints its rule id after the text, on the page the cover names.
      expect(page).toContain(rule)
    })
  })
})

describe('the photodiode PDF, read back with pdfjs', async () => {
  const {pdf} = await pdfOf(sample('photodiode-receiver.md'))
  const pages = (await readPdf(pdf)).pages.map((p) => p.normalize('NFKC'))

  it('lists the accepted rule on the cover with the author’s reason', () => {
    expect(pages[0]).toContain('CAUTION · rx-tia · Bandwidth margin (bandwidth-margin) — accepted by the author: The 20 kHz top of the band')
  })

  it('leaves out the rows of parts the circuit does not have (no rcomp here), tables and charts alike', () => {
    const all = pages.join('\n')
    expect(all).not.toContain('Thermal noise of rcomp')
    expect(all).toContain('Thermal noise of rshunt')
  })

  it('writes “none” for an absent 1/f corner, not “0 Hz”', () => {
    const all = pages.join('\n')
    expect(all).toContain('2 fA/√Hz / none'.normalize('NFKC'))
    expect(all).not.toContain('/ 0 Hz')
  })

  it('marks the note accepted in the body, with the reason', () => {
    const body = pages.slice(1).join('\n')
    expect(body).toContain('CAUTION — ACCEPTED')
    expect(body).toContain('Accepted by the author: The 20 kHz top of the band is the noise-measurement edge')
  })
})
