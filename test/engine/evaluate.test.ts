/**
 * `evaluateStage()` as a whole (DESIGN §4, §6): JSON hygiene, requirement verdicts, swing.
 */
import {describe, expect, it} from 'vitest'
import * as engine from '../../src/engine/index.js'
import {evaluateStage, type StageResult} from '../../src/engine/index.js'
import {res, stageInput, testOpamp, topologyFixtures} from './helpers.js'

/** Paths of every number that is not finite, anywhere in a value. */
function nonFinite(value: unknown, path = '$'): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path]
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinite(v, `${path}[${i}]`))
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => nonFinite(v, `${path}.${k}`))
  return []
}

const fixtures = topologyFixtures()
const edgeCases = [
  ...fixtures,
  stageInput({topology: 'follower', rf: null, rg: null, rs: null, cf: 0}),
  stageInput({topology: 'transimpedance', rf: res(1e5), rg: null, rs: null, rshunt: null, csource: 0, input: [0, 1e-6]}),
  stageInput({rf: res(1e9), rg: res(1e3), opamp: testOpamp({aol: 1e5})}), // no crossover
  stageInput({opamp: testOpamp({en: 0, in: 0}), rf: res(20e3), rg: res(1e3), rs: null, noiseTemperature: -273.15}) // zero noise
]

describe('evaluateStage()', () => {
  it.each(edgeCases.map((s, i) => [i, s.topology, s] as const))('case %d (%s) has no NaN or Infinity anywhere', (_, __, s) => {
    const r = evaluateStage(s)
    expect(nonFinite(r)).toEqual([])
    expect(nonFinite(JSON.parse(JSON.stringify(r)) as StageResult)).toEqual([])
  })
  it('uses null where a value does not exist', () => {
    const r = evaluateStage(edgeCases[fixtures.length + 2] as (typeof edgeCases)[number])
    expect(r.stability.crossover).toBeNull()
    expect(r.stability.phaseMargin).toBeNull()
  })
  it('evaluates each required key against its figure', () => {
    const s = stageInput({require: {'output-error': 1, 'output-error-rss': 1e-9, 'input-error': 1, 'noise-rms': 1, 'noise-pp': 1e-12, 'phase-margin': 30, bandwidth: 1e9}})
    const r = evaluateStage(s)
    const v = Object.fromEntries(r.requirements.map((q) => [q.key, q]))
    expect(r.requirements.map((q) => q.key)).toEqual(['output-error', 'output-error-rss', 'input-error', 'noise-rms', 'noise-pp', 'phase-margin', 'bandwidth',
      'output-swing', 'input-common-mode', 'slew', 'output-current'])
    expect(r.requirements.map((q) => q.kind)).toEqual([...Array(7).fill('require'), ...Array(4).fill('limit')])
    expect(v['output-error']).toEqual({key: 'output-error', kind: 'require', limit: 1, value: r.dc.worstCaseOutput, met: true})
    expect(v['output-error-rss']?.met).toBe(false)
    expect(v['input-error']?.value).toBe(r.dc.worstCaseInput)
    expect(v['noise-rms']).toMatchObject({value: r.noise.outputRms, met: true})
    expect(v['noise-pp']).toMatchObject({value: r.noise.outputPeakToPeak, met: false})
    expect(v['phase-margin']).toMatchObject({value: r.stability.phaseMargin, met: true})
    expect(v['bandwidth']).toMatchObject({value: r.stability.bandwidth, met: false})
  })
  it('fails a minimum requirement whose value does not exist', () => {
    const r = evaluateStage({...(edgeCases[fixtures.length + 2] as (typeof edgeCases)[number]), require: {'phase-margin': 45}})
    expect(r.requirements.filter((q) => q.kind === 'require')).toEqual([{key: 'phase-margin', kind: 'require', limit: 45, value: null, met: false}])
  })
  it('carries gain, noise gain, names and the bias currents used', () => {
    const r = evaluateStage(stageInput())
    expect(r).toMatchObject({id: 'test-stage', topology: 'noninverting', opamp: 'test-amp', gain: 21, noiseGain: 21})
    expect(r.bias.overTemperatureMissing).toBe(true)
  })
  it('rejects a stage without its required resistor', () => {
    expect(() => evaluateStage(stageInput({rg: null}))).toThrow(/rg/)
  })
})

describe('swingCheck()', () => {
  // DESIGN §4.1, §4.2: Vout = vref·NG + G·input for inverting stages.
  it('places an inverting output around vref·NG and reports the excess', () => {
    const s = stageInput({topology: 'inverting', rf: res(10e3), rg: res(1e3), rs: null, vref: 1, input: [-1, 0.1], supply: [0, 12], opamp: testOpamp({swingHeadroom: 1})})
    const w = engine.swingCheck(s)
    expect(w.outputSpan[0]).toBeCloseTo(11 - 1, 12)
    expect(w.outputSpan[1]).toBeCloseTo(11 + 10, 12)
    // DESIGN §4.6: the rails at the low end of supply-tolerance (5 %): 12 V → 11.4 V.
    expect(w.allowed[0]).toBeCloseTo(1, 12)
    expect(w.allowed[1]).toBeCloseTo(10.4, 12)
    expect(w.excess[0]).toBe(0)
    expect(w.excess[1]).toBeCloseTo(10.6, 12)
    expect(w.fits).toBe(false)
  })
  it('fits a noninverting stage inside the rails', () => {
    expect(engine.swingCheck(stageInput()).fits).toBe(true)
  })
})

describe('public API', () => {
  it('exposes the engine entry points', () => {
    for (const name of ['evaluateStage', 'dcBudget', 'noiseBudget', 'loopGain', 'closedLoopGain', 'topologyTerms', 'stageNetlist', 'buildNetlist', 'createWorkspace', 'solveClosed', 'solveLoop', 'solveInPlace', 'noiseTransfers', 'suggestCf', 'TOPOLOGY_MODELS', 'ARCHETYPES']) {
      expect(engine).toHaveProperty(name)
    }
  })
})
