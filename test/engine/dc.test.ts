/**
 * The DC error budget (DESIGN §4.2): keys, each formula against its closed form, totals.
 */
import {describe, expect, it} from 'vitest'
import {DC_KEYS, dcBudget, topologyTerms, type DcKey, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp, topologyFixtures} from './helpers.js'

const term = (s: StageInput, key: DcKey): number => dcBudget(s).contributors.find((c) => c.key === key)?.output ?? NaN
const rel = (a: number, b: number): number => Math.abs(a / b - 1)

describe('dcBudget()', () => {
  it.each(topologyFixtures().map((s) => [s.topology, s] as const))('%s lists every applicable key once, zero or not', (topology, s) => {
    const keys = dcBudget(s).contributors.map((c) => c.key)
    // gain-error and nonlinearity are the instrumentation block's own terms (DESIGN §8.2).
    const opampKeys = DC_KEYS.filter((k) => k !== 'gain-error' && k !== 'nonlinearity')
    const expected = topology === 'transimpedance' ? opampKeys : opampKeys.filter((k) => k !== 'idark')
    expect(keys).toEqual(expected)
  })

  it('lists the tolerance key as 0 when no resistor carries a tolerance', () => {
    const s = stageInput({rf: res(20e3), rg: res(1e3)})
    expect(term(s, 'resistor-tolerance')).toBe(0)
    expect(term(s, 'resistor-tempco')).toBe(0)
  })

  // DESIGN §4.2 table, evaluated by hand for the fixture (NG = 21, ΔT = 45 K).
  it('vos and vos-drift are vos·NG and drift·ΔT·NG', () => {
    const s = stageInput()
    expect(rel(term(s, 'vos'), 75e-6 * 21)).toBeLessThan(1e-12)
    expect(rel(term(s, 'vos-drift'), 0.8e-6 * 45 * 21)).toBeLessThan(1e-12)
  })
  it('cmrr uses the + input range against the supply midpoint, or vcm-ref', () => {
    const s = stageInput({input: [0.5, 2], supply: [0, 5], opamp: testOpamp({cmrr: 1e5})})
    expect(rel(term(s, 'cmrr'), (21 * 2) / 1e5)).toBeLessThan(1e-12) // |0.5 − 2.5| = 2
    const r = stageInput({input: [0.5, 2], supply: [0, 5], opamp: testOpamp({cmrr: 1e5, vcmRef: 1})})
    expect(rel(term(r, 'cmrr'), (21 * 1) / 1e5)).toBeLessThan(1e-12)
  })
  it('cmrr of an inverting stage uses vref', () => {
    const s = stageInput({topology: 'inverting', vref: 2, supply: [-5, 5], opamp: testOpamp({cmrr: 1e5})})
    const ng = topologyTerms(s).noiseGain
    expect(rel(term(s, 'cmrr'), (ng * 2) / 1e5)).toBeLessThan(1e-12)
  })
  it('psrr is NG·span·tolerance/PSRR', () => {
    const s = stageInput({supply: [-12, 12], supplyTolerance: 0.05, opamp: testOpamp({psrr: 1e5})})
    expect(rel(term(s, 'psrr'), (21 * 24 * 0.05) / 1e5)).toBeLessThan(1e-12)
  })
  it('aol-gain is Vfs·NG/(Aol + NG)', () => {
    const s = stageInput({input: [-0.1, 0.2], opamp: testOpamp({aol: 1e5})})
    expect(rel(term(s, 'aol-gain'), (21 * 0.2 * 21) / (1e5 + 21))).toBeLessThan(1e-12)
  })
  // Closed form: G = 1 + Rf/Rg is largest at Rf(1 + t)/Rg(1 − t).
  it('resistor-tolerance takes the worst gain corner', () => {
    const t = 0.01
    const s = stageInput({rf: res(20e3, t), rg: res(1e3, t), input: [0, 0.1]})
    const worst = (1 + (20 * (1 + t)) / (1 - t)) / 21 - 1
    expect(rel(term(s, 'resistor-tolerance'), 21 * 0.1 * worst)).toBeLessThan(1e-9)
  })
  it('resistor-tempco moves each resistor by ±tempco·ΔT', () => {
    const s = stageInput({rf: res(20e3, 0, 100e-6), rg: res(1e3, 0, 0), temperature: [25, 75], input: [0, 0.1]})
    expect(rel(term(s, 'resistor-tempco'), 21 * 0.1 * ((20 * 100e-6 * 50) / 21))).toBeLessThan(1e-9)
  })
  it('inverting resistor-tolerance includes rs in the gain', () => {
    const s = stageInput({topology: 'inverting', rf: res(10e3), rg: res(1e3), rs: res(1e3, 0.01), input: [0, 0.1]})
    // G = −Rf/(Rg + Rs): worst when Rs is low, |G'/G − 1| = 2000/1990 − 1.
    expect(rel(term(s, 'resistor-tolerance'), 5 * 0.1 * (2000 / 1990 - 1))).toBeLessThan(1e-9)
  })
  it('idark is Idark,max·Rf for transimpedance, doubled every idark-doubling above 25 °C', () => {
    // DESIGN §4.2: Idark,max = idark·2^(max(0, Tmax − 25)/idark-doubling); the fixture runs to 70 °C.
    const s = topologyFixtures()[3]
    expect(rel(term(s, 'idark'), 50e-12 * 2 ** (45 / 10) * 1e6)).toBeLessThan(1e-12)
    expect(rel(term({...s, idarkDoubling: 5}, 'idark'), 50e-12 * 2 ** (45 / 5) * 1e6)).toBeLessThan(1e-12)
    expect(rel(term({...s, idarkMax: 3e-9}, 'idark'), 3e-9 * 1e6)).toBeLessThan(1e-12)
  })
  it('totals: worst = Σ, RSS = √Σ², input-referred = ÷|G|', () => {
    const b = dcBudget(topologyFixtures()[1])
    const sum = b.contributors.reduce((a, c) => a + c.output, 0)
    const rss = Math.sqrt(b.contributors.reduce((a, c) => a + c.output ** 2, 0))
    expect(rel(b.worstCaseOutput, sum)).toBeLessThan(1e-12)
    expect(rel(b.rssOutput, rss)).toBeLessThan(1e-12)
    expect(rel(b.worstCaseInput, sum / (47e3 / 4.9e3))).toBeLessThan(1e-12) // |G| = 47k/(4.7k + 200)
  })
})
