/**
 * Calibration (DESIGN §4.6): the residual of each term on a stage where each is known by
 * hand, and the properties residual ≤ uncalibrated, offset-and-gain ≤ offset.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {dcBudget, type Calibration, type DcKey, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from './helpers.js'

const rel = (a: number, b: number): number => Math.abs(a / b - 1)

describe('calibration residuals, by hand', () => {
  // Noninverting, Rf = 10 kΩ, Rg = 1 kΩ (NG = 11), no rs: Rn = Rf ∥ Rg, Rp = 0, so the ib term is
  // IB·Rn·NG = IB·Rf at the worst corner (Rf high by its 0.1 %): hand formula, DESIGN §4.2.
  const s = stageInput({
    rf: res(10e3, 0.001), rg: res(1e3, 0.001), rs: null, input: [-0.5, 0.5], temperature: [-15, 65],
    opamp: testOpamp({vos: 100e-6, vosDrift: 1e-6, ib: 2e-9, ibMax: 5e-9, ios: 1e-9, iosMax: 3e-9})
  })
  const rn = (10e3 * 1e3) / 11e3
  const row = (c: Calibration, key: DcKey): number => {
    const b = dcBudget({...s, calibration: c})
    return (c === 'none' ? b.contributors : b.calibrated!.contributors).find((x) => x.key === key)!.output
  }
  it('no calibration: dc.calibrated is null', () => {
    expect(dcBudget(s).calibrated).toBeNull()
  })
  it('offset removes vos; ib, ios keep only their rise over 25 °C; the rest remain', () => {
    expect(row('offset', 'vos')).toBe(0)
    expect(rel(row('offset', 'ib'), (5e-9 - 2e-9) * 10e3 * 1.001)).toBeLessThan(1e-9)
    expect(rel(row('none', 'ib'), 5e-9 * 10e3 * 1.001)).toBeLessThan(1e-9)
    expect(rel(row('offset', 'ios'), ((3e-9 - 1e-9) / 2) * rn * 11)).toBeLessThan(1e-9)
    expect(rel(row('offset', 'vos-drift'), 1e-6 * 40 * 11)).toBeLessThan(1e-9)
    for (const key of ['resistor-tolerance', 'aol-gain', 'cmrr', 'psrr', 'resistor-tempco'] as const) expect(row('offset', key)).toBe(row('none', key))
  })
  it('offset-and-gain also removes resistor-tolerance, aol-gain and cmrr; drift, tempco and psrr remain', () => {
    for (const key of ['vos', 'resistor-tolerance', 'aol-gain', 'cmrr'] as const) expect(row('offset-and-gain', key)).toBe(0)
    for (const key of ['vos-drift', 'resistor-tempco', 'psrr'] as const) expect(row('offset-and-gain', key)).toBe(row('none', key))
  })
  it('totals of the residuals: worst = Σ, RSS = √Σ², input-referred ÷ |G|', () => {
    const c = dcBudget({...s, calibration: 'offset'}).calibrated!
    const sum = c.contributors.reduce((a, x) => a + x.output, 0)
    expect(rel(c.worstCaseOutput, sum)).toBeLessThan(1e-12)
    expect(rel(c.rssOutput, Math.hypot(...c.contributors.map((x) => x.output)))).toBeLessThan(1e-12)
    expect(rel(c.worstCaseInput, sum / 11)).toBeLessThan(1e-9)
  })
  it('a transimpedance idark residual is (Idark,max − idark)·Rf', () => {
    const t = stageInput({topology: 'transimpedance', rf: res(1e6), rg: null, rs: null, idark: 1e-9, temperature: [0, 45], input: [0, 1e-6], calibration: 'offset'})
    const c = dcBudget(t).calibrated!.contributors.find((x) => x.key === 'idark')!.output
    expect(rel(c, (1e-9 * 4 - 1e-9) * 1e6)).toBeLessThan(1e-9) // 2^(20/10) = 4
  })
})

describe('calibration properties', () => {
  const ohms = fc.double({min: 100, max: 1e6, noNaN: true})
  const frac = fc.double({min: 0, max: 0.01, noNaN: true})
  const anyStage = fc.record({
    topology: fc.constantFrom('noninverting', 'inverting', 'transimpedance'), rf: ohms, rg: ohms, tol: frac, tc: fc.double({min: 0, max: 100e-6, noNaN: true}),
    vref: fc.double({min: -2, max: 2, noNaN: true}), ibRise: fc.double({min: 1, max: 10, noNaN: true})
  }).map((p): StageInput => {
    const opamp = testOpamp({ibMax: 3e-9 * p.ibRise, iosMax: 1.5e-9 * p.ibRise})
    if (p.topology === 'transimpedance') return stageInput({topology: 'transimpedance', opamp, rf: res(p.rf, p.tol, p.tc), rg: null, rs: null, vref: p.vref, idark: 1e-10, input: [0, 1e-6]})
    if (p.topology === 'inverting') return stageInput({topology: 'inverting', opamp, rf: res(p.rf, p.tol, p.tc), rg: res(p.rg, p.tol, p.tc), vref: p.vref})
    return stageInput({opamp, rf: res(p.rf, p.tol, p.tc), rg: res(p.rg, p.tol, p.tc)})
  })
  it('residual worst case ≤ uncalibrated worst case, and offset-and-gain ≤ offset', () => {
    fc.assert(fc.property(anyStage, (s) => {
      const none = dcBudget(s).worstCaseOutput
      const off = dcBudget({...s, calibration: 'offset'}).calibrated!.worstCaseOutput
      const gain = dcBudget({...s, calibration: 'offset-and-gain'}).calibrated!.worstCaseOutput
      expect(off).toBeLessThanOrEqual(none * (1 + 1e-12))
      expect(gain).toBeLessThanOrEqual(off * (1 + 1e-12))
    }), {numRuns: 50})
  })
})
