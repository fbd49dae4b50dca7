/**
 * The stage's requirement verdicts: value, limit, margin and a verdict word with its mark.
 */
import type {BlockContent} from 'mdast'
import {REQUIREMENT_KEYS} from '../../engine/types.js'
import type {StageEvaluation} from '../../evaluate/index.js'
import {REQUIREMENT_LABELS} from '../../results/labels.js'
import {verdictText} from '../format.js'
import {callout, code, paragraph, table} from '../mdast.js'
import {combine, margin, requirementValue, verdictOf} from '../verdicts.js'

export function requirementBlocks(ev: StageEvaluation): BlockContent[] {
  const reqs = ev.result.requirements
  const t = ev.input.topology
  if (reqs.length === 0) {
    return [callout('not-evaluated', 'NO REQUIREMENTS', [
      paragraph('This stage states no requirements (no ', code('require:'), ' map), so nothing is checked against a limit.')
    ])]
  }
  const rows = reqs.map((r) => [
    [REQUIREMENT_LABELS[r.key], ' (', code(r.key), ')'],
    requirementValue(r, 'value', t),
    `${REQUIREMENT_KEYS[r.key].sense === 'max' ? '≤' : '≥'} ${requirementValue(r, 'limit', t)}`,
    margin(r, t),
    verdictText(verdictOf(r))
  ])
  const overall = combine(reqs.map(verdictOf))
  const failed = reqs.filter((r) => verdictOf(r) === 'not-met').map((r) => r.key)
  return [
    table(['Requirement', 'Value', 'Limit', 'Margin', 'Verdict'], rows, ['left', 'right', 'right', 'right', 'left']),
    callout(overall, overall === 'met' ? 'ALL MET' : overall === 'not-met' ? 'NOT MET' : 'NOT EVALUATED', [
      paragraph(overall === 'met'
        ? `Stage ${ev.input.id} meets all ${reqs.length} of its requirements.`
        : overall === 'not-met'
          ? `Stage ${ev.input.id} does not meet ${failed.length} of its ${reqs.length} requirements: ${failed.join(', ')}.`
          : `Some requirements of stage ${ev.input.id} could not be evaluated (the value does not exist).`)
    ])
  ]
}
