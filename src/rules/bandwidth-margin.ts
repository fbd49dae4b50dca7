/**
 * bandwidth-margin: the closed-loop bandwidth is too close to the band of interest.
 *
 * What it checks: the engine's closed-loop −3 dB bandwidth against the band's top fH.
 *
 * When it fires: bandwidth under 10 × fH (a single pole there already takes about 0.5 % off the
 * signal at fH, common practice) → caution; bandwidth under fH, so the band reaches past the
 * response → warning. Silent when the bandwidth is not reached in the analysed span; for a
 * low-pass stage (whose job is to limit the bandwidth) only the warning applies.
 *
 * What it recommends: more gain-bandwidth, less gain in this stage, or a band that matches
 * what the stage passes.
 */
import {formatFixed, formatNumber, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'
import {BANDWIDTH_MARGIN, rfNoiseAgainstBandwidth} from './stage-terms.js'

const MARGIN = BANDWIDTH_MARGIN

function check({input, result}: RuleContext): RuleFinding[] {
  const bw = result.stability.bandwidth
  const fH = input.band[1]
  if (bw === null || bw >= MARGIN * fH) return []
  // A low-pass stage limits the bandwidth on purpose: only a band past its response is news.
  if (result.filter !== null && bw >= fH) return []
  const ratio = bw / fH
  if (bw < fH) {
    return [{
      severity: 'warning',
      text:
        `The band reaches ${formatQuantity(fH, 'Hz')}, past the closed-loop bandwidth of ${formatQuantity(bw, 'Hz')} ` +
        `(${formatNumber(ratio, {digits: 2})} × the band's top): the signal is attenuated inside the band and the noise figures describe ` +
        'a response the signal does not get. Consider more gain-bandwidth, less gain in this stage, or a narrower band.'
    }]
  }
  return [{
    severity: 'caution',
    text:
      `The closed-loop bandwidth, ${formatQuantity(bw, 'Hz')}, is only ${formatFixed(ratio)} × the band's top of ${formatQuantity(fH, 'Hz')} ` +
      `(under ${MARGIN} ×): gain error and phase shift near the top of the band are no longer negligible. ` +
      (rfNoiseAgainstBandwidth(input, result)
        ? 'Consider an amplifier with more gain-bandwidth: less gain here (a smaller rf) would widen the bandwidth but raise rf’s ' +
          'noise, which dominates this stage (resistor-noise-dominant).'
        : 'Consider more gain-bandwidth or less gain in this stage.')
  }]
}

const rule: Rule<'bandwidth-margin'> = {id: 'bandwidth-margin', check}
export default rule
