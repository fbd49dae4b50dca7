/**
 * Requirement verdicts: the three-state verdict of each requirement and physical limit
 * (DESIGN §4.6), a stage's and the document's overall verdict, and the cover rows. A limit
 * whose data is not entered is skipped: shown as such, and left out of the overall verdict.
 */
import {REQUIREMENT_KEYS, type RequirementResult, type Topology} from '../engine/types.js'
import type {StageEvaluation} from '../evaluate/index.js'
import {LIMIT_LABELS, REQUIREMENT_LABELS, requirementUnit} from '../results/labels.js'
import {deg, q} from './format.js'
import {formatFixed, formatNumber, formatRange, formatSlew} from '../units/format.js'
import type {CoverNote, CoverSummary, CoverVerdict, Verdict} from './types.js'

export const verdictOf = (r: RequirementResult): Verdict =>
  r.kind === 'limit' ? (r.met === null ? 'not-evaluated' : r.met ? 'met' : 'not-met') : r.value === null ? 'not-evaluated' : r.met ? 'met' : 'not-met'

/** True for a limit skipped for want of data (not part of any overall verdict). */
export const isSkipped = (r: RequirementResult): boolean => r.kind === 'limit' && r.met === null

/** Rows that count towards a verdict: every requirement, and the limits that were checked. */
export const counted = (rows: readonly RequirementResult[]): RequirementResult[] => rows.filter((r) => !isSkipped(r))

/** Worst of several verdicts: not met beats not evaluated beats met; none at all is not evaluated. */
export function combine(verdicts: Verdict[]): Verdict {
  if (verdicts.includes('not-met')) return 'not-met'
  if (verdicts.length === 0 || verdicts.includes('not-evaluated')) return 'not-evaluated'
  return 'met'
}

/** The row's name as printed; limits are marked as limits. */
export const requirementLabel = (r: RequirementResult): string =>
  r.kind === 'require' ? REQUIREMENT_LABELS[r.key] : `${LIMIT_LABELS[r.key]} (limit)`

const LIMIT_UNIT = {'output-swing': 'V', 'input-common-mode': 'V', slew: 'V/s', 'output-current': 'A'} as const

/** A limit's value in its unit; a slew rate in V/µs, as engineers write it. */
const limitQ = (v: number | null, unit: string): string => (unit === 'V/s' && v !== null ? formatSlew(v) : q(v, unit))

/** A range with enough digits to tell its ends apart ("2.499 … 2.501 V"); an open end is "any". */
const rangeText = (lo: number | null, hi: number | null, unit: string): string =>
  lo !== null && hi !== null ? formatRange(lo, hi, unit) : `${lo === null ? 'any' : q(lo, unit)} … ${hi === null ? 'any' : q(hi, unit)}`

/** A requirement or limit value, in its own unit. */
export const requirementValue = (r: RequirementResult, which: 'value' | 'limit', t: Topology): string => {
  if (r.kind === 'require') {
    const v = r[which]
    const unit = requirementUnit(r.key, t)
    // A yield is a fraction, printed as a percentage (DESIGN §8.7).
    if (unit === '%') return v === null ? '—' : `${(v * 100).toFixed(v > 0.999 && v < 1 ? 3 : 2)} %`
    return unit === '°' ? deg(v) : q(v, unit)
  }
  const unit = LIMIT_UNIT[r.key]
  if (r.key === 'output-swing' || r.key === 'input-common-mode') {
    if (which === 'value') return rangeText(r.value[0], r.value[1], unit)
    return r.limit === null ? 'not entered' : rangeText(r.limit[0], r.limit[1], unit)
  }
  if (r.key === 'slew' || r.key === 'output-current') {
    const v = which === 'value' ? r.value : r.limit
    return which === 'limit' && v === null ? 'not entered' : limitQ(v, unit)
  }
  return '—'
}

/** The limit column: "≤ x", "≥ x" or "within a … b". */
export const limitText = (r: RequirementResult, t: Topology): string => {
  if (r.kind === 'require') return `${REQUIREMENT_KEYS[r.key].sense === 'max' ? '≤' : '≥'} ${requirementValue(r, 'limit', t)}`
  if (r.met === null) return `skipped: enter ${r.missing.length === 3 ? `${r.missing[0]} (or ${r.missing[1]} and ${r.missing[2]})` : r.missing.join(', ')}`
  if (r.key === 'output-swing' || r.key === 'input-common-mode') return `within ${requirementValue(r, 'limit', t)}`
  return `≤ ${requirementValue(r, 'limit', t)}`
}

