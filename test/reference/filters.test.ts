/**
 * Low-pass figures (DESIGN §8.4) against the closed forms of the standard active-filter
 * texts (from memory), with a near-ideal op-amp (GBW 10 GHz, Aol 160 dB, no second pole, no
 * input capacitance) so that the op-amp moves f0 and Q by far less than the 0.5 % allowed.
 */
import {describe, expect, it} from 'vitest'
import {evaluateStage, filterFigures} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

const ideal = testOpamp({gbw: 10e9, aol: 1e8, pmUnity: 90, cinCm: 0, cinDiff: 0})
const cap = (value: number) => ({value, tolerance: 0.05})
const within = (actual: number | null, expected: number, rel: number): void => {
  expect(actual).not.toBeNull()
  expect(Math.abs((actual as number) / expected - 1)).toBeLessThan(rel)
}

describe('Sallen-Key low-pass vs closed forms (standard active-filter texts, from memory)', () => {
  // Unity gain: f0 = 1/(2π√(R1R2C1C2)), Q = √(R1R2C1C2)/(C2(R1 + R2)), H0 = 1.
  const cases = [
    {r1: 10e3, r2: 10e3, c1: 22e-9, c2: 10e-9},
    {r1: 4.7e3, r2: 33e3, c1: 100e-9, c2: 2.2e-9},
    {r1: 1e3, r2: 1e3, c1: 1e-6, c2: 1e-6}
  ]
  it.each(cases)('unity gain r1 $r1, r2 $r2, c1 $c1, c2 $c2: f0, Q, H0 within 0.5 %', ({r1, r2, c1, c2}) => {
    const s = stageInput({topology: 'lowpass-sallen-key', opamp: ideal, rf: null, rg: null, rs: null, cstray: 0, r1: res(r1), r2: res(r2), c1: cap(c1), c2: cap(c2)})
    const f = filterFigures(s)
    const p = r1 * r2 * c1 * c2
    within(f?.f0 ?? null, 1 / (2 * Math.PI * Math.sqrt(p)), 0.005)
    within(f?.q ?? null, Math.sqrt(p) / (c2 * (r1 + r2)), 0.005)
    within(f?.passbandGain ?? null, 1, 0.005)
  })
  it('with rf/rg: passband gain 1 + rf/rg (noninverting gain, common practice)', () => {
    const s = stageInput({topology: 'lowpass-sallen-key', opamp: ideal, rf: res(15e3), rg: res(10e3), rs: null, cstray: 0, r1: res(10e3), r2: res(10e3), c1: cap(10e-9), c2: cap(10e-9)})
    const f = filterFigures(s)
    within(f?.passbandGain ?? null, 2.5, 0.005)
    // Equal-component Sallen-Key with gain K: Q = 1/(3 − K) (standard texts, from memory).
    within(f?.q ?? null, 1 / (3 - 2.5), 0.005)
    within(f?.f0 ?? null, 1 / (2 * Math.PI * 10e3 * 10e-9), 0.005)
  })
})

describe('MFB low-pass vs closed forms (standard active-filter texts, from memory)', () => {
  // H0 = −R2/R1, f0 = 1/(2π√(R2R3C1C2)) with C1 the feedback capacitor and C2 to ground;
  // Q = √(R2R3C1C2)·… written as ω0·C1·R2R3/(R2 + R3 + R2R3/R1)… see the per-case check below.
  const cases = [
    {r1: 10e3, r2: 10e3, r3: 10e3, c1: 1e-9, c2: 10e-9},
    {r1: 4.7e3, r2: 22e3, r3: 6.8e3, c1: 470e-12, c2: 47e-9}
  ]
  it.each(cases)('r1 $r1, r2 $r2, r3 $r3, c1 $c1, c2 $c2: f0 and H0 within 0.5 %', ({r1, r2, r3, c1, c2}) => {
    const s = stageInput({topology: 'lowpass-mfb', opamp: ideal, rf: null, rg: null, rs: null, cstray: 0, r1: res(r1), r2: res(r2), r3: res(r3), c1: cap(c1), c2: cap(c2)})
    const f = filterFigures(s)
    const w0 = 1 / Math.sqrt(r2 * r3 * c1 * c2)
    within(f?.f0 ?? null, w0 / (2 * Math.PI), 0.005)
    within(f?.passbandGain ?? null, -r2 / r1, 0.005)
    // Denominator s² + s·(1/C2)(1/R1 + 1/R2 + 1/R3) + 1/(R2R3C1C2) (from memory): Q = ω0·C2/(1/R1 + 1/R2 + 1/R3).
    within(f?.q ?? null, (w0 * c2) / (1 / r1 + 1 / r2 + 1 / r3), 0.005)
  })
  it('filter is null for the other topologies, and the JSON carries it for low-pass stages', () => {
    expect(evaluateStage(stageInput()).filter).toBeNull()
    const s = stageInput({topology: 'lowpass-mfb', rf: null, rg: null, rs: null, r1: res(10e3), r2: res(10e3), r3: res(10e3), c1: cap(1e-9), c2: cap(10e-9)})
    expect(evaluateStage(s).filter).toMatchObject({f0: expect.any(Number), q: expect.any(Number), passbandGain: expect.any(Number)})
  })
})
