/**
 * temperature-not-entered: drift and tempco terms are zero only because no range was given.
 *
 * What it checks: a stage without a `temperature` key (so 25 … 25 °C, ΔT = 0) whose op-amp
 * has a non-zero `vos-drift` or whose resistors carry a tempco (DESIGN §4.6).
 *
 * When it fires: that combination. Severity caution.
 *
 * What it recommends: entering the stage's operating temperature range.
 */
import type {Rule, RuleContext, RuleFinding} from './rule.js'

function check({input}: RuleContext): RuleFinding[] {
  const [lo, hi] = input.temperature
  if (lo !== 25 || hi !== 25 || input.temperatureEntered !== false) return []
  const tempco = (['rf', 'rg', 'rs', 'rcomp', 'rp', 'rref', 'r1', 'r2', 'r3', 'riso'] as const).filter((k) => (input[k]?.tempco ?? 0) > 0)
  const drift = input.opamp.vosDrift > 0
  if (!drift && tempco.length === 0) return []
  const parts = [...(drift ? ['vos-drift'] : []), ...(tempco.length > 0 ? [`the tempco of ${tempco.join(', ')}`] : [])]
  const which = `${parts.join(' and ')} ${parts.length > 1 ? 'contribute' : 'contributes'}`
  return [{
    severity: 'caution',
    text:
      `No temperature range is entered, so the budget uses 25 … 25 °C and ${which} nothing: those terms are zero only ` +
      'because of that default. Enter the stage’s operating range (temperature).'
  }]
}

const rule: Rule<'temperature-not-entered'> = {id: 'temperature-not-entered', check}
export default rule
