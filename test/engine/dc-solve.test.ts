/**
 * The DC solve and the terms read off it (DESIGN §4.2 revised): the reference term moves
 * with the resistors, Vout,ideal at both ends of the input range, the output current.
 * Each expected value is a hand calculation written out here (analytic), not the engine.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {dcBudget, idealOutput, nominalResistors, solveStageDc, type DcKey, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp, topologyFixtures} from './helpers.js'

const term = (s: StageInput, key: DcKey): number => dcBudget(s).contributors.find((c) => c.key === key)?.output ?? NaN
const rel = (a: number, b: number): number => Math.abs(a / b - 1)

/** Every ± corner of the listed fractional spreads. */
function corners(spreads: number[]): number[][] {
  const out: number[][] = []
  for (let c = 0; c < 1 << spreads.length; c++) out.push(spreads.map((s, i) => ((c >> i) & 1 ? 1 + s : 1 - s)))
  return out
}

describe('the reference term of an inverting stage (regression)', () => {
  // 10 kΩ feedback, 80 kΩ input, 0.1 % and 25 ppm/K parts, vref 1.111 V, ±10 V input, −25 … 75 °C (ΔT = 50 K).
  const s = stageInput({
    topology: 'inverting', rf: res(10e3, 0.001, 25e-6), rg: res(80e3, 0.001, 25e-6), rs: null, rcomp: null,
    vref: 1.111, input: [-10, 10], supply: [-15, 15], temperature: [-25, 75]
  })
  // Hand calculation: Vout = −(Rf/Rg)·Vin + Vref·(1 + Rf/Rg), worst over both input ends and the four corners.
  const vout = (vin: number, rf: number, rg: number): number => -(rf / rg) * vin + 1.111 * (1 + rf / rg)
  const worst = (spread: number): number => {
    let w = 0
    for (const vin of [-10, 10]) {
      for (const [a, b] of corners([spread, spread])) w = Math.max(w, Math.abs(vout(vin, 10e3 * a, 80e3 * b) - vout(vin, 10e3, 80e3)))
    }
    return w
  }
  it('resistor-tolerance is 2.78 mV, not the 2.50 mV of G·input alone', () => {
    expect(rel(term(s, 'resistor-tolerance'), worst(0.001))).toBeLessThan(1e-9)
    expect(term(s, 'resistor-tolerance')).toBeCloseTo(2.78053e-3, 7)
    // The signal part alone (vref 0) is the old figure.
    expect(term({...s, vref: 0}, 'resistor-tolerance')).toBeCloseTo(2.5025e-3, 7)
  })
  it('resistor-tempco is 3.48 mV, not 3.13 mV', () => {
    expect(rel(term(s, 'resistor-tempco'), worst(25e-6 * 50))).toBeLessThan(1e-9)
    expect(term(s, 'resistor-tempco')).toBeCloseTo(3.47653e-3, 7)
    expect(term({...s, vref: 0}, 'resistor-tempco')).toBeCloseTo(3.129e-3, 6)
  })
  it('fullScaleOutput and aol-gain carry the reference term: Vfs = max|Vout,ideal|, Vfs·NG/(Aol + NG)', () => {
    const vfs = Math.max(Math.abs(vout(-10, 10e3, 80e3)), Math.abs(vout(10, 10e3, 80e3)))
    const b = dcBudget(s)
    expect(rel(b.fullScaleOutput, vfs)).toBeLessThan(1e-12)
    const ng = 1 + 10e3 / 80e3
    const aol = s.opamp.aol
    expect(rel(term(s, 'aol-gain'), (vfs * ng) / (aol + ng))).toBeLessThan(1e-6)
  })
})

