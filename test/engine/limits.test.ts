/**
 * Physical limits as verdicts (DESIGN §4.6): each met and not met at its edge, skipped when
 * its data is missing; slew against the full-power bandwidth SR/(2πA) (analytic).
 */
import {describe, expect, it} from 'vitest'
import {checkLimits, evaluateStage, type LimitResult, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from './helpers.js'

const limit = (s: StageInput, key: LimitResult['key']): LimitResult => checkLimits(s).find((l) => l.key === key)!
/** The window limits (`output-swing`, `input-common-mode`): [low, high] value and limit. */
type Window = Extract<LimitResult, {value: [number, number]}>
const win = (s: StageInput, key: 'output-swing' | 'input-common-mode'): Window => limit(s, key) as Window
const EDGE = 1e-9

describe('output-swing', () => {
  // G = 11, ±1 V in → ±11 V out; ±12 V rails at 0 % tolerance: 1 V headroom is exactly the edge.
  const at = (h: number, tol = 0): StageInput => stageInput({rf: res(10e3), rg: res(1e3), rs: null, input: [-1, 1], supply: [-12, 12], supplyTolerance: tol, opamp: testOpamp({swingHeadroom: h})})
  it('met just inside the edge, not met just outside', () => {
    expect(limit(at(1 - EDGE), 'output-swing').met).toBe(true)
    expect(limit(at(1 + EDGE), 'output-swing').met).toBe(false)
  })
  it('takes the rails at the low end of supply-tolerance', () => {
    // 12 V at −5 % is 11.4 V: 0.4 V of headroom is the edge.
    expect(limit(at(0.4 - EDGE, 0.05), 'output-swing').met).toBe(true)
    expect(limit(at(0.4 + EDGE, 0.05), 'output-swing').met).toBe(false)
    const l = win(at(0.4, 0.05), 'output-swing')
    expect(l.limit?.[0]).toBeCloseTo(-11, 12)
    expect(l.limit?.[1]).toBeCloseTo(11, 12)
  })
  it('includes the reference term: an inverting stage with vref', () => {
    // Vout = −4·Vin + 2·5 over Vin ∈ [−1, 1]: 6 … 14 V on a 0 … 15 V supply.
    const s = stageInput({topology: 'inverting', rf: res(20e3), rg: res(5e3), rs: null, vref: 2, input: [-1, 1], supply: [0, 15], supplyTolerance: 0,
      opamp: testOpamp({swingHeadroom: null, swingHeadroomNeg: 0.1, swingHeadroomPos: 1 - EDGE})})
    const l = win(s, 'output-swing')
    expect(l.value[0]).toBeCloseTo(6, 12)
    expect(l.value[1]).toBeCloseTo(14, 12)
    expect(l.met).toBe(true)
    expect(limit({...s, opamp: testOpamp({swingHeadroom: null, swingHeadroomNeg: 0.1, swingHeadroomPos: 1 + EDGE})}, 'output-swing').met).toBe(false)
  })
  it('is skipped without headroom data, and checks one rail when only that rail has data', () => {
    const s = stageInput({opamp: testOpamp({swingHeadroom: null})})
    expect(limit(s, 'output-swing')).toMatchObject({met: null, limit: null})
    const one = win(stageInput({opamp: testOpamp({swingHeadroom: null, swingHeadroomPos: 1})}), 'output-swing')
    expect(one.met).toBe(true)
    expect(one.limit?.[0]).toBeNull()
    expect(one.missing).toEqual(['swing-headroom-neg (or swing-headroom)'])
  })
})

describe('input-common-mode', () => {
  it('an inverting stage: the pins sit at vref; met and not met at the edge', () => {
    const s = (c: number): StageInput => stageInput({topology: 'inverting', rf: res(10e3), rg: res(10e3), rs: null, vref: 2, input: [-1, 1], supply: [0, 5], supplyTolerance: 0,
      opamp: testOpamp({cmHeadroom: c})})
    expect(limit(s(2 - EDGE), 'input-common-mode').met).toBe(true)
    expect(limit(s(2 + EDGE), 'input-common-mode').met).toBe(false)
  })
  it('a negative headroom extends the range beyond the rail (a noninverting stage down to −0.1 V on 0 … 5 V)', () => {
    const s = (c: number): StageInput => stageInput({rf: res(1e3), rg: res(1e3), input: [-0.1, 1], supply: [0, 5], supplyTolerance: 0,
      opamp: testOpamp({cmHeadroomNeg: c, cmHeadroomPos: 1.5})})
    expect(limit(s(-0.1 - EDGE), 'input-common-mode').met).toBe(true)
    expect(limit(s(-0.1 + EDGE), 'input-common-mode').met).toBe(false)
    expect(limit(s(-0.2), 'input-common-mode').value).toEqual([expect.closeTo(-0.1, 12), expect.closeTo(1, 12)])
  })
  it('is skipped without cm-headroom', () => {
    expect(limit(stageInput(), 'input-common-mode')).toMatchObject({met: null, missing: ['cm-headroom', 'cm-headroom-neg', 'cm-headroom-pos']})
  })
})

describe('slew', () => {
  // A = half the output span = 11 V; fsig = 5 kHz: 2π·5 kHz·11 V = 345.6 kV/s.
  const s = (slew: number | null): StageInput => stageInput({rf: res(10e3), rg: res(1e3), rs: null, input: [-1, 1], signalFrequency: 5e3, opamp: testOpamp({slew})})
  const needed = 2 * Math.PI * 5e3 * 11
  it('needs 2π·fsig·A; met and not met at the edge', () => {
    const l = limit(s(1e6), 'slew')
    expect(l.value).toBeCloseTo(needed, 6)
    expect(limit(s(needed * (1 + EDGE)), 'slew').met).toBe(true)
    expect(limit(s(needed * (1 - EDGE)), 'slew').met).toBe(false)
  })
  it('against the full-power bandwidth SR/(2πA): met exactly when fsig ≤ FPBW (analytic)', () => {
    for (const sr of [0.3e6, 1e6, 3e6]) {
      const l = limit(s(sr), 'slew')
      if (l.key !== 'slew') throw new Error('expected the slew limit')
      const fpbw = sr / (2 * Math.PI * 11)
      expect(l.fullPowerBandwidth).toBeCloseTo(fpbw, 6)
      expect(l.met).toBe(5e3 <= fpbw)
    }
  })
  it('defaults fsig to the band top, and is skipped without a slew rate', () => {
    const l = limit(stageInput({rf: res(10e3), rg: res(1e3), rs: null, input: [-1, 1], band: [1, 2e3]}), 'slew')
    if (l.key !== 'slew') throw new Error('expected the slew limit')
    expect(l.signalFrequency).toBe(2e3)
    expect(limit(s(null), 'slew')).toMatchObject({met: null, missing: ['slew']})
  })
})

describe('output-current', () => {
  // Noninverting G = 2 (1 kΩ / 1 kΩ), 5 V out into rload 500 Ω: 5/2k + 5/500 = 12.5 mA.
  const s = (imax: number | null): StageInput => stageInput({rf: res(1e3), rg: res(1e3), rs: null, input: [0, 2.5], rload: 500, opamp: testOpamp({ioutMax: imax})})
  it('is the load plus feedback current from the DC solve; met and not met at the edge', () => {
    expect(limit(s(1), 'output-current').value).toBeCloseTo(12.5e-3, 15)
    expect(limit(s(12.5e-3 * (1 + EDGE)), 'output-current').met).toBe(true)
    expect(limit(s(12.5e-3 * (1 - EDGE)), 'output-current').met).toBe(false)
    expect(limit(s(null), 'output-current')).toMatchObject({met: null, missing: ['iout-max']})
  })
})

describe('limits in the verdicts', () => {
  it('a stage with no requirements fails on a limit alone', () => {
    const r = evaluateStage(stageInput({rf: res(10e3), rg: res(1e3), input: [-2, 2], opamp: testOpamp({swingHeadroom: 1})}))
    expect(r.requirements.filter((q) => q.kind === 'require')).toEqual([])
    expect(r.requirements.find((q) => q.key === 'output-swing')).toMatchObject({kind: 'limit', met: false})
    expect(r.swing.fits).toBe(false)
  })
})
