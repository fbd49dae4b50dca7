/**
 * The difference amplifier (DESIGN §8.1): network CMRR against the trade's rule of thumb and
 * against the exact corner value of the §8.1 transfer, the common-mode error in the resistor
 * terms, the cmrr term from the + pin's voltage, and the load divider at DC.
 */
import {describe, expect, it} from 'vitest'
import {dcBudget, evaluateStage, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

/** A four-resistor difference stage of gain rf/rg, all parts of tolerance t. */
const diff = (rg: number, rf: number, t: number, over: Partial<StageInput> = {}): StageInput =>
  stageInput({
    topology: 'difference', rf: res(rf, t), rg: res(rg, t), rp: res(rg, t), rref: res(rf, t), rs: null, rcomp: null,
    input: [-0.1, 0.1], inputCm: [5, 5], opamp: testOpamp(), temperature: [25, 25], ...over
  })

/** Acm of the §8.1 transfer (ideal op-amp, rs = 0): rref/(rp + rref)·(1 + rf/rg) − rf/rg. */
const acm = (rf: number, rg: number, rp: number, rref: number): number => (rref / (rp + rref)) * (1 + rf / rg) - rf / rg

describe('network CMRR (DESIGN §8.1)', () => {
  const cases = [
    {g: 1, t: 0.001},
    {g: 10, t: 0.001},
    {g: 100, t: 0.01},
    {g: 2, t: 0.0005}
  ]
  it.each(cases)('G = $g, t = $t: within 10 % of (1 + G)/(4t) (common practice, from memory)', ({g, t}) => {
    const b = dcBudget(diff(10e3, g * 10e3, t))
    const ratio = 10 ** ((b.networkCmrr as number) / 20)
    expect(Math.abs(ratio / ((1 + g) / (4 * t)) - 1)).toBeLessThan(0.1)
  })
  it.each(cases)('G = $g, t = $t: exactly the worst of the 16 corners of the §8.1 transfer', ({g, t}) => {
    const rg = 10e3
    const rf = g * rg
    let worst = 0
    for (let c = 0; c < 16; c++) {
      const k = (bit: number): number => ((c >> bit) & 1 ? 1 + t : 1 - t)
      worst = Math.max(worst, Math.abs(acm(rf * k(0), rg * k(1), rg * k(2), rf * k(3))))
    }
    const b = dcBudget(diff(rg, rf, t))
    expect(b.networkCmrr as number).toBeCloseTo(20 * Math.log10(g / worst), 9)
  })
  it('is null without tolerances and for other topologies', () => {
    expect(dcBudget(diff(10e3, 10e3, 0)).networkCmrr).toBeNull()
    expect(dcBudget(stageInput()).networkCmrr).toBeNull()
  })
})

describe('difference DC terms from the DC solve', () => {
  it('the resistor-tolerance term carries the common mode the mismatch lets through', () => {
    // Zero differential input, 5 V common mode, vref 0: the whole term is vcm·|Acm,worst| = 5·G/CMRR.
    const s = diff(10e3, 10e3, 0.001, {input: [0, 0]})
    const b = dcBudget(s)
    const term = b.contributors.find((c) => c.key === 'resistor-tolerance')?.output as number
    expect(term).toBeCloseTo((5 * 1) / 10 ** ((b.networkCmrr as number) / 20), 12)
  })
  it('the cmrr term uses the + pin over both ends of input and input-cm (divider of §8.1)', () => {
    const s = diff(10e3, 40e3, 0, {inputCm: [1, 9], input: [-0.5, 0.5], vref: 2.5, supply: [0, 12]})
    const b = dcBudget(s)
    // + pin = V+·rref/(rp + rref) + vref·rp/(rp + rref), V+ = vcm + vd/2; Vcm,ref = supply midpoint 6 V.
    const pins = [1, 9].flatMap((cm) => [-0.5, 0.5].map((vd) => (cm + vd / 2) * 0.8 + 2.5 * 0.2))
    const dv = Math.max(...pins.map((v) => Math.abs(v - 6)))
    // Output-referred by the noise gain 1 + rf/rg = 5 (vos-like source, DESIGN §4.2).
    expect(b.contributors.find((c) => c.key === 'cmrr')?.output).toBeCloseTo((dv / s.opamp.cmrr) * 5, 15)
  })
  it('gain at the load node includes the riso–rload divider (DESIGN §8.3)', () => {
    const s = diff(10e3, 20e3, 0, {riso: res(100), rload: 900})
    expect(evaluateStage(s).gain).toBeCloseTo(2 * 0.9, 12)
  })
})
