/**
 * Integration of output noise densities over the band (DESIGN §4.3).
 *
 * The integrand is taken in u = ln f, where ∫S df = ∫f·S du is smooth for 1/f and one-pole
 * shapes alike. A log-uniform base grid (the curve points of the report) is cut into panels
 * of four intervals; a panel is accepted when composite Simpson on its five nodes agrees with
 * Simpson on three (Lyness' criterion |S₂ − S₁| ≤ 15·tol, Burden & Faires, Numerical
 * Analysis, §4.6), and otherwise each half is refined by adaptive Simpson quadrature, until
 * the total meets a relative tolerance well inside the 0.1 % the design asks. Every contributor is integrated
 * with the same nodes and weights, so contributor integrals add up to the total exactly.
 */

/** Writes K output densities (V²/Hz) at f into out[offset … offset + K − 1]. */
export type DensityFunction = (f: number, out: Float64Array, offset: number) => void

export interface BandIntegral {
  /** Base grid, Hz, ascending, fL … fH. */
  frequency: Float64Array
  /** Densities at the base grid, V²/Hz, row-major (node × K). */
  density: Float64Array
  /** Integral of the total from fL to each base node, V². */
  cumulative: Float64Array
  /** Integral over the band per contributor, V². */
  integral: Float64Array
  /** Density evaluations used. */
  evaluations: number
}

export interface IntegrateOptions {
  /** Base grid density (default 20 per decade). */
  pointsPerDecade?: number
  /** Upper bound on base intervals, a multiple of 4 (default 288: curves under ~300 points). */
  maxIntervals?: number
  /** Relative tolerance on the band integral of the total (default 1e-5, i.e. 5e-6 on rms). */
  relTol?: number
  /** Recursion depth limit per panel (default 24). */
  maxDepth?: number
}

