/**
 * yield-unavailable: a Monte Carlo was asked for but the stage has no model for it (DESIGN
 * §8.7), so no yield is given rather than a wrong one.
 *
 * What it checks: the stage's result carries a yield marked unavailable.
 *
 * When it fires: that case (every topology has a model today — the closed forms, and the
 * block model for instrumentation — so it guards what a new topology would lack). Severity info; a `yield`
 * requirement on such a stage is reported not met, since its figure does not exist.
 *
 * What it recommends: judging the stage on its worst-case and RSS budget.
 */
import {formatQuantity} from '../units/index.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

function check({result}: RuleContext): RuleFinding[] {
  const y = result.yield
  if (y === null || y.unavailable === null) return []
  return [{
    severity: 'info',
    text:
      `No Monte Carlo yield for this stage: ${y.unavailable}, and a yield computed another way would not be the budget’s model. ` +
      `Judge the stage on its worst-case DC error (${formatQuantity(result.dc.worstCaseOutput, 'V')} at the output) and its RSS figure.`
  }]
}

const rule: Rule<'yield-unavailable'> = {id: 'yield-unavailable', check}
export default rule
