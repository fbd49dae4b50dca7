/**
 * The stage's requirement verdicts: value, limit, margin and a verdict word with its mark.
 */
import type {BlockContent} from 'mdast'
import type {StageEvaluation} from '../../evaluate/index.js'
import {verdictText} from '../format.js'
import {callout, code, paragraph, table} from '../mdast.js'
import {combine, counted, isSkipped, limitText, margin, requirementLabel, requirementValue, verdictOf} from '../verdicts.js'

export function requirementBlocks(ev: StageEvaluation): BlockContent[] {
  const all = ev.result.requirements
  const reqs = counted(all)
  const t = ev.input.topology
  if (all.length === 0) {
    return [callout('not-evaluated', 'NO REQUIREMENTS', [
      paragraph('This stage states no requirements (no ', code('require:'), ' map), so nothing is checked against a limit.')
    ])]
  }
  const rows = all.map((r) => [
    [requirementLabel(r), ' (', code(r.key), ')'],
    requirementValue(r, 'value', t),
    limitText(r, t),
    margin(r, t),
    isSkipped(r) ? '– skipped' : verdictText(verdictOf(r))
  ])
  const limits = all.filter((r) => r.kind === 'limit').length
  const overall = combine(reqs.map(verdictOf))
  const failed = reqs.filter((r) => verdictOf(r) === 'not-met').map((r) => r.key)
  const baseline = ev.role === 'baseline'
  const word = overall === 'met' ? 'ALL MET' : overall === 'not-met' ? 'NOT MET' : 'NOT EVALUATED'
  return [
    table(['Requirement', 'Value', 'Limit', 'Margin', 'Verdict'], rows, ['left', 'right', 'right', 'right', 'left']),
    paragraph(`Rows marked (limit) are the ${limits} physical limits checked on every stage: what the parts can do, ` +
      'whatever the note requires; a limit whose data is not entered is skipped and counts towards no verdict.'),
    ...(baseline ? [paragraph('This is a baseline stage (', code('role: baseline'), '), kept for comparison: its verdicts are shown but count toward neither the overall verdict nor the exit code.')] : []),
    callout(overall, baseline ? `${word} (BASELINE, NOT COUNTED)` : word, [
      paragraph(overall === 'met'
        ? `Stage ${ev.input.id} meets all ${reqs.length} of its requirements and checked limits.`
        : overall === 'not-met'
          ? `Stage ${ev.input.id} does not meet ${failed.length} of its ${reqs.length} requirements and checked limits: ${failed.join(', ')}.`
          : `Some requirements of stage ${ev.input.id} could not be evaluated (the value does not exist).`)
    ])
  ]
}
