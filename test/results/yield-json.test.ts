/**
 * The JSON `yield` object of DESIGN §8.7 (null when off), `--yield`'s evaluate option, and
 * `compare` listing yield changes.
 */
import {describe, expect, it} from 'vitest'
import {evaluateNoteWithChains} from '../../src/evaluate/index.js'
import {compareRuns, comparisonText} from '../../src/results/compare.js'
import {jsonStage} from '../../src/results/json.js'
import {noteOf} from '../note/helpers.js'

const OPAMP = [
  '```opamp amp-a', 'input-type: bipolar', 'vos: 60 uV', 'vos-drift: 0.5 uV/K', 'ib: 2 nA', 'ios: 1.8 nA', 'en: 9 nV/√Hz',
  'in: 0.15 pA/√Hz', 'gbw: 1.2 MHz', 'aol: 126 dB', 'pm-unity: 60 deg', 'cmrr: 120 dB', 'psrr: 118 dB', '```'
]
const stage = (lines: string[], tol = '0.1%'): string =>
  `${OPAMP.join('\n')}\n\n\`\`\`stage gain-a\n${[
    'topology: noninverting', 'opamp: amp-a', `rf: 49.9k ${tol} 25ppm/K`, `rg: 1.00k ${tol} 25ppm/K`, 'input: -10m .. 10m V', 'supply: ±15 V',
    'temperature: -20 .. 70 °C', ...lines
  ].join('\n')}\n\`\`\`\n`

const run = (md: string, options = {}) => {
  const {note, file} = noteOf(md)
  return {files: [{file: 'note.md', stages: evaluateNoteWithChains(note, file, options).stages.map(jsonStage)}]}
}

describe('JSON yield', () => {
  it('is null when off, and the §8.7 object when on', () => {
    expect(run(stage(['require:', '  output-error: 1 mV'])).files[0]!.stages[0]!.yield).toBeNull()
    const s = run(stage(['yield: { trials: 20k, seed: 4 }', 'require:', '  output-error: 1 mV', '  input-error: 18 uV', '  yield: 95 %'])).files[0]!.stages[0]!
    const y = s.yield!
    expect(y).toMatchObject({trials: 20_000, seed: 4, distribution: 'uniform', unavailable: null, basis: 'output'})
    expect(y.results.map((r) => r.key)).toEqual(['output-error', 'input-error'])
    for (const r of y.results) {
      expect(r.yield).toBe(r.passed / 20_000)
      expect(r.interval[0]).toBeLessThanOrEqual(r.yield)
      expect(r.interval[1]).toBeGreaterThanOrEqual(r.yield)
    }
    const p = y.errorPercentiles!
    expect(p.p50).toBeLessThanOrEqual(p.p99)
    expect(p.p99).toBeLessThanOrEqual(p.p999)
    expect(p.p999).toBeLessThanOrEqual(y.worstCase)
    expect(y.worstCase).toBe(s.dc.worstCaseOutput)
    expect(y.variance.reduce((a, v) => a + v.share, 0)).toBeCloseTo(1, 12)
    // The requirement row: the lowest of the DC requirements' yields against the minimum.
    const row = s.requirements.find((r) => r.key === 'yield')!
    expect(row).toMatchObject({kind: 'require', limit: 0.95, value: Math.min(...y.results.map((r) => r.yield))})
    expect(row.met).toBe((row.value as number) >= 0.95)
  })
  it('`--yield` (evaluate option) switches it on with 100k trials for a stage without its own', () => {
    const y = run(stage(['require:', '  output-error: 1 mV']), {yield: true}).files[0]!.stages[0]!.yield!
    expect(y).toMatchObject({trials: 100_000, seed: 1})
    const own = run(stage(['yield: { trials: 5k }']), {yield: true}).files[0]!.stages[0]!.yield!
    expect(own.trials).toBe(5000)
  })
})

describe('compare reports yield changes', () => {
  it('lists each requirement yield and the percentiles that moved, in percentage points', () => {
    const a = run(stage(['yield: { trials: 20k }', 'require:', '  output-error: 1 mV'], '0.1%'))
    const b = run(stage(['yield: { trials: 20k }', 'require:', '  output-error: 1 mV'], '0.5%'))
    const c = compareRuns(a, b)
    const names = c.changes.map((x) => x.name)
    expect(names).toContain('yield.output-error')
    expect(names).toContain('yield.error.p999')
    const text = comparisonText(c, false)
    expect(text).toMatch(/gain-a yield\.output-error: [\d.]+ % → [\d.]+ % −[\d.]+ percentage points/)
    expect(compareRuns(a, a).changes).toEqual([])
  })
})

describe('the yield verdict as printed', () => {
  it('prints the value and limit as percentages and the margin in percentage points', async () => {
    const {requirementValue, margin, limitText} = await import('../../src/report/verdicts.js')
    const row = {key: 'yield', kind: 'require', limit: 0.997, value: 0.99953, met: true} as const
    expect(requirementValue(row, 'value', 'noninverting')).toBe('99.953 %')
    expect(limitText(row, 'noninverting')).toBe('≥ 99.70 %')
    expect(margin(row, 'noninverting')).toBe('0.25 percentage points')
    expect(requirementValue({...row, value: null, met: false}, 'value', 'noninverting')).toBe('—')
  })
})
