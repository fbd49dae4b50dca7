/**
 * output-swing: the output's span over the input range does not fit the swing limits, or
 * they were never entered.
 *
 * What it checks: the engine's `output-swing` limit (DESIGN §4.6): Vout,ideal at both ends of
 * the input range (reference term included) against the rails at the low end of
 * `supply-tolerance` less the amplifier's swing headroom on each rail.
 *
 * When it fires: the span exceeds the allowed range at either end (severity warning; the limit
 * row itself fails the stage), or no swing headroom was entered for either rail (severity
 * caution: the check is skipped, since 0 V headroom would flatter every single-supply stage).
 *
 * What it recommends: less gain, a shifted reference, wider rails or an output that swings
 * closer to them, with the excess at each end quoted; or entering the datasheet's headroom.
 */
import {formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

function check({input, result}: RuleContext): RuleFinding[] {
  const limit = result.requirements.find((r) => r.kind === 'limit' && r.key === 'output-swing')
  const {outputSpan, allowed, excess, fits} = result.swing
  if (limit !== undefined && limit.met === null) {
    return [{
      severity: 'caution',
      text:
        `No swing headroom was entered for ${input.opamp.name} (swing-headroom, or swing-headroom-neg / swing-headroom-pos), so the ` +
        `output-swing limit is skipped: the output must span ${formatQuantity(outputSpan[0], 'V')} … ${formatQuantity(outputSpan[1], 'V')} ` +
        `on rails of ${formatQuantity(input.supply[0], 'V')} … ${formatQuantity(input.supply[1], 'V')}. Enter the datasheet's output swing ` +
        'to each rail at the load of this stage.'
    }]
  }
  if (fits && excess[0] <= 0 && excess[1] <= 0) return []
  const ends: string[] = []
  if (excess[0] > 0) ends.push(`${formatQuantity(excess[0], 'V')} below the lower limit`)
  if (excess[1] > 0) ends.push(`${formatQuantity(excess[1], 'V')} above the upper limit`)
  const tol = formatQuantity(input.supplyTolerance * 100, '%')
  return [{
    severity: 'warning',
    text:
      `The output must span ${formatQuantity(outputSpan[0], 'V')} … ${formatQuantity(outputSpan[1], 'V')} but can reach only ` +
      `${formatQuantity(allowed[0], 'V')} … ${formatQuantity(allowed[1], 'V')} (supply ${formatQuantity(input.supply[0], 'V')} … ` +
      `${formatQuantity(input.supply[1], 'V')} at its ${tol} low end, less the swing headroom of each rail): it is ` +
      `${ends.join(' and ')}. Consider less gain, a shifted reference, wider rails or an output stage that swings closer to them.`
  }]
}

const rule: Rule<'output-swing'> = {id: 'output-swing', check}
export default rule
