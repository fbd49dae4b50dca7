/**
 * output-swing: the output's span over the input range does not fit the swing limits.
 *
 * What it checks: the engine's swing check (DESIGN §4.1): the output at both ends of the input
 * range against the supply less the amplifier's swing headroom on each rail.
 *
 * When it fires: the span exceeds the allowed range at either end. Severity warning.
 *
 * What it recommends: less gain, a shifted reference, wider rails or an output that swings
 * closer to them; the excess at each end is quoted.
 */
import {formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

function check({input, result}: RuleContext): RuleFinding[] {
  const {outputSpan, allowed, excess, fits} = result.swing
  if (fits && excess[0] <= 0 && excess[1] <= 0) return []
  const ends: string[] = []
  if (excess[0] > 0) ends.push(`${formatQuantity(excess[0], 'V')} below the lower limit`)
  if (excess[1] > 0) ends.push(`${formatQuantity(excess[1], 'V')} above the upper limit`)
  return [{
    severity: 'warning',
    text:
      `The output must span ${formatQuantity(outputSpan[0], 'V')} … ${formatQuantity(outputSpan[1], 'V')} but can reach only ` +
      `${formatQuantity(allowed[0], 'V')} … ${formatQuantity(allowed[1], 'V')} (supply ${formatQuantity(input.supply[0], 'V')} … ` +
      `${formatQuantity(input.supply[1], 'V')} less ${formatQuantity(input.opamp.swingHeadroom, 'V')} headroom): it is ` +
      `${ends.join(' and ')}. Consider less gain, a shifted reference, wider rails or an output stage that swings closer to them.`
  }]
}

const rule: Rule<'output-swing'> = {id: 'output-swing', check}
export default rule
