/**
 * The standard normal's inverse distribution function and the truncated normal of DESIGN
 * §8.7: x = σ·Φ⁻¹(Φ(−3) + u·(Φ(3) − Φ(−3))), u uniform in (0, 1), so that no draw lies beyond
 * ±3σ (the datasheet maximum) and none is piled up on it.
 *
 * Φ⁻¹ is P. J. Acklam's rational approximation (2003; relative error below 1.15e-9 over
 * (0, 1)), the central region |p − 0.5| ≤ 0.47575 and the two tails with their own
 * coefficients. The tests check it against mathjs' erf.
 */

// The coefficients as constants (array loads cost in the trial loop).
const A0 = -3.969683028665376e1, A1 = 2.209460984245205e2, A2 = -2.759285104469687e2, A3 = 1.38357751867269e2, A4 = -3.066479806614716e1, A5 = 2.506628277459239
const B0 = -5.447609879822406e1, B1 = 1.615858368580409e2, B2 = -1.556989798598866e2, B3 = 6.680131188771972e1, B4 = -1.328068155288572e1
const C0 = -7.784894002430293e-3, C1 = -3.223964580411365e-1, C2 = -2.400758277161838, C3 = -2.549732539343734, C4 = 4.374664141464968, C5 = 2.938163982698783
const D0 = 7.784695709041462e-3, D1 = 3.224671290700398e-1, D2 = 2.445134137142996, D3 = 3.754408661907416
/** The lower tail's end: Acklam's central region is P_LOW ≤ p ≤ 1 − P_LOW. */
export const P_LOW = 0.02425

/** Φ⁻¹(p), 0 < p < 1 (Acklam). */
export function inverseNormal(p: number): number {
  if (p < P_LOW) return tail(Math.sqrt(-2 * Math.log(p)))
  if (p > 1 - P_LOW) return -tail(Math.sqrt(-2 * Math.log(1 - p)))
  return centralInverseNormal(p)
}

/** Acklam's central region alone: Φ⁻¹(p) for P_LOW ≤ p ≤ 1 − P_LOW (a finite number, not Φ⁻¹, outside it). */
export function centralInverseNormal(p: number): number {
  const q = p - 0.5
  const r = q * q
  return ((((((A0 * r + A1) * r + A2) * r + A3) * r + A4) * r + A5) * q) / (((((B0 * r + B1) * r + B2) * r + B3) * r + B4) * r + 1)
}

const tail = (q: number): number => (((((C0 * q + C1) * q + C2) * q + C3) * q + C4) * q + C5) / ((((D0 * q + D1) * q + D2) * q + D3) * q + 1)

/** Φ(−3) = ½·erfc(3/√2) (from memory; the tests check it with mathjs' erf). */
export const PHI_MINUS_3 = 0.0013498980316300946

/**
 * A truncated normal of σ = limit/3 at ±limit, from u in (0, 1) (DESIGN §8.7). The result is
 * clamped to ±limit, so the approximation's last ulps never put a draw beyond the limit.
 */
export function truncatedNormal(u: number, limit: number): number {
  return truncatedFromStandard(inverseNormal(truncatedProbability(u)), limit)
}

/** The probability Φ(−3) + u·(Φ(3) − Φ(−3)) of a truncated normal's u in (0, 1). */
export const truncatedProbability = (u: number): number => PHI_MINUS_3 + u * (1 - 2 * PHI_MINUS_3)

/** The draw of standard value z scaled to σ = limit/3 and clamped to ±limit. */
export function truncatedFromStandard(z: number, limit: number): number {
  // Math.min/max rather than comparisons: no branch for the hardware to mispredict.
  return Math.min(limit, Math.max(-limit, (limit / 3) * z))
}
