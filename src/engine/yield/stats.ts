/**
 * Statistics of a Monte Carlo run (DESIGN §8.7): the Wilson score interval of a yield,
 * nearest-rank percentiles, a fixed-bin histogram and Jansen's total-effect estimator.
 */

/** z of a two-sided 95 % interval (DESIGN §8.7). */
export const Z95 = 1.959964

/**
 * Wilson score interval for k successes in n trials (E. B. Wilson, "Probable inference, the
 * law of succession, and statistical inference", JASA 22, 1927):
 * (p̂ + z²/2n ± z·√(p̂(1 − p̂)/n + z²/4n²)) / (1 + z²/n), p̂ = k/n.
 */
export function wilsonInterval(k: number, n: number, z = Z95): [number, number] {
  if (n <= 0) return [0, 1]
  const p = k / n
  const z2 = z * z
  const denom = 1 + z2 / n
  const centre = (p + z2 / (2 * n)) / denom
  const half = (z / denom) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n))
  // At k = 0 and k = n the bounds are exactly 0 and 1 (the formula's rounding would leave 1 − 1e-16).
  return [k === 0 ? 0 : Math.max(0, centre - half), k === n ? 1 : Math.min(1, centre + half)]
}

/** Nearest-rank percentile of ascending `sorted` (q in (0, 1]): sorted[⌈q·n⌉ − 1]. */
export function percentileSorted(sorted: Float64Array, q: number): number {
  const n = sorted.length
  if (n === 0) return 0
  const i = Math.min(n - 1, Math.max(0, Math.ceil(q * n) - 1))
  return sorted[i] as number
}

/** Counts of `values` in `bins` equal bins over [0, top]; a value at or above top goes to the last bin. */
export function histogram(values: Float64Array, bins: number, top: number): number[] {
  const counts = new Array<number>(bins).fill(0)
  if (!(top > 0)) {
    counts[0] = values.length
    return counts
  }
  const scale = bins / top
  for (let i = 0; i < values.length; i++) {
    const b = Math.min(bins - 1, Math.max(0, Math.floor((values[i] as number) * scale)))
    counts[b] = (counts[b] as number) + 1
  }
  return counts
}

/**
 * Jansen's total-effect estimator (M. J. W. Jansen, "Analysis of variance designs for model
 * output", Comput. Phys. Commun. 117, 1999; as in A. Saltelli et al., Comput. Phys. Commun.
 * 181, 2010, table 2): S_Ti = Σ_j (f(A)_j − f(A_B^(i))_j)² / (2M) / V, V the variance of
 * f(A). `fA` holds f(A) for M rows, `fAB[i]` f(A_B^(i)) for variable i. Returns the raw
 * indices (not normalised; 0 when V is 0).
 */
export function jansenTotalEffects(fA: Float64Array, fAB: Float64Array[]): number[] {
  const m = fA.length
  let mean = 0
  for (let j = 0; j < m; j++) mean += fA[j] as number
  mean /= m
  let v = 0
  for (let j = 0; j < m; j++) v += ((fA[j] as number) - mean) ** 2
  v /= m
  return fAB.map((col) => {
    if (!(v > 0)) return 0
    let s = 0
    for (let j = 0; j < m; j++) s += ((fA[j] as number) - (col[j] as number)) ** 2
    return s / (2 * m) / v
  })
}

/**
 * The point of largest variance from running sums over `rows` trials (`sum[k]`, `sum2[k]` of
 * the signed error at point k = ti·P + p): its input point p and temperature index ti.
 */
export function largestVariancePoint(sums: {rows: number; sum: Float64Array; sum2: Float64Array}, points: number): {p: number; ti: number} {
  let best = 0
  let bestVar = -1
  for (let k = 0; k < sums.sum.length; k++) {
    const v = (sums.sum2[k] as number) / sums.rows - ((sums.sum[k] as number) / sums.rows) ** 2
    if (v > bestVar) {
      bestVar = v
      best = k
    }
  }
  return {p: best % points, ti: Math.floor(best / points)}
}

/** Jansen's raw indices normalised to sum 1, named, largest first (ties by name). */
export function rankedShares(names: readonly string[], raw: readonly number[]): {variable: string; share: number}[] {
  const total = raw.reduce((a, b) => a + b, 0)
  return names
    .map((variable, i) => ({variable, share: total > 0 ? (raw[i] as number) / total : 0}))
    .sort((a, b) => b.share - a.share || (a.variable < b.variable ? -1 : 1))
}
