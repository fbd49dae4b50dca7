/**
 * The chain key `yield` and `--yield` on chains (DESIGN §8.7) through parse and evaluate: the
 * Monte Carlo runs when asked, is off otherwise, bad values are positioned errors, and a
 * chain with an instrumentation stage gets no number but an info note.
 */
import {VFile} from 'vfile'
import {describe, expect, it} from 'vitest'
import {evaluateNoteWithChains} from '../../src/evaluate/index.js'
import {parseNote} from '../../src/note/index.js'
import {jsonChain} from '../../src/results/chain-json.js'
import {evaluatedOf, fence, gainStage} from './helpers.js'

const stages = gainStage('a', '9k 0.1% 25ppm/K', '1k 0.1% 25ppm/K', '-10m .. 10m V') + gainStage('b', '1k 1%', '1k 1%', null)

describe('chain `yield`', () => {
  it('runs the Monte Carlo with the given trials and seed, the chain worst case bounding every trial', () => {
    const r = evaluatedOf(stages + fence('chain c', 'stages: [a, b]\nadc: sar-18\nyield: { trials: 5k, seed: 3 }\nrequire:\n  output-error: 50 mV\n  error-lsb: 2000'))
    expect(r.diagnostics.filter((d) => d.includes('error:'))).toEqual([])
    const c = r.chains[0]!
    const y = c.result.yield!
    expect(y.trials).toBe(5000)
    expect(y.seed).toBe(3)
    expect(y.results.map((x) => x.key)).toEqual(['output-error', 'error-lsb'])
    expect(y.maxError).toBeLessThanOrEqual(c.result.dc.worstCaseOutput * (1 + 1e-9))
    expect(y.variance.every((v) => /^(a|b|sar-18)\//.test(v.variable))).toBe(true)
    expect(jsonChain(c).yield!.results[0]!.key).toBe('output-error')
  })

  it('is off (null in the JSON) without the key, on with --yield at 100k trials, seed 1', () => {
    const md = stages + fence('chain c', 'stages: [a, b]\nrequire:\n  output-error: 50 mV')
    expect(jsonChain(evaluatedOf(md).chains[0]!).yield).toBeNull()
    const file = new VFile({path: 'note.md', value: md})
    const forced = evaluateNoteWithChains(parseNote(file), file, {yield: true}).chains[0]!.result.yield!
    expect(forced.trials).toBe(100_000)
    expect(forced.seed).toBe(1)
    expect(forced.results[0]!.yield).toBeGreaterThan(0)
  })

  it('reports a bad trials value and an unknown sub-key at their place', () => {
    const r = evaluatedOf(stages + fence('chain c', 'stages: [a, b]\nyield: { trials: lots, sed: 2 }'))
    expect(r.diagnostics.some((d) => /error: .*trials/i.test(d))).toBe(true)
    expect(r.diagnostics.some((d) => /error: .*sed/.test(d) && /seed/.test(d))).toBe(true)
  })

  it('judges `require: yield` on the lowest DC requirement yield, running the Monte Carlo when only the requirement asks', () => {
    const met = evaluatedOf(stages + fence('chain c', 'stages: [a, b]\nrequire:\n  output-error: 50 mV\n  yield: 99 %'))
    const y = met.chains[0]!.result.yield!
    expect(y.trials).toBe(100_000)
    const row = met.chains[0]!.result.requirements.find((r) => r.key === 'yield')!
    expect(row.kind === 'require' && row.value).toBe(Math.min(...y.results.map((x) => x.yield)))
    // A limit inside the distribution: its yield is below 100 %, and a 100 % minimum is not met.
    const p50 = y.errorPercentiles!.p50
    const tight = evaluatedOf(stages + fence('chain c', `stages: [a, b]\nyield: { trials: 20k }\nrequire:\n  output-error: ${(p50 * 1e3).toFixed(3)} mV\n  yield: 100 %`))
    const t = tight.chains[0]!.result
    const tr = t.requirements.find((r) => r.key === 'yield')!
    expect(tr.kind === 'require' && tr.value).toBeGreaterThan(0.4)
    expect(tr.kind === 'require' && tr.value).toBeLessThan(0.6)
    expect(tr.met).toBe(false)
  })

  it('refuses `require: yield` without a DC error requirement, and a yield above 100 %', () => {
    const a = evaluatedOf(stages + fence('chain c', 'stages: [a, b]\nrequire:\n  yield: 99 %'))
    expect(a.diagnostics.some((d) => /error: Unexpected `yield` without a DC error requirement on the chain/.test(d))).toBe(true)
    const b = evaluatedOf(stages + fence('chain c', 'stages: [a, b]\nrequire:\n  output-error: 50 mV\n  yield: 101 %'))
    expect(b.diagnostics.some((d) => /error: .*require\.yield/.test(d))).toBe(true)
  })

  it('gives a chain with an instrumentation stage its yield from the block model, bounded by the chain worst case', () => {
    const ina = fence('stage front', 'topology: instrumentation\nina: precision-ina\nrg: 494 0.1% 10ppm/K\nrs: 175\ninput: -10m .. 10m V\ninput-cm: 2.5 V\nsupply: ±15 V\nband: 0.1 .. 10 Hz')
    const r = evaluatedOf(ina + gainStage('b', '1k', '1k', null) + fence('chain c', 'stages: [front, b]\nyield: { trials: 20k }\nrequire:\n  output-error: 50 mV'))
    const c = r.chains[0]!
    const y = c.result.yield!
    expect(y.unavailable).toBeNull()
    expect(y.maxError).toBeLessThanOrEqual(c.result.dc.worstCaseOutput * (1 + 1e-9))
    expect(y.variance.map((v) => v.variable)).toContain('front/vos-in')
    expect(c.notes.map((n) => n.rule)).not.toContain('chain-yield-unavailable')
  })
})

describe('compare lists chain yield changes', () => {
  it('each chain requirement yield and the percentiles that moved, in percentage points', async () => {
    const {compareRuns, comparisonText} = await import('../../src/results/compare.js')
    const note = (tol: string, limit: string) => gainStage('a', `9k ${tol} 25ppm/K`, `1k ${tol} 25ppm/K`, '-10m .. 10m V') + gainStage('b', '1k 1%', '1k 1%', null) +
      fence('chain c', `stages: [a, b]\nyield: { trials: 20k }\nrequire:\n  output-error: ${limit}`)
    const runOf = (md: string) => ({files: [{file: 'note.md', stages: [], chains: evaluatedOf(md).chains.map(jsonChain)}]})
    // A limit at the median error of the wider tolerances: there the yield falls to about half.
    const p50 = runOf(note('1%', '1 V')).files[0]!.chains[0]!.yield!.errorPercentiles!.p50
    const limit = `${(p50 * 1e3).toFixed(3)} mV`
    const a = runOf(note('0.1%', limit))
    const b = runOf(note('1%', limit))
    const c = compareRuns(a, b)
    const names = c.changes.map((x) => x.name)
    expect(names).toContain('yield.output-error')
    expect(names).toContain('yield.error.p999')
    expect(comparisonText(c, false)).toMatch(/chain c yield\.output-error: [\d.]+ % → [\d.]+ % −[\d.]+ percentage points/)
    expect(compareRuns(a, a).changes).toEqual([])
  })
})