/** The margin as a share of the limit, " (16 %)"; beyond ±10 000 % it says so rather than print an exponent. */
export function relative(m: number, limit: number): string {
  if (limit === 0) return ''
  const p = (m / Math.abs(limit)) * 100
  if (!Number.isFinite(p)) return ''
  return Math.abs(p) >= 1e4 ? ` (${p < 0 ? 'below −' : 'over '}10 000 %)` : ` (${formatFixed(p, {decimals: 0})} %)`
}

/** Margin to the limit, signed so that positive is good, in the requirement's unit. */
export function margin(r: RequirementResult, t: Topology): string {
  if (r.kind === 'limit') {
    if (r.met === null || r.limit === null) return '—'
    const unit = LIMIT_UNIT[r.key]
    if (r.key === 'output-swing' || r.key === 'input-common-mode') {
      const sides = [r.limit[0] === null ? Infinity : r.value[0] - r.limit[0], r.limit[1] === null ? Infinity : r.limit[1] - r.value[1]]
      return q(Math.min(...sides), unit)
    }
    if (r.key === 'slew' || r.key === 'output-current') {
      const m = r.limit - r.value
      const rel = relative(m, r.limit)
      const fpbw = r.key === 'slew' && r.fullPowerBandwidth !== null ? `; full-power bandwidth ${q(r.fullPowerBandwidth, 'Hz')}` : ''
      return limitQ(m, unit) + rel + fpbw
    }
    return '—'
  }
  if (r.value === null) return '—'
  const sense = REQUIREMENT_KEYS[r.key].sense
  const m = sense === 'max' ? r.limit - r.value : r.value - r.limit
  const unit = requirementUnit(r.key, t)
  // Above 100 % a margin reads better as a ratio of value to limit ("15 ×") than as "1396 %".
  const share = r.limit !== 0 ? m / Math.abs(r.limit) : null
  const ratio = share === null ? null : sense === 'max' ? r.limit / r.value : r.value / r.limit
  const rel = share !== null && share > 1 && ratio !== null && Number.isFinite(ratio) && ratio < 1e6
    ? ` (${formatNumber(ratio, {digits: 2})} ×)`
    : relative(m, r.limit)
  if (unit === '%') return `${m >= 0 ? '' : '−'}${(Math.abs(m) * 100).toFixed(2)} percentage points`
  return (unit === '°' ? deg(m) : q(m, unit)) + rel
}

/** The cover's rows: every requirement and every checked limit (skipped limits are in the stage sections). */
export function coverRows(evaluations: StageEvaluation[]): CoverVerdict[] {
  return evaluations.flatMap((ev) => counted(ev.result.requirements).map((r): CoverVerdict => ({
    stage: ev.input.id,
    requirement: requirementLabel(r),
    value: requirementValue(r, 'value', ev.input.topology),
    limit: limitText(r, ev.input.topology),
    verdict: verdictOf(r),
    counted: ev.role !== 'baseline'
  })))
}

/** The cover's summary of a note's evaluations; `notes` comes from the sections (their anchors). */
export function coverSummary(evaluations: readonly StageEvaluation[], notes: CoverNote[], chainRows: readonly CoverVerdict[] = []): CoverSummary {
  const counted = evaluations.filter((ev) => ev.role !== 'baseline')
  const requirements = counted.flatMap((ev) => ev.result.requirements).filter((r) => !isSkipped(r))
  const verdicts = [...requirements.map(verdictOf), ...chainRows.map((v) => v.verdict)]
  const chains = new Set(chainRows.map((v) => v.stage)).size
  return {
    verdicts: [...coverRows([...evaluations]), ...chainRows],
    overall: combine(verdicts),
    counted: {stages: counted.length, chains, requirements: verdicts.length, notMet: verdicts.filter((v) => v === 'not-met').length},
    baseline: evaluations.filter((ev) => ev.role === 'baseline').map((ev) => ev.input.id),
    archetypes: evaluations.filter((ev) => ev.input.opamp.archetype).map((ev) => ({stage: ev.input.id, opamp: ev.input.opamp.name})),
    notes
  }
}
