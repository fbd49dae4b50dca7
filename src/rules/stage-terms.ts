/**
 * Small lookups the rules share on a stage and its result: one DC or noise contributor, the
 * largest DC contributor, the DC resistances at each input (DESIGN §4.1), and the
 * requirements that were not met. Plain reads; nothing here decides whether a rule fires.
 */
import {topologyTerms} from '../engine/topology/index.js'
import type {DcKey, NoiseKey, RequirementKey, RequireResult, StageInput, StageResult} from '../engine/types.js'

/** Output-referred magnitude of one DC contributor, V (0 when the topology does not list it). */
export function dcTerm(result: StageResult, key: DcKey): number {
  return result.dc.contributors.find((c) => c.key === key)?.output ?? 0
}

/** Output rms of one noise contributor over the band, V (0 when not listed). */
export function noiseTerm(result: StageResult, key: NoiseKey): number {
  return result.noise.contributors.find((c) => c.key === key)?.outputRms ?? 0
}

/** The DC contributor with the largest output magnitude; null when every term is zero. */
export function largestDcTerm(result: StageResult): {key: DcKey; output: number} | null {
  let best: {key: DcKey; output: number} | null = null
  for (const c of result.dc.contributors) {
    if (c.output > 0 && (best === null || c.output > best.output)) best = c
  }
  return best
}

const parallel = (a: number, b: number): number => (a === 0 || b === 0 ? 0 : (a * b) / (a + b))
const ohms = (r: {value: number} | null): number => r?.value ?? 0

/**
 * Nominal DC resistance seen by each input (DESIGN §4.1): Rn at the − input, Rp at the + input, Ω.
 */
export function dcResistances(input: StageInput): {rn: number; rp: number} {
  const rf = ohms(input.rf)
  const rg = ohms(input.rg)
  const rs = ohms(input.rs)
  const rcomp = ohms(input.rcomp)
  switch (input.topology) {
    case 'noninverting':
      return {rn: parallel(rf, rg), rp: rs + rcomp}
    case 'inverting':
      return {rn: parallel(rf, rg + rs), rp: rcomp}
    case 'follower':
      return {rn: rf, rp: rs + rcomp}
    case 'transimpedance':
      // An open shunt (null) leaves Rf alone at the − input.
      return {rn: input.rshunt === null ? rf : parallel(rf, input.rshunt), rp: rcomp}
    case 'difference':
    case 'lowpass-sallen-key':
    case 'instrumentation':
      return {rn: rs, rp: rs}
    case 'lowpass-mfb': {
      const t = topologyTerms(input)
      return {rn: t.rn, rp: t.rp}
    }
  }
}

/** Requirements among `keys` that the stage does not meet. */
export function unmetRequirements(result: StageResult, keys: readonly RequirementKey[]): RequireResult[] {
  return result.requirements.filter((r): r is RequireResult => r.kind === 'require' && !r.met && keys.includes(r.key))
}


/** Ratio under which the closed-loop bandwidth is too close to the band's top (bandwidth-margin; common practice). */
export const BANDWIDTH_MARGIN = 10

/** Closed-loop bandwidth ÷ the band's top, or null when the bandwidth is not reached. */
export function bandwidthRatio(input: StageInput, result: StageResult): number | null {
  const bw = result.stability.bandwidth
  return bw === null ? null : bw / input.band[1]
}

/** Share of the output noise power that resistors' thermal noise makes (0 … 1). */
export function resistorNoiseShare(result: StageResult): number {
  const total = result.noise.outputRms
  if (!(total > 0)) return 0
  const power = result.noise.contributors.filter((c) => c.key.startsWith('r:')).reduce((sum, c) => sum + c.outputRms ** 2, 0)
  return power / total ** 2
}

/**
 * True when rf's thermal noise dominates a transimpedance stage whose bandwidth margin is
 * short: "more gain in rf" (noise) and "less gain" (bandwidth) pull against each other, and
 * both rules then give the one recommendation that serves both, more gain-bandwidth.
 */
export function rfNoiseAgainstBandwidth(input: StageInput, result: StageResult): boolean {
  if (input.topology !== 'transimpedance') return false
  const ratio = bandwidthRatio(input, result)
  if (ratio === null || ratio >= BANDWIDTH_MARGIN || resistorNoiseShare(result) <= 0.5) return false
  const resistors = result.noise.contributors.filter((c) => c.key.startsWith('r:'))
  const largest = resistors.reduce((a, b) => (b.outputRms > a.outputRms ? b : a), resistors[0] ?? {key: 'r:rf', outputRms: 0})
  return largest.key === 'r:rf'
}
