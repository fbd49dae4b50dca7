/**
 * Shot noise of the photocurrent through Rf (DESIGN §4.3): Schottky's formula i = √(2qI),
 * q = 1.602176634e-19 C exactly (BIPM, SI Brochure, 9th edition, 2019), written out here
 * rather than taken from the engine's constants. At low frequency the transimpedance is Rf,
 * so the output density is √(2qI)·Rf (closed form, DESIGN §4.3).
 */
import {describe, expect, it} from 'vitest'
import {noiseAnalysis, type StageInput} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

const Q = 1.602176634e-19

describe('shot-signal: √(2q·Isig)·Rf (Source: Schottky\'s formula, q exact per BIPM SI Brochure 2019)', () => {
  // 2 µA full scale into 1 MΩ; 1 … 100 Hz, far below the loop's corner (GBW 2 MHz, Aol 120 dB).
  const s: StageInput = stageInput({
    topology: 'transimpedance', rf: res(1e6), rg: null, rs: null, rcomp: null, rshunt: null, csource: 0, cstray: 0, cf: 0,
    idark: 0, input: [0, 2e-6], band: [1, 100], opamp: testOpamp({cinCm: 0, cinDiff: 0})
  })
  const b = noiseAnalysis(s).budget
  const shot = b.contributors.find((c) => c.key === 'shot-signal')!.outputRms
  it('is 0.80 µV/√Hz at 2 µA into 1 MΩ, integrated over the band', () => {
    const density = Math.sqrt(2 * Q * 2e-6) * 1e6
    expect(density).toBeCloseTo(0.80054e-6, 10)
    // The loop gain error at ≤ 100 Hz is < 1e-4 (Aol = 10⁶, NG = 1).
    expect(Math.abs(shot / (density * Math.sqrt(99)) - 1)).toBeLessThan(1e-4)
  })
  it('the floor is the total without shot-signal; with no signal they agree', () => {
    expect(b.zeroSignalOutputRms).toBeCloseTo(Math.sqrt(b.outputRms ** 2 - shot ** 2), 15)
    expect(b.zeroSignalOutputRms).toBeLessThan(b.outputRms)
    const quiet = noiseAnalysis({...s, input: [0, 0]}).budget
    expect(quiet.contributors.find((c) => c.key === 'shot-signal')!.outputRms).toBe(0)
    expect(quiet.zeroSignalOutputRms).toBe(quiet.outputRms)
  })
  it('uses the largest |input|, either sign', () => {
    const neg = noiseAnalysis({...s, input: [-2e-6, 1e-6]}).budget.contributors.find((c) => c.key === 'shot-signal')!.outputRms
    expect(neg).toBeCloseTo(shot, 15)
  })
  it('dark-current shot noise uses Idark at the noise temperature: idark·2^((Tn − 25)/idark-doubling)', () => {
    const dark = (tn: number): number => noiseAnalysis({...s, input: [0, 0], idark: 1e-9, noiseTemperature: tn}).budget.contributors.find((c) => c.key === 'shot')!.outputRms
    // Doubling every 10 K: 20 K hotter is 4× the current, 2× the shot-noise rms.
    expect(dark(45) / dark(25)).toBeCloseTo(2, 9)
    expect(Math.abs(dark(25) / (Math.sqrt(2 * Q * 1e-9) * 1e6 * Math.sqrt(99)) - 1)).toBeLessThan(1e-4)
  })
})
