/**
 * The standard normal's inverse distribution function and the truncated normal of DESIGN
 * §8.7: x = σ·Φ⁻¹(Φ(−3) + u·(Φ(3) − Φ(−3))), u uniform in (0, 1), so that no draw lies beyond
 * ±3σ (the datasheet maximum) and none is piled up on it.
 *
 * Φ⁻¹ is P. J. Acklam's rational approximation (2003; relative error below 1.15e-9 over
 * (0, 1)), the central region |p − 0.5| ≤ 0.47575 and the two tails with their own
 * coefficients. The tests check it against mathjs' erf.
 *
 * The Monte Carlo's draws do not evaluate it per draw: z(u) = Φ⁻¹(Φ(−3) + u·(Φ(3) − Φ(−3))) is
 * tabulated once at TABLE_STEPS + 1 equally spaced u (Acklam), with its slope
 * dz/du = (Φ(3) − Φ(−3))/φ(z), and a draw is the cubic Hermite interpolant between the two
 * knots around its u: no branch, no division, about twice as fast as Acklam's form per draw.
 * The interpolation error is largest in the end steps, where z changes fastest: 3.1e-6 σ at
 * most (the first and last of the 4096 steps), below 1e-9 σ over the central 90 % of u — far
 * below what a yield or a percentile can resolve (the tests measure it against the direct form
 * over a fine grid of u).
 */

// The coefficients as constants (array loads cost in the trial loop).
const A0 = -3.969683028665376e1, A1 = 2.209460984245205e2, A2 = -2.759285104469687e2, A3 = 1.38357751867269e2, A4 = -3.066479806614716e1, A5 = 2.506628277459239
const B0 = -5.447609879822406e1, B1 = 1.615858368580409e2, B2 = -1.556989798598866e2, B3 = 6.680131188771972e1, B4 = -1.328068155288572e1
const C0 = -7.784894002430293e-3, C1 = -3.223964580411365e-1, C2 = -2.400758277161838, C3 = -2.549732539343734, C4 = 4.374664141464968, C5 = 2.938163982698783
const D0 = 7.784695709041462e-3, D1 = 3.224671290700398e-1, D2 = 2.445134137142996, D3 = 3.754408661907416
const P_LOW = 0.02425

/** Φ⁻¹(p), 0 < p < 1 (Acklam). */
export function inverseNormal(p: number): number {
  if (p < P_LOW) return tail(Math.sqrt(-2 * Math.log(p)))
  if (p > 1 - P_LOW) return -tail(Math.sqrt(-2 * Math.log(1 - p)))
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
  return truncatedFromStandard(truncatedStandard(u), limit)
}

/** The probability Φ(−3) + u·(Φ(3) − Φ(−3)) of a truncated normal's u in (0, 1). */
export const truncatedProbability = (u: number): number => PHI_MINUS_3 + u * (1 - 2 * PHI_MINUS_3)

/** Steps of u in the truncated normal's table (module header). */
export const TABLE_STEPS = 4096

/** Knot i at [2i] (z) and its slope times the step at [2i + 1], side by side (one cache line a lookup). */
const TABLE = ((): Float64Array => {
  const t = new Float64Array(2 * (TABLE_STEPS + 1))
  const span = 1 - 2 * PHI_MINUS_3
  for (let i = 0; i <= TABLE_STEPS; i++) {
    const z = inverseNormal(truncatedProbability(i / TABLE_STEPS))
    t[2 * i] = z
    // dz/du = span/φ(z), times the step 1/TABLE_STEPS (the interpolant's variable runs 0 … 1 over a step).
    t[2 * i + 1] = (span * Math.sqrt(2 * Math.PI) * Math.exp((z * z) / 2)) / TABLE_STEPS
  }
  return t
})()

/** z(u) of the module header, 0 < u < 1 (u = 1 gives the last knot), by cubic Hermite interpolation in the table. */
export function truncatedStandard(u: number): number {
  const x = u * TABLE_STEPS
  // The generator's u stays below 1 − 2^-33 (i ≤ TABLE_STEPS − 1); the guard keeps u = 1 inside the table.
  const i = Math.min(x | 0, TABLE_STEPS - 1)
  const t = x - i
  const k = 2 * i
  const z0 = TABLE[k]!
  const m0 = TABLE[k + 1]!
  const z1 = TABLE[k + 2]!
  const m1 = TABLE[k + 3]!
  const t2 = t * t
  const t3 = t2 * t
  return (2 * t3 - 3 * t2 + 1) * z0 + (t3 - 2 * t2 + t) * m0 + (3 * t2 - 2 * t3) * z1 + (t3 - t2) * m1
}

/** The draw of standard value z scaled to σ = limit/3 and clamped to ±limit. */
export function truncatedFromStandard(z: number, limit: number): number {
  // Math.min/max rather than comparisons: no branch for the hardware to mispredict (the same
  // result for every number; a NaN z, which the table cannot give, would pass through).
  return Math.min(limit, Math.max(-limit, (limit / 3) * z))
}
