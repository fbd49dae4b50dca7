/**
 * lower-bias-input-type: the input's current, not its voltage, sets the error.
 *
 * What it checks: (a) noise: the current-noise terms (in+ and in−, root-sum-square) exceed the
 * voltage-noise term at the output, i.e. the resistance the inputs see is above en/in;
 * (b) DC: the bias-current terms (ib + ios) are the largest DC group, larger than the
 * offset-voltage terms (vos + vos-drift) and containing the largest single contributor.
 *
 * When it fires: either holds. Severity caution when a DC or noise requirement is not met,
 * info otherwise.
 *
 * What it recommends: an input type with lower bias current (by technology, never a product):
 * bipolar → bias-cancelled bipolar, JFET or CMOS; bias-cancelled bipolar or zero-drift → JFET
 * or CMOS; JFET → CMOS; CMOS → lower resistances, since no type has less. FET inputs usually
 * bring more voltage noise and offset (common practice), which the text says.
 */
import type {InputType} from '../engine/types.js'
import {formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'
import {dcResistances, dcTerm, largestDcTerm, noiseTerm, unmetRequirements} from './stage-terms.js'

const BETTER: Record<InputType, string> = {
  bipolar: 'a bias-cancelled bipolar, JFET or CMOS input would serve better',
  'bipolar-cancelled': 'a JFET or CMOS input would serve better',
  'zero-drift': 'a JFET or CMOS input would serve better (a zero-drift input’s current comes from its switching)',
  jfet: 'a CMOS input with lower leakage would serve better, though FET leakage still doubles about every 10 K',
  cmos: 'no input type has much less bias current than CMOS, so lower the resistances at the inputs instead'
}

const TRADE_OFF = ' Weigh the change against the higher voltage noise and offset that FET inputs usually bring.'

function check({input, result}: RuleContext): RuleFinding[] {
  // An instrumentation stage's voltage noise is en-in and en-out (DESIGN §8.2).
  const en = input.topology === 'instrumentation' ? Math.hypot(noiseTerm(result, 'en-in'), noiseTerm(result, 'en-out')) : noiseTerm(result, 'en')
  const current = Math.hypot(noiseTerm(result, 'in+'), noiseTerm(result, 'in-'))
  const noiseDominated = current > en && current > 0
  const bias = dcTerm(result, 'ib') + dcTerm(result, 'ios')
  const offset = dcTerm(result, 'vos') + dcTerm(result, 'vos-drift')
  const largest = largestDcTerm(result)
  const dcDominated = bias > offset && largest !== null && (largest.key === 'ib' || largest.key === 'ios')
  if (!noiseDominated && !dcDominated) return []

  const {rn, rp} = dcResistances(input)
  const parts: string[] = []
  if (noiseDominated) {
    const crossover = input.opamp.in > 0 ? input.opamp.en / input.opamp.in : Infinity
    parts.push(
      `current noise gives ${formatQuantity(current, 'V')} rms at the output against ${formatQuantity(en, 'V')} rms from en; ` +
      `the inputs see Rp = ${formatQuantity(rp, 'Ω')} and Rn = ${formatQuantity(rn, 'Ω')}, against en/in = ${formatQuantity(crossover, 'Ω')}`
    )
  }
  if (dcDominated) {
    parts.push(
      `bias and offset currents give ${formatQuantity(bias, 'V')} of worst-case DC error against ${formatQuantity(offset, 'V')} from vos and its drift ` +
      `(IB ${formatQuantity(result.bias.ibMax, 'A')}, IOS ${formatQuantity(result.bias.iosMax, 'A')} over the range)`
    )
  }
  const type = input.opamp.inputType
  const unmet = unmetRequirements(result, ['output-error', 'output-error-rss', 'input-error', 'noise-rms', 'noise-pp'])
  const text =
    `The input currents dominate: ${parts.join('; ')}. With this ${type} input, ${BETTER[type]}.` +
    (type === 'cmos' || type === 'jfet' ? '' : TRADE_OFF) +
    (unmet.length > 0 ? ` Unmet here: ${unmet.map((r) => r.key).join(', ')}.` : '')
  return [{severity: unmet.length > 0 ? 'caution' : 'info', text}]
}

const rule: Rule<'lower-bias-input-type'> = {id: 'lower-bias-input-type', check}
export default rule
