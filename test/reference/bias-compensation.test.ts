/**
 * The bias-current compensation resistor (DESIGN §4.2): Rcomp = Rf ∥ Rg.
 */
import {describe, expect, it} from 'vitest'
import {dcBudget, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

const term = (s: StageInput, key: string): number => dcBudget(s).contributors.find((c) => c.key === key)?.output ?? NaN

describe('Rcomp = Rf ∥ Rg in a noninverting stage', () => {
  const rf = 100e3
  const rg = 10e3
  const par = (rf * rg) / (rf + rg)
  const op = testOpamp({ib: 20e-9, ios: 2e-9})

  // Common practice: with matched DC resistances the bias-current term vanishes and the
  // offset-current error is IOS·Rf. Tolerances: 1e-12 relative (rounding of Rf ∥ Rg).
  it('with exact resistors, the ib term vanishes (common practice)', () => {
    const s = stageInput({opamp: op, rf: res(rf), rg: res(rg), rs: null, rcomp: res(par), temperature: [25, 25]})
    expect(term(s, 'ib')).toBeLessThan(1e-12 * 20e-9 * rf)
  })
  it('with exact resistors, the offset-current error is IOS·Rf (common practice)', () => {
    const s = stageInput({opamp: op, rf: res(rf), rg: res(rg), rs: null, rcomp: res(par), temperature: [25, 25]})
    expect(Math.abs(term(s, 'ios') / (2e-9 * rf) - 1)).toBeLessThan(1e-12)
  })
  // Common practice ("a matched rcomp still leaves IB times its mismatch", DESIGN §4.2): with
  // every resistor at tolerance t, the worst mismatch is Rn(1 + t) − Rcomp(1 − t) = 2t·Rn,
  // so the ib term is IB·2t·Rn·NG = 2t·IB·Rf. Tolerance 1e-9 (rounding).
  it.each([0.001, 0.01])('with %d tolerance, the ib term is IB × the worst mismatch × NG', (t) => {
    const s = stageInput({opamp: op, rf: res(rf, t), rg: res(rg, t), rs: null, rcomp: res(par, t), temperature: [25, 25]})
    expect(Math.abs(term(s, 'ib') / (2 * t * 20e-9 * rf) - 1)).toBeLessThan(1e-9)
  })
  // DESIGN §4.2: tolerance and tempco move the resistors together for the ib term.
  it('adds tempco·ΔT to the tolerance for the ib term', () => {
    const s = stageInput({opamp: op, rf: res(rf, 0.001, 50e-6), rg: res(rg, 0.001, 50e-6), rs: null, rcomp: res(par, 0.001, 50e-6), temperature: [25, 85]})
    const spread = 0.001 + 50e-6 * 60
    expect(Math.abs(term(s, 'ib') / (2 * spread * 20e-9 * rf) - 1)).toBeLessThan(1e-9)
  })
})
