/**
 * resistor-noise-dominant: resistor thermal noise is most of the output noise.
 *
 * What it checks: the share of the output noise power (rms²) over the band that comes from
 * the resistors' thermal noise (every `r:` contributor).
 *
 * When it fires: that share is above one half. Severity caution when a noise requirement is
 * not met, info otherwise.
 *
 * What it recommends: depends on the largest resistor term. rf/rg of a voltage stage: lower
 * impedances, scaling rf and rg together so the gain stays (noise goes as √R), within what the
 * output can drive; rcomp: remove or bypass it; rs or rshunt: the source's own noise, which no
 * amplifier removes; rf of a transimpedance stage: its input-referred current noise √(4kT/Rf)
 * falls as rf rises, so more transimpedance in rf helps; r1, r2, r3 of a low-pass stage:
 * scale the resistors down and the capacitors up together, which keeps f0 and Q.
 */
import type {NoiseKey, StageInput, StageResult} from '../engine/types.js'
import {formatPercent, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'
import {BANDWIDTH_MARGIN, rfNoiseAgainstBandwidth, unmetRequirements} from './stage-terms.js'

const SHARE_LIMIT = 0.5

function advice(input: StageInput, result: StageResult, key: NoiseKey): string {
  switch (key) {
    case 'r:rs':
    case 'r:rshunt':
      return 'That is the source’s own thermal noise, which no amplifier removes: only a lower source resistance (or a larger shunt resistance) helps.'
    case 'r:rcomp':
      return 'Remove rcomp, or bypass it with a capacitor whose corner is well below the band.'
    case 'r:r1':
    case 'r:r2':
    case 'r:r3':
      return 'The filter’s own resistors dominate: scale r1, r2' + (input.topology === 'lowpass-mfb' ? ', r3' : '') +
        ' down and c1, c2 up by the same factor, which keeps f0 and Q (their noise goes as √R), within what the source and the output can drive.'
    case 'r:rp':
    case 'r:rref':
      return 'Consider lower impedances: scale all four resistors of the difference network down together (their noise goes as √R), within what the source can drive.'
    case 'r:riso':
    case 'r:rload':
      return 'The load network itself dominates: check riso and rload.'
    case 'r:rf':
      if (rfNoiseAgainstBandwidth(input, result)) {
        return 'In a transimpedance stage rf’s input-referred noise current √(4kT/Rf) falls as rf rises, but a larger rf would narrow a ' +
          `closed-loop bandwidth that is already short of ${BANDWIDTH_MARGIN} × the band's top (bandwidth-margin): an amplifier with more ` +
          'gain-bandwidth serves both, keeping the bandwidth with a larger rf; a smaller rf or less gain in this stage would raise this noise.'
      }
      if (input.topology === 'transimpedance') {
        return 'In a transimpedance stage rf’s input-referred noise current √(4kT/Rf) falls as rf rises: put more of the gain in rf rather than in later stages.'
      }
      return 'Consider lower impedances: scale rf and rg down together to keep the gain (their noise goes as √R), within what the output can drive.'
    default:
      return 'Consider lower impedances: scale rf and rg down together to keep the gain (their noise goes as √R), within what the output can drive.'
  }
}

function check({input, result}: RuleContext): RuleFinding[] {
  const total = result.noise.outputRms
  if (!(total > 0)) return []
  const resistors = result.noise.contributors.filter((c) => c.key.startsWith('r:'))
  const power = resistors.reduce((sum, c) => sum + c.outputRms ** 2, 0)
  const share = power / total ** 2
  if (share <= SHARE_LIMIT) return []
  const largest = resistors.reduce((a, b) => (b.outputRms > a.outputRms ? b : a))
  const unmet = unmetRequirements(result, ['noise-rms', 'noise-pp'])
  return [{
    severity: unmet.length > 0 ? 'caution' : 'info',
    text:
      `Resistor thermal noise is ${formatPercent(share)} of the output noise power (${formatQuantity(Math.sqrt(power), 'V')} of ` +
      `${formatQuantity(total, 'V')} rms); the largest is ${largest.key.slice(2)} with ${formatQuantity(largest.outputRms, 'V')} rms. ` +
      advice(input, result, largest.key) +
      (unmet.length > 0 ? ` Unmet here: ${unmet.map((r) => r.key).join(', ')}.` : '')
  }]
}

const rule: Rule<'resistor-noise-dominant'> = {id: 'resistor-noise-dominant', check}
export default rule
