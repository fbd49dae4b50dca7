/**
 * chain-yield-unavailable: a Monte Carlo was asked for on a chain but one of its stages has no
 * model for it (DESIGN §8.7: today only an instrumentation stage without its block), so no chain
 * yield is given rather than a wrong one.
 *
 * What it checks: the chain's result carries a yield marked unavailable.
 *
 * When it fires: that case. Severity info.
 *
 * What it recommends: judging the chain on its worst-case and RSS DC budget.
 */
import type {RuleFinding} from '../rule.js'
import {unavailableYieldFinding} from '../yield-unavailable.js'
import type {ChainRule, ChainRuleContext} from './rule.js'

function check({result}: ChainRuleContext): RuleFinding[] {
  return unavailableYieldFinding(result.yield, 'chain', result.dc.worstCaseOutput, 'at the converter')
}

const rule: ChainRule<'chain-yield-unavailable'> = {id: 'chain-yield-unavailable', check}
export default rule
