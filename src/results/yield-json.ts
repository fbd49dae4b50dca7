/**
 * The JSON of a Monte Carlo (DESIGN §8.7), a stage's or a chain's: one shape, declared once,
 * used by `json.ts` and `chain-json.ts`.
 */
import type {YieldKey, YieldResult} from '../engine/types.js'

export interface JsonYield<K extends string = YieldKey> {
  trials: number
  seed: number
  distribution: YieldResult['distribution']
  unavailable: string | null
  results: {key: K; limit: number; passed: number; yield: number; interval: [number, number]}[]
  basis: YieldResult['basis']
  worstCase: number
  errorPercentiles: {p50: number; p99: number; p999: number} | null
  maxError: number
  variance: {variable: string; share: number}[]
  varianceAt: YieldResult['varianceAt']
  varianceRows: number
}

/** The JSON of a stage's (or a chain's) Monte Carlo (the histogram is report-only). */
export function jsonYield<K extends string = YieldKey>(y: (Omit<YieldResult, 'results'> & {results: {key: K; limit: number; passed: number; yield: number; interval: [number, number]}[]}) | null): JsonYield<K> | null {
  if (y === null) return null
  return {
    trials: y.trials,
    seed: y.seed,
    distribution: y.distribution,
    unavailable: y.unavailable,
    results: y.results.map((r) => ({key: r.key, limit: r.limit, passed: r.passed, yield: r.yield, interval: [r.interval[0], r.interval[1]]})),
    basis: y.basis,
    worstCase: y.worstCase,
    errorPercentiles: y.errorPercentiles === null ? null : {p50: y.errorPercentiles.p50, p99: y.errorPercentiles.p99, p999: y.errorPercentiles.p999},
    maxError: y.maxError,
    variance: y.variance.map((v) => ({variable: v.variable, share: v.share})),
    varianceAt: y.varianceAt === null ? null : {...y.varianceAt},
    varianceRows: y.varianceRows
  }
}
