/**
 * The chain's signal response from its stages' spectral views: H(f) = ΠHk(f), the −3 dB
 * bandwidth (lowest f where |H| = |H(0)|/√2) and the alias rejection of DESIGN §8.6,
 * −20·lg(max over [fs − fH, fs + fH] of |H(f)/H(0)|).
 */
import {goldenMax, illinois} from '../roots.js'
import type {ChainStage} from './types.js'

/** |ΠHk(f)|, from each stage's transfer at f. */
export function chainMagnitude(stages: readonly ChainStage[], f: number, scratch: Float64Array): number {
  let m = 1
  for (const s of stages) {
    s.spectrum.at(f, scratch, 0)
    m *= Math.hypot(scratch[2], scratch[3])
  }
  return m
}

const PER_DECADE = 16

/**
 * The chain's −3 dB bandwidth, Hz: scanned upward on a log grid from `from` to 10× the
 * widest stage bandwidth, then refined in ln f; null when |H| never falls that far.
 */
export function chainBandwidth(stages: readonly ChainStage[], from: number, scratch: Float64Array): number | null {
  const h0 = Math.abs(stages.reduce((g, s) => g * s.spectrum.dcGain, 1))
  if (!(h0 > 0)) return null
  const widest = Math.max(from * 10, ...stages.map((s) => s.bandwidth ?? 0))
  const to = widest * 10
  const target = Math.log(h0 / Math.SQRT2)
  const g = (u: number): number => Math.log(chainMagnitude(stages, Math.exp(u), scratch)) - target
  // The chain cannot be wider than its narrowest stage unless another stage peaks there:
  // start the scan a decade and a half below the narrowest stage, and from the bottom only
  // when the response has already fallen there.
  const known = stages.map((s) => s.bandwidth).filter((b): b is number => b !== null)
  const near = known.length > 0 ? Math.max(from, Math.min(...known) / 30) : from
  const scan = (start: number): number | null | 'below' => {
    const n = Math.max(2, Math.ceil(Math.log10(to / start) * PER_DECADE))
    const du = Math.log(to / start) / n
    let ua = Math.log(start)
    let ga = g(ua)
    if (ga <= 0) return 'below'
    for (let i = 1; i <= n; i++) {
      const ub = Math.log(start) + i * du
      const gb = g(ub)
      if (gb <= 0) return Math.exp(illinois(g, ua, ga, ub, gb, 1e-9))
      ua = ub
      ga = gb
    }
    return null
  }
  const quick = near > from ? scan(near) : 'below'
  if (quick !== 'below') return quick
  const full = scan(from)
  return full === 'below' ? from : full
}

/**
 * Alias rejection, dB, for sample rate fs and band top fH; null when fs ≤ 2·fH.
 * The largest |H(f)/H(0)| over [fs − fH, fs + fH] is found on 17 points and refined by a
 * golden-section search around the best one (|H| is smooth there).
 */
export function aliasRejection(stages: readonly ChainStage[], fs: number, fH: number, scratch: Float64Array): number | null {
  if (!(fs > 2 * fH)) return null
  const h0 = Math.abs(stages.reduce((g, s) => g * s.spectrum.dcGain, 1))
  const lo = fs - fH
  const hi = fs + fH
  const n = 16
  let best = 0
  let bestAt = 0
  const mag = (f: number): number => chainMagnitude(stages, f, scratch)
  for (let i = 0; i <= n; i++) {
    const m = mag(lo + ((hi - lo) * i) / n)
    if (m > best) {
      best = m
      bestAt = i
    }
  }
  const a = lo + ((hi - lo) * Math.max(0, bestAt - 1)) / n
  const b = lo + ((hi - lo) * Math.min(n, bestAt + 1)) / n
  const [, refined] = goldenMax(mag, a, b, 24)
  return -20 * Math.log10(Math.max(best, refined) / h0)
}
