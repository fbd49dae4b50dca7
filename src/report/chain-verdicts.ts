/**
 * A chain's verdicts as printed (DESIGN §8.6): each requirement and the converter-range limit
 * with its value, limit, margin and three-state verdict, and the cover rows. Units follow the
 * key: V (A for a transimpedance first stage) at the input, V at the output, LSB, bits, dB.
 */
import {CHAIN_REQUIREMENT_KEYS, type ChainRequirementKey, type ChainRequirementResult} from '../engine/chain/types.js'
import type {ChainEvaluation} from '../evaluate/chains.js'
import {q} from './format.js'
import {relative as relativeMargin} from './verdicts.js'
import type {CoverVerdict, Verdict} from './types.js'

export const CHAIN_REQUIREMENT_LABELS: Record<ChainRequirementKey, string> = {
  'input-error': 'DC error referred to the chain input, worst case',
  'output-error': 'DC error at the converter input, worst case',
  'error-lsb': 'DC error at the converter, worst case, in LSB',
  'noise-free-bits': 'Noise-free bits at the converter',
  'effective-bits': 'Effective resolution at the converter',
  'alias-rejection': 'Alias rejection at fs − fH … fs + fH',
  'noise-rms-input': 'Noise referred to the chain input, rms',
  'input-error-calibrated': 'DC error referred to the input after calibration',
  'output-error-calibrated': 'DC error at the converter input after calibration',
  'error-lsb-calibrated': 'DC error at the converter after calibration, in LSB',
  yield: 'Monte Carlo yield of each DC error requirement, minimum'
}

/** The unit of a chain requirement. */
export function chainUnit(ev: Pick<ChainEvaluation, 'topologies'>, key: ChainRequirementKey): string {
  const u = CHAIN_REQUIREMENT_KEYS[key].unit
  return u === 'input' ? (ev.topologies[0] === 'transimpedance' ? 'A' : 'V') : u
}

const fixed = (v: number | null, unit: string, digits: number): string => (v === null || !Number.isFinite(v) ? '—' : `${v.toFixed(digits)} ${unit}`)

/** A value in its unit: SI prefixes for V and A, fixed decimals for LSB, bits and dB. */
export function chainQuantity(v: number | null, unit: string): string {
  if (unit === '%') return v === null || !Number.isFinite(v) ? '—' : `${(v * 100).toFixed(v > 0.999 && v < 1 ? 3 : 2)} %`
  if (unit === 'LSB') return fixed(v, 'LSB', v === null || Math.abs(v) < 10 ? 2 : Math.abs(v) < 100 ? 1 : 0)
  if (unit === 'bits') return fixed(v, 'bits', 2)
  if (unit === 'dB') return fixed(v, 'dB', 1)
  return q(v, unit)
}

export const chainVerdictOf = (r: ChainRequirementResult): Verdict =>
  r.kind === 'limit' ? (r.met === null ? 'not-evaluated' : r.met ? 'met' : 'not-met') : r.value === null ? 'not-evaluated' : r.met ? 'met' : 'not-met'

export const chainRequirementLabel = (r: ChainRequirementResult): string =>
  r.kind === 'require' ? CHAIN_REQUIREMENT_LABELS[r.key] : 'Chain output inside the converter range (limit)'

export function chainRequirementValue(ev: Pick<ChainEvaluation, 'topologies'>, r: ChainRequirementResult, which: 'value' | 'limit'): string {
  if (r.kind === 'require') return chainQuantity(r[which], chainUnit(ev, r.key))
  const pair = which === 'value' ? r.value : r.limit
  return pair === null ? 'no converter' : `${q(pair[0], 'V')} … ${q(pair[1], 'V')}`
}

export function chainLimitText(ev: Pick<ChainEvaluation, 'topologies'>, r: ChainRequirementResult): string {
  if (r.kind === 'require') return `${CHAIN_REQUIREMENT_KEYS[r.key].sense === 'max' ? '≤' : '≥'} ${chainRequirementValue(ev, r, 'limit')}`
  return r.met === null ? 'skipped: no `adc`' : `within ${chainRequirementValue(ev, r, 'limit')}`
}

export function chainMargin(ev: Pick<ChainEvaluation, 'topologies'>, r: ChainRequirementResult): string {
  if (r.kind === 'limit') {
    if (r.limit === null) return '—'
    return q(Math.min(r.value[0] - r.limit[0], r.limit[1] - r.value[1]), 'V')
  }
  if (r.value === null) return '—'
  const m = CHAIN_REQUIREMENT_KEYS[r.key].sense === 'max' ? r.limit - r.value : r.value - r.limit
  if (CHAIN_REQUIREMENT_KEYS[r.key].unit === '%') return `${m >= 0 ? '' : '−'}${(Math.abs(m) * 100).toFixed(2)} percentage points`
  const rel = relativeMargin(m, r.limit)
  return chainQuantity(m, chainUnit(ev, r.key)) + rel
}

/** The cover's rows for the chains: every requirement and the checked limit. */
export function chainCoverRows(chains: readonly ChainEvaluation[]): CoverVerdict[] {
  return chains.flatMap((ev) => ev.result.requirements.filter((r) => !(r.kind === 'limit' && r.met === null)).map((r): CoverVerdict => ({
    stage: `chain ${ev.input.id}`,
    requirement: chainRequirementLabel(r),
    value: chainRequirementValue(ev, r, 'value'),
    limit: chainLimitText(ev, r),
    verdict: chainVerdictOf(r),
    counted: true
  })))
}
