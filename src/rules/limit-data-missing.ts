/**
 * limit-data-missing: a physical limit skipped because its data is not entered.
 *
 * What it checks: the engine's `input-common-mode`, `slew` and `output-current` limits
 * (DESIGN §4.6); a limit, or one rail of it, with no data is not checked. (`output-swing`
 * without headroom is the `output-swing` rule's caution.)
 *
 * When it fires: any of those limits is skipped, or checked on one rail only. Severity info.
 *
 * What it recommends: the keys that would enable the check.
 */
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const WHAT = {
  'input-common-mode': 'the input common-mode range',
  slew: 'the slew rate',
  'output-current': 'the output current'
} as const

function check({result}: RuleContext): RuleFinding[] {
  const out: RuleFinding[] = []
  for (const r of result.requirements) {
    if (r.kind !== 'limit' || r.key === 'output-swing' || r.missing.length === 0) continue
    const keys = r.missing.length === 3 ? `${r.missing[0]} (or ${r.missing[1]} and ${r.missing[2]})` : r.missing.join(', ')
    out.push({
      severity: 'info',
      text: r.met === null
        ? `The ${r.key} limit (${WHAT[r.key]}) is not checked: enter ${keys} in the op-amp block${r.key === 'output-current' ? ' (and rload on the stage for its load)' : ''} to check it.`
        : `The ${r.key} limit is checked on one rail only: enter ${keys} to check the other.`
    })
  }
  return out
}

const rule: Rule<'limit-data-missing'> = {id: 'limit-data-missing', check}
export default rule
