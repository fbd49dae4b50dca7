/**
 * The noise budget of a stage (DESIGN §4.3): output rms per contributor and in total over the
 * band, peak-to-peak, input-referred, and the density curves for the report.
 */
import {PEAK_TO_PEAK_FACTOR} from '../constants.js'
import {createWorkspace, solveClosed} from '../nodal.js'
import {stageNetlist} from '../topology/index.js'
import {signalGain} from '../dc/solve.js'
import {NOISE_KEYS, type NoiseBudget, type NoiseKey, type StageCurves, type StageInput} from '../types.js'
import {integrateBand, type IntegrateOptions} from './integrate.js'
import {noiseKelvin, noiseSources} from './sources.js'
import {compileSources, outputPsdInto} from './transfer.js'

/** Noise curves of `StageCurves`. */
export type NoiseCurves = Pick<StageCurves, 'noiseFrequency' | 'noiseDensity' | 'noiseTotal' | 'noiseTotalZeroSignal' | 'cumulativeRms'>

export interface NoiseAnalysis {
  budget: NoiseBudget
  /** Keys that do not apply to the topology have empty density arrays. */
  curves: NoiseCurves
  /** Density evaluations (adjoint solves) used. */
  evaluations: number
}

/** Noise budget and curves of a stage (DESIGN §4.3). */
export function noiseAnalysis(input: StageInput, options: IntegrateOptions = {}): NoiseAnalysis {
  const ws = createWorkspace(stageNetlist(input))
  const compiled = compileSources(ws, noiseSources(input, ws.net))
  const k = compiled.sources.length
  const [fL, fH] = input.band
  const band = integrateBand(fL, fH, k, (f, out, offset) => {
    solveClosed(ws, f)
    outputPsdInto(ws, compiled, f, out, offset)
  }, options)
  const contributors = compiled.sources.map((s, i) => ({key: s.key, outputRms: Math.sqrt(Math.max(0, band.integral[i]))}))
  const total = band.integral.reduce((a, b) => a + b, 0)
  const outputRms = Math.sqrt(Math.max(0, total))
  // The floor: the same total without the signal's own shot noise (DESIGN §4.3).
  const signalAt = compiled.sources.findIndex((s) => s.key === 'shot-signal')
  const zeroSignalOutputRms = signalAt < 0 ? outputRms : Math.sqrt(Math.max(0, total - band.integral[signalAt]))
  const nodes = band.frequency.length
  const noiseDensity = Object.fromEntries(NOISE_KEYS.map((key) => [key, [] as number[]])) as Record<NoiseKey, number[]>
  const noiseTotal: number[] = []
  const noiseTotalZeroSignal: number[] = []
  compiled.sources.forEach((s, j) => {
    noiseDensity[s.key] = Array.from({length: nodes}, (_, i) => Math.sqrt(band.density[i * k + j]))
  })
  for (let i = 0; i < nodes; i++) {
    let sum = 0
    for (let j = 0; j < k; j++) sum += band.density[i * k + j]
    noiseTotal.push(Math.sqrt(sum))
    noiseTotalZeroSignal.push(signalAt < 0 ? Math.sqrt(sum) : Math.sqrt(Math.max(0, sum - band.density[i * k + signalAt])))
  }
  const gain = Math.abs(signalGain(input))
  return {
    budget: {
      band: [fL, fH],
      temperature: noiseKelvin(input),
      outputRms,
      zeroSignalOutputRms,
      outputPeakToPeak: PEAK_TO_PEAK_FACTOR * outputRms,
      inputRms: outputRms / gain,
      contributors
    },
    curves: {
      noiseFrequency: Array.from(band.frequency),
      noiseDensity,
      noiseTotal,
      noiseTotalZeroSignal,
      cumulativeRms: Array.from(band.cumulative, (c) => Math.sqrt(Math.max(0, c)))
    },
    evaluations: band.evaluations
  }
}

/** The noise budget alone (DESIGN §4.3). */
export const noiseBudget = (input: StageInput): NoiseBudget => noiseAnalysis(input).budget
