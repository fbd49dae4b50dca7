/**
 * The chain's noise (DESIGN §8.6): the output density Sout(f) = Σk Sk(f)·Πj>k |Hj(f)|², Sk the
 * full output density of stage k and Hj the solved signal transfer of stage j, both from
 * the stages' spectral views; integrated over the chain's band with the stage integrator
 * (`noise/integrate.ts`, adaptive, each stage's part on the same nodes so the parts add up
 * to the total exactly).
 */
import {integrateBand} from '../noise/integrate.js'
import type {ChainCurves, ChainStage} from './types.js'

export interface CascadedNoise {
  /** Each stage's part at the chain output over the band, V². */
  parts: number[]
  /** Total, V² (full-scale signal). */
  total: number
  /** Total without signal-dependent noise, V². */
  zeroSignal: number
  curves: ChainCurves
}

/**
 * Each stage's part of the chain's output density at f, V²/Hz, into out[offset + k]
 * (`which` 0: every source, 1: without `shot-signal`).
 */
export function cascadeDensityInto(stages: readonly ChainStage[], f: number, out: Float64Array, offset: number, which: 0 | 1, scratch: Float64Array): void {
  const n = stages.length
  for (let k = 0; k < n; k++) stages[k].spectrum.at(f, scratch, 4 * k)
  // Walk back from the converter: after stage k the signal sees Π|Hj|² of the later stages.
  let later = 1
  for (let k = n - 1; k >= 0; k--) {
    out[offset + k] = scratch[4 * k + which] * later
    later *= scratch[4 * k + 2] ** 2 + scratch[4 * k + 3] ** 2
  }
}

/** The cascaded noise over [fL, fH]. */
export function cascadeNoise(stages: readonly ChainStage[], fL: number, fH: number): CascadedNoise {
  const n = stages.length
  const scratch = new Float64Array(4 * n)
  const band = integrateBand(fL, fH, n, (f, out, offset) => cascadeDensityInto(stages, f, out, offset, 0, scratch))
  const parts = Array.from(band.integral, (v) => Math.max(0, v))
  const total = parts.reduce((a, b) => a + b, 0)
  let zeroSignal = total
  if (stages.some((s) => s.spectrum.signalNoise)) {
    const floor = integrateBand(fL, fH, n, (f, out, offset) => cascadeDensityInto(stages, f, out, offset, 1, scratch))
    zeroSignal = floor.integral.reduce((a, b) => a + Math.max(0, b), 0)
  }
  const nodes = band.frequency.length
  const stageDensity = stages.map((_, k) => Array.from({length: nodes}, (_, i) => Math.sqrt(Math.max(0, band.density[i * n + k]))))
  const totalDensity = Array.from({length: nodes}, (_, i) => {
    let s = 0
    for (let k = 0; k < n; k++) s += band.density[i * n + k]
    return Math.sqrt(Math.max(0, s))
  })
  return {
    parts, total, zeroSignal,
    curves: {
      frequency: Array.from(band.frequency),
      stageDensity,
      total: totalDensity,
      cumulativeRms: Array.from(band.cumulative, (c) => Math.sqrt(Math.max(0, c)))
    }
  }
}

/** The chain's output rms from fL to fH (V), total only. */
export function cascadeRms(stages: readonly ChainStage[], fL: number, fH: number): number {
  const n = stages.length
  const scratch = new Float64Array(4 * n)
  const band = integrateBand(fL, fH, n, (f, out, offset) => cascadeDensityInto(stages, f, out, offset, 0, scratch))
  return Math.sqrt(Math.max(0, band.integral.reduce((a, b) => a + b, 0)))
}
