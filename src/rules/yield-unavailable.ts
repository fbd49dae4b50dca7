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

/**
 * The finding for a Monte Carlo marked unavailable, of a stage or (chain-yield-unavailable) a
 * chain: `block` names it, `where` the node its worst case is taken at.
 */
export function unavailableYieldFinding(y: {unavailable: string | null} | null, block: 'stage' | 'chain', worstCase: number, where: string): RuleFinding[] {
  if (y === null || y.unavailable === null) return []
  return [{
    severity: 'info',
    text:
      `No Monte Carlo yield for this ${block}: ${y.unavailable}, and a yield computed another way would not be the budget’s model. ` +
      `Judge the ${block} on its worst-case DC error (${formatQuantity(worstCase, 'V')} ${where}) and its RSS figure.`
  }]
}

function check({result}: RuleContext): RuleFinding[] {
  return unavailableYieldFinding(result.yield, 'stage', result.dc.worstCaseOutput, 'at the output')
}

const rule: Rule<'yield-unavailable'> = {id: 'yield-unavailable', check}
export default rule
