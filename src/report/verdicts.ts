/**
 * Requirement verdicts: the three-state verdict of each requirement, a stage's and the
 * document's overall verdict, and the cover rows.
 */
import {REQUIREMENT_KEYS, type RequirementResult, type Topology} from '../engine/types.js'
import type {StageEvaluation} from '../evaluate/index.js'
import {REQUIREMENT_LABELS, requirementUnit} from '../results/labels.js'
import {deg, q} from './format.js'
import type {CoverVerdict, Verdict} from './types.js'

export const verdictOf = (r: RequirementResult): Verdict => (r.value === null ? 'not-evaluated' : r.met ? 'met' : 'not-met')

/** Worst of several verdicts: not met beats not evaluated beats met; none at all is not evaluated. */
export function combine(verdicts: Verdict[]): Verdict {
  if (verdicts.includes('not-met')) return 'not-met'
  if (verdicts.length === 0 || verdicts.includes('not-evaluated')) return 'not-evaluated'
  return 'met'
}

/** A requirement value or limit, in its own unit. */
export const requirementValue = (r: RequirementResult, which: 'value' | 'limit', t: Topology): string => {
  const v = r[which]
  const unit = requirementUnit(r.key, t)
  return unit === '°' ? deg(v) : q(v, unit)
}

/** Margin to the limit, signed so that positive is good, in the requirement's unit. */
export function margin(r: RequirementResult, t: Topology): string {
  if (r.value === null) return '—'
  const sense = REQUIREMENT_KEYS[r.key].sense
  const m = sense === 'max' ? r.limit - r.value : r.value - r.limit
  const unit = requirementUnit(r.key, t)
  const rel = r.limit !== 0 ? ` (${((m / Math.abs(r.limit)) * 100).toFixed(0)} %)` : ''
  return (unit === '°' ? deg(m) : q(m, unit)) + rel
}

export function coverRows(evaluations: StageEvaluation[]): CoverVerdict[] {
  return evaluations.flatMap((ev) => ev.result.requirements.map((r): CoverVerdict => ({
    stage: ev.input.id,
    requirement: REQUIREMENT_LABELS[r.key],
    value: requirementValue(r, 'value', ev.input.topology),
    limit: `${REQUIREMENT_KEYS[r.key].sense === 'max' ? '≤' : '≥'} ${requirementValue(r, 'limit', ev.input.topology)}`,
    verdict: verdictOf(r)
  })))
}
