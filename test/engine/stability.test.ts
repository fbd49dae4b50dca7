/**
 * Stability figures (DESIGN §4.4): the transimpedance Cf suggestion and null handling.
 */
import {describe, expect, it} from 'vitest'
import {loopGain, stabilityAnalysis, suggestCf, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp, topologyFixtures} from './helpers.js'

const tia = (overrides: Partial<StageInput> = {}): StageInput =>
  stageInput({topology: 'transimpedance', rf: res(10e6), rg: null, rs: null, rshunt: 1e9, csource: 47e-12, cf: 0, input: [0, 1e-7], ...overrides})
const pmWith = (s: StageInput, cf: number): number | null => stabilityAnalysis({...s, cf}).stability.phaseMargin

describe('suggestCf()', () => {
  it('returns the smallest Cf giving 60°: PM(Cf) ≈ 60° and a slightly smaller Cf falls short', () => {
    const s = tia()
    const cf = suggestCf(s) as number
    expect(cf).toBeGreaterThan(0)
    expect(Math.abs((pmWith(s, cf) as number) - 60)).toBeLessThan(0.01)
    expect(pmWith(s, cf * 0.99) as number).toBeLessThan(60)
  })
  it('ignores the stage’s own cf', () => {
    expect(suggestCf(tia({cf: 10e-12}))).toBeCloseTo(suggestCf(tia()) as number, 18)
  })
  it('returns 0 when Cf = 0 already gives 60°', () => {
    // Low Rf and almost no input capacitance: β ≈ 1, PM ≈ pm-unity (70°).
    const s = tia({rf: res(1e3), csource: 0, cstray: 0, rshunt: null, opamp: testOpamp({pmUnity: 70, cinCm: 0, cinDiff: 0})})
    expect(suggestCf(s)).toBe(0)
  })
  it('returns null when no Cf up to 1 µF reaches 60°', () => {
    // pm-unity 20° with Rf = 100 kΩ: a Cf large enough to cancel the input pole puts the
    // crossover near the second pole, so the margin peaks near 28° (a scan confirms it).
    const s = tia({rf: res(100e3), opamp: testOpamp({pmUnity: 20})})
    expect(suggestCf(s)).toBeNull()
    for (let e = -15; e <= -6; e += 0.25) expect(pmWith(s, 10 ** e) ?? -Infinity).toBeLessThan(60)
  })
  it('can exceed pm-unity at an intermediate Cf (crossover well below the second pole)', () => {
    const s = tia({opamp: testOpamp({pmUnity: 30})})
    const cf = suggestCf(s) as number
    expect(Math.abs((pmWith(s, cf) as number) - 60)).toBeLessThan(0.01)
  })
  it.each(topologyFixtures().filter((s) => s.topology !== 'transimpedance').map((s) => [s.topology, s] as const))('is null for %s stages', (_, s) => {
    expect(stabilityAnalysis(s).stability.suggestedCf).toBeNull()
  })
})

describe('stabilityAnalysis()', () => {
  it('gives null crossover and margin when |T| never reaches 1', () => {
    // NG = 10⁶ against Aol = 10⁵: T(0) = 0.1.
    const st = stabilityAnalysis(stageInput({rf: res(1e9), rg: res(1e3), opamp: testOpamp({aol: 1e5})})).stability
    expect(st.crossover).toBeNull()
    expect(st.phaseMargin).toBeNull()
  })
  it('reports a loop-gain magnitude of 1 at the crossover (loop broken at the output source)', () => {
    const s = topologyFixtures()[1]
    const fc = stabilityAnalysis(s).stability.crossover as number
    const t = loopGain(s, fc)
    expect(Math.abs(Math.hypot(t.re, t.im) - 1)).toBeLessThan(1e-6)
  })
  it('unwraps the loop phase from DC (monotone for a two-pole loop)', () => {
    const c = stabilityAnalysis(stageInput()).curves
    expect(Math.abs(c.loopGainPhase[0])).toBeLessThan(5)
    expect(c.loopGainPhase.at(-1) as number).toBeLessThan(-180)
    expect(c.frequency.length).toBeLessThanOrEqual(300)
  })
})
