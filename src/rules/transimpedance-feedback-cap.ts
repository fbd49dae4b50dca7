/**
 * transimpedance-feedback-cap: a transimpedance stage without enough feedback capacitance.
 *
 * What it checks: transimpedance stages whose phase margin is under 60° and whose Cf is below
 * the engine's `suggestedCf` (the smallest Cf up to 1 µF that gives 60°, DESIGN §4.4), or for
 * which no Cf up to 1 µF reaches 60°.
 *
 * When it fires: as above. Severity caution (phase-margin-low adds a warning under 45°).
 *
 * What it recommends: the suggested Cf, and what its corner 1/(2π·Rf·Cf) does to the band
 * (flagged when the corner is below ten times the band's top); when none suffices, less source
 * capacitance or a different amplifier.
 */
import {formatAngle, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const TARGET_DEG = 60

function check({input, result}: RuleContext): RuleFinding[] {
  if (input.topology !== 'transimpedance' || input.rf === null) return []
  const {phaseMargin, suggestedCf} = result.stability
  if (phaseMargin === null || phaseMargin >= TARGET_DEG) return []
  const stated = `This transimpedance stage has ${formatAngle(phaseMargin)} of phase margin with Cf = ${formatQuantity(input.cf, 'F')}`
  if (suggestedCf === null) {
    return [{
      severity: 'caution',
      text:
        `${stated}, and no Cf up to 1 µF reaches ${formatAngle(TARGET_DEG)}. Consider less capacitance at the − input ` +
        `(source ${formatQuantity(input.csource, 'F')}, stray ${formatQuantity(input.cstray, 'F')}), a lower rf, or an amplifier with a different gain-bandwidth.`
    }]
  }
  // Float noise in the engine's search must not make an equal Cf look short.
  if (input.cf >= suggestedCf * (1 - 1e-6)) return []
  const corner = 1 / (2 * Math.PI * input.rf.value * suggestedCf)
  const fH = input.band[1]
  return [{
    severity: 'caution',
    text:
      `${stated}, below the ${formatQuantity(suggestedCf, 'F')} that gives ${formatAngle(TARGET_DEG)}. Consider Cf ≥ ${formatQuantity(suggestedCf, 'F')}; ` +
      `with rf = ${formatQuantity(input.rf.value, 'Ω')} it sets a corner at ${formatQuantity(corner, 'Hz')}` +
      (corner < 10 * fH
        ? `, less than ten times the band's top (${formatQuantity(fH, 'Hz')}): check the signal bandwidth still serves.`
        : '.')
  }]
}

const rule: Rule<'transimpedance-feedback-cap'> = {id: 'transimpedance-feedback-cap', check}
export default rule
