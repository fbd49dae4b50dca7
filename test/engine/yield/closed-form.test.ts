/**
 * The closed forms of the Monte Carlo (src/engine/yield/closed-form.ts) against the project's
 * nodal DC solve (src/engine/dc/solve.ts, modified nodal analysis of the topology's own
 * netlist) for random resistor draws and random sources: an independent derivation by hand
 * checked against a general linear solve of the same circuit.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {solveStageDc} from '../../../src/engine/dc/solve.js'
import {RESISTOR_KEYS, nominalResistors} from '../../../src/engine/topology/index.js'
import type {StageInput} from '../../../src/engine/types.js'
import {closedFormOf, signalFormOf} from '../../../src/engine/yield/closed-form.js'
import {res, stageFrom} from '../../support/stage-input.js'

/** One stage of every topology with a closed form, each with all its optional resistors present. */
export const CLOSED_FORM_STAGES: Record<string, () => StageInput> = {
  noninverting: () => stageFrom('engine', {rcomp: res(470, 0.01), rs: res(500, 0.01)}),
  'noninverting-loaded': () => stageFrom('engine', {riso: res(47, 0.01), rload: 2e3}),
  inverting: () => stageFrom('engine', {topology: 'inverting', rcomp: res(900, 0.01), vref: 1.2}),
  follower: () => stageFrom('engine', {topology: 'follower', rg: null, rf: res(10e3, 0.01), rcomp: res(2e3, 0.01)}),
  'follower-wire': () => stageFrom('engine', {topology: 'follower', rg: null, rf: null}),
  transimpedance: () =>
    stageFrom('engine', {topology: 'transimpedance', rg: null, rs: null, rf: res(1e6, 0.001), rshunt: 50e6, rcomp: res(1e6, 0.01), vref: 0.5, input: [0, 1e-6], idark: 2e-9}),
  difference: () =>
    stageFrom('engine', {
      topology: 'difference', rf: res(40e3, 0.001), rg: res(10e3, 0.001), rp: res(10e3, 0.001), rref: res(40e3, 0.001), rs: res(50, 0.01),
      vref: 2.5, inputCm: [-2, 4], input: [-0.1, 0.1]
    }),
  'lowpass-sallen-key': () =>
    stageFrom('engine', {topology: 'lowpass-sallen-key', rs: null, r1: res(10e3, 0.01), r2: res(22e3, 0.01), c1: {value: 10e-9, tolerance: 0}, c2: {value: 4.7e-9, tolerance: 0}}),
  'lowpass-mfb': () =>
    stageFrom('engine', {
      topology: 'lowpass-mfb', rf: null, rg: null, rs: null, r1: res(10e3, 0.01), r2: res(20e3, 0.01), r3: res(5e3, 0.01), rcomp: res(3e3, 0.01),
      c1: {value: 1e-9, tolerance: 0}, c2: {value: 10e-9, tolerance: 0}, vref: 1.0
    })
}

describe('closed-form DC output vs the nodal DC solve', () => {
  for (const [name, make] of Object.entries(CLOSED_FORM_STAGES)) {
    it(`${name}: equal for random resistors and sources (relative 1e-9)`, () => {
      const input = make()
      const form = closedFormOf(input)
      expect(form).not.toBeNull()
      const nom = nominalResistors(input)
      fc.assert(
        fc.property(
          fc.array(fc.double({min: -0.2, max: 0.2, noNaN: true}), {minLength: RESISTOR_KEYS.length, maxLength: RESISTOR_KEYS.length}),
          fc.double({min: -1, max: 1, noNaN: true}),
          fc.double({min: -3, max: 3, noNaN: true}),
          fc.double({min: -1e-3, max: 1e-3, noNaN: true}),
          fc.double({min: -1e-6, max: 1e-6, noNaN: true}),
          fc.double({min: -1e-6, max: 1e-6, noNaN: true}),
          (moves, xs, cm, vos, ibP, ibM) => {
            const r = new Float64Array(RESISTOR_KEYS.length)
            const values: Record<string, number> = {}
            RESISTOR_KEYS.forEach((k, i) => {
              const n = nom[k]
              // rshunt is a fixed value (no tolerance): it keeps its nominal, as in the Monte Carlo.
              const v = k === 'rshunt' || !(n > 0) || !Number.isFinite(n) ? n : n * (1 + (moves[i] as number))
              r[i] = v
              values[k] = v
            })
            const x = input.topology === 'transimpedance' ? xs * 1e-6 : xs
            const want = solveStageDc(input, values, {input: x, inputCm: cm, vos, ibPlus: ibP, ibMinus: ibM}).vout
            const got = form!(r, x, input.topology === 'difference' ? cm : 0, input.vref, vos, ibP, ibM)
            expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(want)))
          }
        ),
        {numRuns: 300, seed: 12}
      )
    })
  }

  it('instrumentation has no closed form (yield unavailable, not a wrong number)', () => {
    expect(closedFormOf(stageFrom('engine', {topology: 'instrumentation'}))).toBeNull()
    expect(signalFormOf(stageFrom('engine', {topology: 'instrumentation'}))).toBeNull()
  })
})

describe('signal form (every input end at once) vs the closed form, bit for bit', () => {
  // The trial loop's resistor terms come from the signal form: it must give the closed form's
  // own bytes (signed zeros included), or the Monte Carlo's errors would change.
  const sameBits = (a: number, b: number): boolean => Object.is(a, b)
  for (const [name, make] of Object.entries(CLOSED_FORM_STAGES)) {
    it(`${name}: form(r, x, cm, vref, 0, 0, 0) − nominal, equal bytes`, () => {
      const input = make()
      const form = closedFormOf(input)!
      const signal = signalFormOf(input)!
      const nom = nominalResistors(input)
      const edge = fc.constantFrom(0, -0, 1e-300, -1e-300, 1, -1)
      const value = fc.oneof(edge, fc.double({min: -5, max: 5, noNaN: true}))
      fc.assert(
        fc.property(
          fc.array(fc.double({min: -0.2, max: 0.2, noNaN: true}), {minLength: RESISTOR_KEYS.length, maxLength: RESISTOR_KEYS.length}),
          fc.array(fc.tuple(value, value, value), {minLength: 1, maxLength: 4}),
          fc.oneof(edge, fc.double({min: -3, max: 3, noNaN: true})),
          (moves, ends, vref) => {
            const r = Float64Array.from(RESISTOR_KEYS, (k, i) => {
              const n = nom[k]
              return k === 'rshunt' || !(n > 0) || !Number.isFinite(n) ? n : n * (1 + (moves[i] as number))
            })
            const xs = Float64Array.from(ends, (e) => e[0])
            const cms = Float64Array.from(ends, (e) => e[1])
            const nominal = Float64Array.from(ends, (e) => e[2])
            const out = new Float64Array(ends.length)
            signal(r, xs, cms, vref, nominal, out)
            ends.forEach((_, p) => {
              const want = form(r, xs[p]!, cms[p]!, vref, 0, 0, 0) - nominal[p]!
              if (!sameBits(out[p]!, want)) expect.fail(`end ${p}: ${out[p]} vs ${want}`)
            })
          }
        ),
        {numRuns: 500, seed: 7}
      )
    })
  }
})
