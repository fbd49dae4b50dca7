/**
 * Preferred-number series, IEC 60063: the E3, E24 and E96 mantissas (one decade,
 * 1.0 ≤ m < 10), the nearest series value to a resistance, and rounding a capacitance up
 * to the E3 (1-2.2-4.7) steps.
 *
 * Values as listed in IEC 60063 (from memory; E96 follows 10^(i/96) rounded to three
 * figures, E24 has the historical exceptions 2.7 … 4.7 and 8.2 of its two-figure rounding).
 */

/** E3 mantissas (IEC 60063): the 1-2.2-4.7 steps used here for capacitors. */
export const E3 = [1.0, 2.2, 4.7] as const

/** E24 mantissas (IEC 60063). */
export const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
  3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1
] as const

/** E96 mantissas (IEC 60063). */
export const E96 = [
  1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3,
  1.33, 1.37, 1.4, 1.43, 1.47, 1.5, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74,
  1.78, 1.82, 1.87, 1.91, 1.96, 2.0, 2.05, 2.1, 2.15, 2.21, 2.26, 2.32,
  2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.8, 2.87, 2.94, 3.01, 3.09,
  3.16, 3.24, 3.32, 3.4, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12,
  4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49,
  5.62, 5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98, 7.15, 7.32,
  7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76
] as const

export type SeriesName = 'E3' | 'E24' | 'E96'
const SERIES: Record<SeriesName, readonly number[]> = {E3, E24, E96}

/** Relative tolerance for "is this value on the series": float noise only, not a near miss. */
const SAME = 1e-6
/** Relative slack when rounding up, for float noise in a computed value only. */
const FLOAT_NOISE = 1e-9

/** Decade exponent of a positive value, robust to 4.99e4 landing a hair under a power of ten. */
function decade(value: number): number {
  return Math.floor(Math.log10(value) + 1e-12)
}

/** True when `value` (> 0) is m·10^k for a mantissa m of the series. */
export function isOnSeries(value: number, series: SeriesName): boolean {
  const nearest = nearestOnSeries(value, series)
  return nearest !== null && Math.abs(nearest / value - 1) <= SAME
}

/**
 * The series value nearest to `value` (> 0), nearest by ratio (log distance), looking into the
 * neighbouring decades so that 9.9 finds 10. Null for a value that is not a positive finite number.
 */
export function nearestOnSeries(value: number, series: SeriesName): number | null {
  if (!(value > 0) || !Number.isFinite(value)) return null
  const k = decade(value)
  const mantissa = value / 10 ** k
  let best = 1
  let bestShift = 0
  let bestDistance = Infinity
  for (const shift of [-1, 0, 1]) {
    const f = 10 ** shift
    for (const m of SERIES[series]) {
      const distance = Math.abs(Math.log((m * f) / mantissa))
      if (distance < bestDistance) {
        best = m
        bestShift = shift
        bestDistance = distance
      }
    }
  }
  // Round to 12 significant figures so 4.99 × 10⁴ prints as 49900, not 49900.000000000004.
  return Number((best * 10 ** (k + bestShift)).toPrecision(12))
}

/** The smallest series value ≥ `value` (> 0): roundUpToSeries(1.6e-6, 'E3') = 2.2e-6. */
export function roundUpToSeries(value: number, series: SeriesName): number {
  const k = decade(value)
  for (const shift of [0, 1]) {
    for (const m of SERIES[series]) {
      const candidate = Number((m * 10 ** (k + shift)).toPrecision(12))
      // A candidate a hair under `value` passes only through float noise.
      if (candidate >= value * (1 - FLOAT_NOISE)) return candidate
    }
  }
  // Not reached: 1.0 × 10^(k+1) > value always; here for noImplicitReturns.
  return 10 ** (k + 1)
}
