/**
 * fet-bias-hot-end: a FET input's bias current outgrows the budget at the hot end.
 *
 * What it checks: JFET and CMOS inputs (and zero-drift inputs given an `ib-doubling`) over a
 * range whose top is above 25 °C. Their bias current roughly doubles every `ib-doubling`
 * kelvin (DESIGN §4.2), so the `ib` and `ios` terms at Tmax are compared against the budget.
 *
 * When it fires (criterion): ib + ios terms at Tmax exceed half the `output-error` requirement
 * when there is one; without one, they exceed the offset-voltage terms (vos + vos-drift).
 * Severity caution.
 *
 * What it recommends: lower resistances at the inputs, matched Rp = Rn, keeping the part
 * cooler, guarding the input node, or an input with lower leakage.
 */
import {formatNumber, formatPercent, formatQuantity, formatTemperature} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'
import {dcTerm} from './stage-terms.js'

const SHARE_OF_LIMIT = 0.5

function check({input, result}: RuleContext): RuleFinding[] {
  const {opamp} = input
  const tMax = input.temperature[1]
  const grows = opamp.inputType === 'jfet' || opamp.inputType === 'cmos' ||
    (opamp.inputType === 'zero-drift' && result.bias.ibSource === 'doubling')
  if (!grows || tMax <= 25) return []
  const bias = dcTerm(result, 'ib') + dcTerm(result, 'ios')
  const limit = input.require['output-error']
  const offset = dcTerm(result, 'vos') + dcTerm(result, 'vos-drift')
  const over = limit !== undefined ? bias > SHARE_OF_LIMIT * limit : bias > offset
  if (!over) return []
  const growth = opamp.ib > 0 ? result.bias.ibMax / opamp.ib : null
  const against = limit !== undefined
    ? `more than half (${formatPercent(bias / limit)}) of the ${formatQuantity(limit, 'V')} output-error limit`
    : `more than the ${formatQuantity(offset, 'V')} from vos and its drift`
  return [{
    severity: 'caution',
    text:
      `At ${formatTemperature(tMax)} the input bias current is ${formatQuantity(result.bias.ibMax, 'A')}` +
      (growth === null ? '' : ` (${formatNumber(growth)} × its ${formatQuantity(opamp.ib, 'A')} at 25 °C)`) +
      `, and the bias and offset-current terms reach ${formatQuantity(bias, 'V')} at the output, ${against}. ` +
      'Consider lower resistances at the inputs, matched DC resistances, keeping the part away from heat, a guard ring ' +
      'round the input node, or an input with lower leakage; and check the datasheet’s hot-end maximum against the doubling estimate.'
  }]
}

const rule: Rule<'fet-bias-hot-end'> = {id: 'fet-bias-hot-end', check}
export default rule
