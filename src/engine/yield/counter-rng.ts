/**
 * Counter-based uniform numbers for the Monte Carlo (DESIGN §8.7): the number for
 * (seed, trial, variable) is a pure hash of those three integers, so trial i's draws depend
 * only on (seed, i) — any split of the trials over threads or blocks gives the same draws.
 *
 * The hash is a SplitMix-style construction in 32-bit arithmetic: the seed and the trial are
 * folded in through a finaliser, each variable is a Weyl step (golden-ratio increment) from
 * there, and the result goes through the finaliser once more. The finaliser is the
 * "lowbias32" integer hash (xorshift-multiply, constants 0x7feb352d and 0x846ca68b, published
 * by C. Wellons' hash-prospector search; full avalanche on 32 bits).
 */

/** The 32-bit finaliser (see header), unsigned result. */
export function mix32(x: number): number {
  x ^= x >>> 16
  x = Math.imul(x, 0x7feb352d)
  x ^= x >>> 15
  x = Math.imul(x, 0x846ca68b)
  x ^= x >>> 16
  return x >>> 0
}

const GOLDEN = 0x9e3779b9
// 2^-32: multiplying by it is exact, the same number as dividing by 2^32.
const INV_TWO_32 = 1 / 4294967296

/** The key of one seed (computed once per run). */
export const seedKey = (seed: number): number => mix32((seed >>> 0) ^ 0x5bd1e995)

/** The key of one trial of a seed. */
export const trialKey = (seedK: number, trial: number): number => mix32(seedK ^ mix32(trial >>> 0))

/**
 * Uniform in the open interval (0, 1) for variable `v` of a trial key: 2^32 equally spaced
 * values, never 0 or 1.
 */
export const uniformOf = (trialK: number, v: number): number => (mix32((trialK + Math.imul(v + 1, GOLDEN)) >>> 0) + 0.5) * INV_TWO_32

/** Uniform in (0, 1) for (seed, trial, variable): the one definition the loops use. */
export const uniformAt = (seed: number, trial: number, v: number): number => uniformOf(trialKey(seedKey(seed), trial), v)