describe('DC solve: properties over topologies with a vref', () => {
  const ohms = fc.double({min: 100, max: 1e6, noNaN: true})
  const stage = fc.record({
    tia: fc.boolean(), rf: ohms, rg: ohms, rs: fc.option(ohms, {nil: null}), rshunt: fc.option(fc.double({min: 1e4, max: 1e9, noNaN: true}), {nil: null}),
    tol: fc.double({min: 1e-4, max: 0.02, noNaN: true}), vref: fc.double({min: -5, max: 5, noNaN: true}).filter((v) => Math.abs(v) > 1e-3)
  }).map((p): StageInput => p.tia
    ? stageInput({topology: 'transimpedance', rf: res(p.rf, p.tol), rg: null, rs: null, rshunt: p.rshunt, vref: p.vref, input: [0, 0]})
    : stageInput({topology: 'inverting', rf: res(p.rf, p.tol), rg: res(p.rg, p.tol), rs: p.rs === null ? null : res(p.rs, p.tol), vref: p.vref, input: [0, 0]}))
  // DESIGN §4.1's NG, by hand: inverting 1 + Rf/(Rg + Rs), transimpedance 1 + Rf/Rshunt.
  const ngOf = (s: StageInput, k: number[]): number => {
    const rf = s.rf!.value * k[0]
    if (s.topology === 'transimpedance') return s.rshunt === null ? 1 : 1 + rf / s.rshunt
    return 1 + rf / (s.rg!.value * k[1] + (s.rs?.value ?? 0) * (k[2] ?? 1))
  }
  it('at zero input the resistor term is |NG(corner) − NG|·|vref| at the worst corner', () => {
    fc.assert(fc.property(stage, (s) => {
      const spreads = [s.rf!.tolerance, ...(s.rg ? [s.rg.tolerance] : []), ...(s.rs ? [s.rs.tolerance] : [])]
      const ng = ngOf(s, [1, 1, 1])
      const expected = Math.max(...corners(spreads).map((k) => Math.abs(ngOf(s, k) - ng) * Math.abs(s.vref)))
      const got = term(s, 'resistor-tolerance')
      // Rounding of the solve: a few ulp of the output, NG·|vref|.
      expect(Math.abs(got - expected)).toBeLessThanOrEqual(1e-9 * expected + 1e-12 * ng * Math.abs(s.vref))
    }), {numRuns: 60})
  })
})

describe('DC solve: pins and output current', () => {
  it('an inverting stage holds both pins at vref; the output current is (Vout − vref)/Rf + Vout/rload', () => {
    const s = stageInput({topology: 'inverting', rf: res(20e3), rg: res(5e3), rs: null, vref: 2, input: [-1, 1], rload: 2e3})
    const r = nominalResistors(s)
    for (const vin of [-1, 1]) {
      const p = solveStageDc(s, r, {input: vin})
      const vout = -4 * vin + 2 * 5
      expect(p.vout).toBeCloseTo(vout, 12)
      expect(p.vplus).toBeCloseTo(2, 12)
      expect(p.vminus).toBeCloseTo(2, 12)
      expect(p.iout).toBeCloseTo((vout - 2) / 20e3 + vout / 2e3, 15)
    }
  })
  it('a noninverting stage: V+ = Vin, Vout = (1 + Rf/Rg)·Vin, current into Rf + Rg', () => {
    const s = stageInput({rf: res(9e3), rg: res(1e3), rs: res(500), input: [-0.5, 0.5]})
    const p = solveStageDc(s, nominalResistors(s), {input: 0.5})
    expect(p.vplus).toBeCloseTo(0.5, 12)
    expect(p.vout).toBeCloseTo(5, 12)
    expect(p.iout).toBeCloseTo(5 / 10e3, 15)
  })
  it('a transimpedance stage with vref: Vout = −Rf·I + vref·(1 + Rf/Rshunt)', () => {
    const s = stageInput({topology: 'transimpedance', rf: res(1e6), rg: null, rs: null, rshunt: 50e6, vref: 0.5, input: [0, 2e-6]})
    expect(idealOutput(s, 2e-6, nominalResistors(s))).toBeCloseTo(-2 + 0.5 * (1 + 1 / 50), 12)
  })
  it('every fixture: the finite-gain output is Vout,ideal·Aol/(Aol + NG) (single-loop feedback, analytic)', () => {
    for (const s0 of topologyFixtures()) {
      // Without a load (rout and rload change the loop's gain; the loaded case is checked against mathjs).
      const s = {...s0, riso: null, rload: null, opamp: testOpamp({aol: 1e4})}
      const r = nominalResistors(s)
      const ng = solveStageDc(s, r, {vos: 1, references: false}).vout
      for (const vin of s.input) {
        const ideal = idealOutput(s, vin, r)
        const finite = solveStageDc(s, r, {input: vin, aol: 1e4}).vout
        expect(Math.abs(finite - (ideal * 1e4) / (1e4 + ng))).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(ideal)))
      }
    }
  })
})
