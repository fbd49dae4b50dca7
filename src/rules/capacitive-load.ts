/**
 * capacitive-load: a capacitive load eats the phase margin (DESIGN §8.3).
 *
 * What it checks: the phase margin with the stage's `cload` against the margin with cload
 * removed (the op-amp's `rout` with cload is a second pole in the loop).
 *
 * When it fires: cload without rout (caution: the loop cannot see the load); else the load
 * costs more than 15°. Severity warning when the margin left is
 * under 45°, caution otherwise; info when the stage's own riso already holds 60°.
 *
 * What it recommends: the smallest `riso` (a search over 0.1 Ω … 10 kΩ, like the Cf
 * suggestion of a transimpedance stage) that brings the margin back to 60° when that is
 * reachable, else to 45°, with the closed-loop bandwidth it leaves at the load; or, when no
 * riso reaches 45°, a smaller load or an amplifier specified for capacitive loads.
 */
import {capacitiveLoadAdvice} from '../engine/suggested-riso.js'
import {formatAngle, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const COST_LIMIT = 15
const LOW_MARGIN = 45
const GOOD_MARGIN = 60

function check({input}: RuleContext): RuleFinding[] {
  if (input.cload > 0 && !((input.opamp.rout ?? 0) > 0) && input.topology !== 'instrumentation') {
    return [{
      severity: 'caution',
      text: `cload = ${formatQuantity(input.cload, 'F')} is given but the op-amp's open-loop output resistance (rout) is not entered, so the loop ` +
        'sees an ideal source and the load cannot cost any phase margin here. Enter the part’s rout in its opamp block for a stability figure that includes the load.'
    }]
  }
  const a = capacitiveLoadAdvice(input)
  if (a === null || a.cost === null || a.cost <= COST_LIMIT || a.margin === null || a.marginWithoutLoad === null) return []
  const load = `cload = ${formatQuantity(input.cload, 'F')} with rout = ${formatQuantity(input.opamp.rout ?? 0, 'Ω')}${input.riso ? ` and riso = ${formatQuantity(input.riso.value, 'Ω')}` : ''}`
  const head = `The capacitive load costs ${formatAngle(a.cost)} of phase margin (${load}): ${formatAngle(a.margin)} against ${formatAngle(a.marginWithoutLoad)} unloaded.`
  // An riso already in place that holds 60°: say what the load costs, no change to suggest.
  if (input.riso !== null && a.margin >= GOOD_MARGIN) {
    return [{severity: 'info', text: `${head} The riso in place holds the margin at or above ${formatAngle(GOOD_MARGIN)}.`}]
  }
  const fix = a.riso === null || a.target === null
    ? ' No riso up to 10 kΩ brings the margin back to 45°: consider a smaller load, a lower-impedance buffer, or an amplifier specified for capacitive loads.'
    : ` riso = ${formatQuantity(a.riso, 'Ω')} between the output pin and the load (feedback taken at the pin) brings it back to ${formatAngle(a.target)}` +
      (a.bandwidth === null ? '.' : `, leaving a closed-loop bandwidth of ${formatQuantity(a.bandwidth, 'Hz')} at the load.`) +
      ' Check the DC drop riso makes with any resistive load, and take the next standard value up.'
  return [{severity: a.margin < LOW_MARGIN ? 'warning' : 'caution', text: head + fix}]
}

const rule: Rule<'capacitive-load'> = {id: 'capacitive-load', check}
export default rule
