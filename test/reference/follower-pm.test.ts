/**
 * Unity-follower phase margin against the two-pole model of DESIGN §4.3 (analytic).
 */
import {describe, expect, it} from 'vitest'
import {opampPoles, stabilityAnalysis} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

const follower = (pmUnity: number, aol: number) =>
  stageInput({
    topology: 'follower', rf: null, rg: null, rs: null, cstray: 0,
    opamp: testOpamp({pmUnity, aol, gbw: 3e6, cinCm: 0, cinDiff: 0})
  })

describe('unity follower phase margin', () => {
  // Analytic (DESIGN §4.3): fp2 = gbw·sin φ·tan φ puts |A| = 1 at gbw·sin φ with 90° − atan
  // (sin φ/(sin φ·tan φ)) = φ when fp1 ≪ gbw. Aol = 10⁹ makes the fp1 phase error ~1e-8°,
  // so 0.1° is generous.
  it.each([30, 45, 60, 75, 90])('equals pm-unity = %d° within 0.1° for large Aol', (phi) => {
    const st = stabilityAnalysis(follower(phi, 1e9)).stability
    expect(st.phaseMargin).not.toBeNull()
    expect(Math.abs((st.phaseMargin as number) - phi)).toBeLessThan(0.1)
  })

  // Analytic: for T = A, PM = 180° − atan(fc/fp1) − atan(fc/fp2); with fp1 = gbw/Aol and
  // Aol = 10⁵ the first term is kept exactly. Tolerance 1e-6°: crossover refined to 1e-9.
  it.each([40, 62])('equals 180° − atan(fc/fp1) − atan(fc/fp2) at the found crossover (pm-unity %d°)', (phi) => {
    const s = follower(phi, 1e5)
    const st = stabilityAnalysis(s).stability
    const p = opampPoles(s.opamp)
    const fc = st.crossover as number
    const deg = (x: number): number => (x * 180) / Math.PI
    expect(Math.abs((st.phaseMargin as number) - (180 - deg(Math.atan(fc / p.fp1)) - deg(Math.atan(fc / p.fp2))))).toBeLessThan(1e-6)
    // and the crossover is gbw·sin φ (analytic, large-Aol limit; 0.01 % for Aol = 10⁵)
    expect(Math.abs(fc / (3e6 * Math.sin((phi * Math.PI) / 180)) - 1)).toBeLessThan(1e-4)
  })

  it('approaches 90° − atan(fc/fp2) when Aol is large (analytic, 0.1°)', () => {
    const s = follower(50, 1e9)
    const st = stabilityAnalysis(s).stability
    const fp2 = opampPoles(s.opamp).fp2
    const expected = 90 - (Math.atan((st.crossover as number) / fp2) * 180) / Math.PI
    expect(Math.abs((st.phaseMargin as number) - expected)).toBeLessThan(0.1)
  })
})

describe('closed-loop bandwidth and peaking of simple loops', () => {
  // Analytic: with pm-unity 90° and no capacitance, H = NG·A/(NG + A) has one pole at
  // fp1·(1 + Aol/NG) = gbw/Aol + gbw/NG. Tolerance 1e-6 (search stops at 1e-9 in ln f).
  it.each([1, 5, 50])('noninverting NG = %d: bandwidth = gbw/Aol + gbw/NG', (ng) => {
    const op = testOpamp({pmUnity: 90, cinCm: 0, cinDiff: 0, aol: 1e5, gbw: 2e6})
    const s = ng === 1
      ? stageInput({topology: 'follower', rf: null, rg: null, rs: null, cstray: 0, opamp: op})
      : stageInput({rf: res((ng - 1) * 1e3), rg: res(1e3), rs: null, cstray: 0, opamp: op})
    const st = stabilityAnalysis(s).stability
    expect(Math.abs((st.bandwidth as number) / (2e6 / 1e5 + 2e6 / ng) - 1)).toBeLessThan(1e-6)
    expect(st.peaking).toBe(0)
  })

  // Analytic (large-Aol limit): H = 1/(1 − f²/(gbw·fp2) + jf/gbw); the minimum of |1/H|² is
  // p/g − p²/(4g²) with p = fp2/gbw·gbw, so peaking = −10·lg(p − p²/4). 0.01 dB.
  it.each([30, 45])('unity follower with pm-unity %d° peaks as the second-order closed form', (phi) => {
    const s = follower(phi, 1e9)
    const p = Math.sin((phi * Math.PI) / 180) * Math.tan((phi * Math.PI) / 180)
    const expected = -10 * Math.log10(p - (p * p) / 4)
    expect(Math.abs(stabilityAnalysis(s).stability.peaking - expected)).toBeLessThan(0.01)
  })
})