/** Integrate K densities over [fL, fH]. */
export function integrateBand(fL: number, fH: number, k: number, density: DensityFunction, options: IntegrateOptions = {}): BandIntegral {
  const ppd = options.pointsPerDecade ?? 20
  const maxIntervals = options.maxIntervals ?? 288
  const relTol = options.relTol ?? 1e-5
  const maxDepth = options.maxDepth ?? 24
  const uL = Math.log(fL)
  const uH = Math.log(fH)
  let n = Math.ceil(Math.log10(fH / fL) * ppd)
  n = Math.min(Math.max(n, 8), maxIntervals)
  n += (4 - (n % 4)) % 4
  const h = (uH - uL) / n

  // Pool of evaluated points: g = f·S (integrand in u) per contributor, plus the total.
  const stride = k + 1
  let pool = new Float64Array(stride * (2 * n + 64))
  let used = 0
  let evaluations = 0
  const scratch = new Float64Array(k)
  const evalAt = (u: number): number => {
    const f = Math.exp(u)
    density(f, scratch, 0)
    evaluations++
    if ((used + 1) * stride > pool.length) {
      const grown = new Float64Array(pool.length * 2)
      grown.set(pool)
      pool = grown
    }
    const base = used * stride
    let total = 0
    for (let i = 0; i < k; i++) {
      const g = f * scratch[i]
      pool[base + i] = g
      total += g
    }
    pool[base + k] = total
    return used++
  }

  const frequency = new Float64Array(n + 1)
  const densityOut = new Float64Array((n + 1) * k)
  for (let i = 0; i <= n; i++) {
    const u = i === n ? uH : uL + i * h
    frequency[i] = Math.exp(u)
    const p = evalAt(u)
    for (let j = 0; j < k; j++) densityOut[i * k + j] = pool[p * stride + j] / frequency[i]
  }
  // Composite Simpson estimate of the total on the base grid sets the absolute tolerance.
  let estimate = 0
  for (let i = 0; i < n; i += 2) estimate += (h / 3) * (pool[i * stride + k] + 4 * pool[(i + 1) * stride + k] + pool[(i + 2) * stride + k])
  const tolTotal = relTol * Math.abs(estimate)
  // A zero or non-finite estimate (a degenerate stage) cannot steer refinement: take the
  // base grid as it is, rather than refine every panel to the depth limit.
  const noRefine = !(tolTotal > 0 && Number.isFinite(tolTotal))

  const integral = new Float64Array(k)
  const acc = new Float64Array(k)
  // Add the Simpson rule over [pa, pm, pb] (width w) to acc.
  const addSimpson = (pa: number, pm: number, pb: number, w: number): void => {
    for (let j = 0; j < k; j++) acc[j] += (w / 6) * (pool[pa * stride + j] + 4 * pool[pm * stride + j] + pool[pb * stride + j])
  }
  const simpson = (pa: number, pm: number, pb: number, w: number): number =>
    (w / 6) * (pool[pa * stride + k] + 4 * pool[pm * stride + k] + pool[pb * stride + k])
  // Refine [ua, ub] whose ends and midpoint are evaluated; whole = Simpson over it.
  const refine = (pa: number, pm: number, pb: number, ua: number, ub: number, whole: number, tol: number, depth: number): void => {
    const um = (ua + ub) / 2
    const w = (ub - ua) / 2
    const pl = evalAt((ua + um) / 2)
    const pr = evalAt((um + ub) / 2)
    const left = simpson(pa, pl, pm, w)
    const right = simpson(pm, pr, pb, w)
    if (depth >= maxDepth || noRefine || Math.abs(left + right - whole) <= 15 * tol) {
      addSimpson(pa, pl, pm, w)
      addSimpson(pm, pr, pb, w)
      return
    }
    refine(pa, pl, pm, ua, um, left, tol / 2, depth + 1)
    refine(pm, pr, pb, um, ub, right, tol / 2, depth + 1)
  }

  const cumulative = new Float64Array(n + 1)
  const panelTol = (tolTotal * 2 * h) / (uH - uL)
  const nodeU = (i: number): number => (i === n ? uH : uL + i * h)
  // Move acc into the per-contributor integrals; return its total.
  const flush = (): number => {
    let sum = 0
    for (let j = 0; j < k; j++) {
      integral[j] += acc[j]
      sum += acc[j]
    }
    acc.fill(0)
    return sum
  }
  // Two base intervals [i, i + 2], refined with quarter points; cumulative at i + 1 and i + 2.
  const halfPanel = (i: number): void => {
    const ua = nodeU(i)
    const um = nodeU(i + 1)
    const ub = nodeU(i + 2)
    const whole = simpson(i, i + 1, i + 2, ub - ua)
    const pl = evalAt((ua + um) / 2)
    const pr = evalAt((um + ub) / 2)
    const left = simpson(i, pl, i + 1, um - ua)
    const right = simpson(i + 1, pr, i + 2, ub - um)
    const converged = noRefine || Math.abs(left + right - whole) <= 15 * panelTol
    if (converged) addSimpson(i, pl, i + 1, um - ua)
    else refine(i, pl, i + 1, ua, um, left, panelTol / 2, 1)
    cumulative[i + 1] = cumulative[i] + flush()
    if (converged) addSimpson(i + 1, pr, i + 2, ub - um)
    else refine(i + 1, pr, i + 2, um, ub, right, panelTol / 2, 1)
    cumulative[i + 2] = cumulative[i + 1] + flush()
  }
  // Integral of the total over [i, i + 1] from the quadratic through nodes i, i + 1, i + 2.
  const firstHalf = (i: number): number =>
    (h / 12) * (5 * pool[i * stride + k] + 8 * pool[(i + 1) * stride + k] - pool[(i + 2) * stride + k])
  for (let i = 0; i < n; i += 4) {
    const w = nodeU(i + 4) - nodeU(i)
    const coarse = simpson(i, i + 2, i + 4, w)
    const fine = simpson(i, i + 1, i + 2, w / 2) + simpson(i + 2, i + 3, i + 4, w / 2)
    if (noRefine || Math.abs(fine - coarse) <= 15 * 2 * panelTol) {
      for (const j of [i, i + 2]) {
        addSimpson(j, j + 1, j + 2, w / 2)
        const half = firstHalf(j)
        const sum = flush()
        cumulative[j + 1] = cumulative[j] + half
        cumulative[j + 2] = cumulative[j] + sum
      }
    } else {
      halfPanel(i)
      halfPanel(i + 2)
    }
  }
  return {frequency, density: densityOut, cumulative, integral, evaluations}
}
