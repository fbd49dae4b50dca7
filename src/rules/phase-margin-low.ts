/**
 * phase-margin-low: the loop's phase margin is under 45°.
 *
 * What it checks: the engine's phase margin at the loop-gain crossover (DESIGN §4.4).
 *
 * When it fires: a crossover exists and the margin is under 45° (common practice: below that
 * the step response rings and the closed-loop response peaks). Severity warning.
 *
 * What it recommends: by topology: a capacitor across rf to cancel the pole of rf with the
 * − input's capacitance, lower rf, less capacitance at the − input; for a follower, removing rf
 * or bridging it; for a transimpedance stage, more Cf (see its own note).
 */
import type {Topology} from '../engine/types.js'
import {formatAngle, formatFixed, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const LIMIT_DEG = 45

const REMEDY: Record<Topology, string> = {
  noninverting: 'Consider a capacitor across rf to cancel the pole rf makes with the − input’s capacitance, a lower rf, or less capacitance at the − input.',
  inverting: 'Consider a capacitor across rf to cancel the pole rf makes with the − input’s capacitance, a lower rf, or less capacitance at the − input.',
  follower: 'Consider removing rf, bridging it with a capacitor, or an amplifier specified as stable at unity gain with more margin.',
  transimpedance: 'Consider a larger feedback capacitor (the transimpedance note quotes the value for 60°).',
  difference: 'Consider a capacitor across rf, less capacitance at the − input, or isolating a capacitive load with riso.',
  'lowpass-sallen-key': 'Consider an amplifier with more margin at the stage’s noise gain, or isolating a capacitive load with riso.',
  instrumentation: 'The part is compensated internally; consider the maker’s guidance on loads.',
  'lowpass-mfb': 'Consider lower filter impedances (less phase lag from r3 with the − input’s capacitance), or isolating a capacitive load with riso.'
}

function check({input, result}: RuleContext): RuleFinding[] {
  const {phaseMargin, crossover, peaking} = result.stability
  if (phaseMargin === null || phaseMargin >= LIMIT_DEG) return []
  return [{
    severity: 'warning',
    text:
      `The phase margin is ${formatAngle(phaseMargin)}` +
      (crossover === null ? '' : ` at the ${formatQuantity(crossover, 'Hz')} crossover`) +
      `, under ${formatAngle(LIMIT_DEG)}; the closed-loop response peaks by ${formatFixed(peaking)} dB. ` +
      REMEDY[input.topology]
  }]
}

const rule: Rule<'phase-margin-low'> = {id: 'phase-margin-low', check}
export default rule
