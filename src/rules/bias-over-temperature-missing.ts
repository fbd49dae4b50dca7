/**
 * bias-over-temperature-missing: no over-temperature bias current entered where it matters.
 *
 * What it checks: the engine's flag (DESIGN §4.2) for a bipolar, bias-cancelled bipolar or
 * zero-drift input whose temperature range leaves 25 °C while the op-amp block gives no
 * `ib-max` (and, for zero-drift, no `ib-doubling`): the budget then uses the 25 °C value.
 *
 * When it fires: that flag is set. Severity caution.
 *
 * What it recommends: enter the datasheet's `ib-max` and `ios-max` over the stage's range.
 */
import {formatQuantity, formatTemperature} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

function check({input, result}: RuleContext): RuleFinding[] {
  if (!result.bias.overTemperatureMissing) return []
  const [tMin, tMax] = input.temperature
  const why = input.opamp.inputType === 'zero-drift'
    ? 'a zero-drift input’s bias current is set by its switching and need not follow the 25 °C figure'
    : 'a bipolar input’s bias current is largest at the cold end'
  return [{
    severity: 'caution',
    text:
      `The range ${formatTemperature(tMin)} … ${formatTemperature(tMax)} leaves 25 °C, but no ib-max was entered for this ` +
      `${input.opamp.inputType} input, so the budget uses the 25 °C values (IB ${formatQuantity(result.bias.ibMax, 'A')}, ` +
      `IOS ${formatQuantity(result.bias.iosMax, 'A')}); ${why}. Enter the datasheet's ib-max and ios-max over the range.`
  }]
}

const rule: Rule<'bias-over-temperature-missing'> = {id: 'bias-over-temperature-missing', check}
export default rule
