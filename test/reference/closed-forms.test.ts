/**
 * The nodal engine against the closed forms of DESIGN §4.3, which hold when all capacitance
 * is lumped at the − pin and the + pin is at AC ground: with Zf = Rf ∥ 1/(jωCf),
 * Zg = Rg,eff ∥ 1/(jωCn), β = Zg/(Zg + Zf), a voltage v at the + input reaches the output as
 * v·A/(1 + Aβ), and a current i into the − node as i·Zf·Aβ/(1 + Aβ) (negated: a current into
 * the − node drives the output negative, as DESIGN §3.3 says for transimpedance stages).
 */
import {describe, expect, it} from 'vitest'
import {noiseTransfers, opampPoles, openLoopGainInto, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

interface C {
  re: number
  im: number
}
const mul = (a: C, b: C): C => ({re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re})
const div = (a: C, b: C): C => {
  const d = b.re * b.re + b.im * b.im
  return {re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d}
}
const add = (a: C, b: C): C => ({re: a.re + b.re, im: a.im + b.im})
const inv = (a: C): C => div({re: 1, im: 0}, a)
/** R ∥ C as an impedance; R = Infinity for none. */
const zRc = (r: number, c: number, w: number): C => inv({re: r === Infinity ? 0 : 1 / r, im: w * c})

function closedForms(s: StageInput, rgEff: number, cn: number, f: number): {v: C; i: C} {
  const w = 2 * Math.PI * f
  const buf = new Float64Array(2)
  openLoopGainInto(opampPoles(s.opamp), f, buf)
  const a = {re: buf[0], im: buf[1]}
  const zf = zRc(s.rf?.value ?? 0, s.cf, w)
  const zg = zRc(rgEff, cn, w)
  const beta = div(zg, add(zg, zf))
  const ab = mul(a, beta)
  const loop = add({re: 1, im: 0}, ab)
  const iForm = mul(zf, div(ab, loop))
  return {v: div(a, loop), i: {re: -iForm.re, im: -iForm.im}}
}

// No capacitance at the + pin; cin-cm only adds to the − pin through cstray below.
const lumped = testOpamp({cinCm: 0, cinDiff: 0})
const cases: [string, StageInput, number, number][] = [
  ['noninverting', stageInput({opamp: lumped, rs: null, rcomp: null, cf: 3.3e-12, cstray: 8e-12}), 1e3, 8e-12],
  ['inverting', stageInput({topology: 'inverting', opamp: lumped, rs: res(300), rcomp: null, cf: 10e-12, cstray: 5e-12}), 1.3e3, 5e-12],
  ['transimpedance', stageInput({topology: 'transimpedance', opamp: lumped, rf: res(2e6), rg: null, rs: null, rshunt: 50e6, csource: 20e-12, cstray: 1e-12, cf: 1e-12}), 50e6, 21e-12]
]

describe('closed forms with capacitance lumped at the − pin (DESIGN §4.3, analytic)', () => {
  for (const [name, s, rgEff, cn] of cases) {
    it.each([1, 100, 1e4, 3e5, 2e6])(`${name}: en and in− transfers match at %d Hz (1e-9 relative)`, (f) => {
      const t = Object.fromEntries(noiseTransfers(s, f).map((x) => [x.key, x.transfer]))
      const want = closedForms(s, rgEff, cn, f)
      // Tolerance 1e-9: same algebra in two forms, rounding only.
      const near = (got: C | undefined, exp: C): void => {
        expect(got).toBeDefined()
        const scale = Math.hypot(exp.re, exp.im)
        expect(Math.hypot((got as C).re - exp.re, (got as C).im - exp.im)).toBeLessThan(1e-9 * scale)
      }
      near(t['en'], want.v)
      near(t['in-'], want.i)
    })
  }
})
