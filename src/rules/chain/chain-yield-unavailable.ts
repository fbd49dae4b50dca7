/**
 * chain-yield-unavailable: a Monte Carlo was asked for on a chain but one of its stages has no
 * closed-form DC solution for it (DESIGN §8.7: today an instrumentation stage), so no chain
 * yield is given rather than a wrong one.
 *
 * What it checks: the chain's result carries a yield marked unavailable.
 *
 * When it fires: that case. Severity info.
 *
 * What it recommends: judging the chain on its worst-case and RSS DC budget.
 */
import {formatQuantity} from '../../units/index.js'
import type {RuleFinding} from '../rule.js'
import type {ChainRule, ChainRuleContext} from './rule.js'

function check({result}: ChainRuleContext): RuleFinding[] {
  const y = result.yield
  if (y === null || y.unavailable === null) return []
  return [{
    severity: 'info',
    text:
      `No Monte Carlo yield for this chain: ${y.unavailable}, and a yield computed another way would not be the budget’s model. ` +
      `Judge the chain on its worst-case DC error (${formatQuantity(result.dc.worstCaseOutput, 'V')} at the converter) and its RSS figure.`
  }]
}

const rule: ChainRule<'chain-yield-unavailable'> = {id: 'chain-yield-unavailable', check}
export default rule
