/**
 * The op-amp's open-loop gain A(f) as two real poles (DESIGN §4.3).
 *
 * A(f) = Aol / ((1 + jf/fp1)(1 + jf/fp2)), fp1 = gbw/Aol, fp2 = gbw·sin φ·tan φ with
 * φ = pm-unity, which puts a unity follower's crossover at gbw·sin φ with phase margin φ
 * when fp1 ≪ gbw (derivation: |A(gbw·sin φ)| = 1 and 90° − atan(sin φ/(sin φ·tan φ)) = φ).
 * φ = 90° means no second pole (fp2 = ∞).
 */
import type {OpampParams} from './types.js'

/** Pole positions of the two-pole model. */
export interface OpampPoles {
  /** Open-loop DC gain, V/V. */
  aol: number
  /** Dominant pole, Hz. */
  fp1: number
  /** Second pole, Hz; Infinity when pm-unity is 90°. */
  fp2: number
}

/** Place the two poles from gbw, Aol and pm-unity (DESIGN §4.3). */
export function opampPoles(opamp: OpampParams): OpampPoles {
  const phi = (Math.min(opamp.pmUnity, 90) * Math.PI) / 180
  // tan(90°) is finite in floating point; treat anything within 1e-9° of 90° as no second pole.
  const fp2 = opamp.pmUnity >= 90 - 1e-9 ? Infinity : opamp.gbw * Math.sin(phi) * Math.tan(phi)
  return {aol: opamp.aol, fp1: opamp.gbw / opamp.aol, fp2}
}

/**
 * Write A(f) into out[0] (re) and out[1] (im); no allocation.
 * @param f
 *   Frequency, Hz (≥ 0).
 */
export function openLoopGainInto(p: OpampPoles, f: number, out: Float64Array): void {
  const x1 = f / p.fp1
  const x2 = p.fp2 === Infinity ? 0 : f / p.fp2
  // (1 + j x1)(1 + j x2) = (1 − x1 x2) + j (x1 + x2)
  const dr = 1 - x1 * x2
  const di = x1 + x2
  const d = dr * dr + di * di
  out[0] = (p.aol * dr) / d
  out[1] = (-p.aol * di) / d
}
