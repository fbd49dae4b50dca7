/**
 * Noise-bandwidth checks of the integrator and the noise transfers (DESIGN §4.3).
 */
import {describe, expect, it} from 'vitest'
import {noiseAnalysis, type NoiseKey} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

const rmsOf = (r: ReturnType<typeof noiseAnalysis>, key: NoiseKey): number => r.budget.contributors.find((c) => c.key === key)?.outputRms ?? NaN

describe('white en through a one-pole closed loop', () => {
  // Source: standard noise texts (from memory): a one-pole low-pass has a noise bandwidth of
  // (π/2)·fc. With pm-unity 90° (no second pole) the closed-loop corner is GBW/NG, so
  // rms = en·NG·√((π/2)·GBW/NG). Tolerance 1 %: the band stops at 1000× the corner (the tail
  // beyond it is 0.06 %), and the finite Aol moves the corner by NG/Aol = 1e-7.
  it.each([2, 10, 101])('matches en·NG·√((π/2)·GBW/NG) within 1 %% at NG = %d', (ng) => {
    const gbw = 1e6
    const s = stageInput({
      opamp: testOpamp({en: 10e-9, enCorner: 0, in: 0, gbw, aol: 1e9, pmUnity: 90, cinCm: 0, cinDiff: 0}),
      rf: res((ng - 1) * 10), rg: res(10), rs: null, cstray: 0,
      band: [1e-3, 1000 * (gbw / ng)]
    })
    const expected = 10e-9 * ng * Math.sqrt((Math.PI / 2) * (gbw / ng))
    expect(Math.abs(rmsOf(noiseAnalysis(s), 'en') / expected - 1)).toBeLessThan(0.01)
  })
})

describe('1/f voltage noise over a band well below the closed-loop corner', () => {
  // Source: closed form of ∫ en²(1 + fce/f) df = en²·[fce·ln(fH/fL) + (fH − fL)] (calculus);
  // output = NG × that. Tolerance 0.1 %: the band's top is 10⁻⁴ of the closed-loop corner, so
  // |H| differs from NG by < 1e-7.
  it.each([
    [0.1, 10, 30],
    [0.01, 100, 200],
    [1, 1000, 4]
  ])('band %d .. %d Hz with fce = %d Hz matches within 0.1 %%', (fL, fH, fce) => {
    const s = stageInput({
      opamp: testOpamp({en: 7e-9, enCorner: fce, in: 0, gbw: 1e8, aol: 1e9}),
      rf: res(90), rg: res(10), rs: null, band: [fL, fH]
    })
    const expected = 10 * 7e-9 * Math.sqrt(fce * Math.log(fH / fL) + (fH - fL))
    expect(Math.abs(rmsOf(noiseAnalysis(s), 'en') / expected - 1)).toBeLessThan(1e-3)
  })
})
