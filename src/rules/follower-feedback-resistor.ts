/**
 * follower-feedback-resistor: a follower's feedback resistor against the input capacitance.
 *
 * What it checks: a follower with an rf and no cf of at least the − pin's capacitance. The rf
 * and the capacitance at the − pin, C = cin-diff + cin-cm + cstray (lumped there, which
 * slightly overstates it), make a pole fp = 1/(2π·rf·C) in the feedback path that costs about
 * atan(fc/fp) of phase at the crossover fc (single-pole estimate, common practice).
 *
 * When it fires: fp below 10 × fc, i.e. the pole costs more than about 6° (fc from the engine,
 * or gbw when the loop has no crossover). Severity caution; the phase-margin rule warns
 * separately below 45°.
 *
 * What it recommends: a capacitor across rf (the smallest E3 value of at least 3·C is quoted)
 * or removing rf.
 */
import {roundUpToSeries} from './e-series.js'
import {formatAngle, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

/** Pole at or above this multiple of the crossover costs under ~6° and is let pass. */
const POLE_MARGIN = 10

function check({input, result}: RuleContext): RuleFinding[] {
  if (input.topology !== 'follower' || input.rf === null || input.rf.value <= 0) return []
  const c = input.opamp.cinDiff + input.opamp.cinCm + input.cstray
  if (c <= 0 || input.cf >= c) return []
  const fp = 1 / (2 * Math.PI * input.rf.value * c)
  const fc = result.stability.crossover ?? input.opamp.gbw
  if (fp >= POLE_MARGIN * fc) return []
  const cost = (Math.atan(fc / fp) * 180) / Math.PI
  const pm = result.stability.phaseMargin
  const suggested = roundUpToSeries(3 * c, 'E3')
  return [{
    severity: 'caution',
    text:
      `This follower's rf = ${formatQuantity(input.rf.value, 'Ω')} and the ${formatQuantity(c, 'F')} at the − input ` +
      `(cin-diff + cin-cm + cstray) put a pole at ${formatQuantity(fp, 'Hz')} in the feedback path, ` +
      `${fp < fc ? 'below' : 'within a decade of'} the ${formatQuantity(fc, 'Hz')} crossover: it costs about ` +
      `${formatAngle(cost)} of phase` +
      (pm === null ? '.' : `, leaving a phase margin of ${formatAngle(pm)}.`) +
      ` Consider a capacitor across rf of at least the input capacitance (e.g. ${formatQuantity(suggested, 'F')}), ` +
      'or removing rf if it is there only to match the source resistance.'
  }]
}

const rule: Rule<'follower-feedback-resistor'> = {id: 'follower-feedback-resistor', check}
export default rule
