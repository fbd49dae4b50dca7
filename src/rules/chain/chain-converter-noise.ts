/**
 * chain-converter-noise: the converter's own noise dominates the measurement.
 *
 * What it checks: the converter's noise and quantisation (noise² + LSB²/12) against the
 * analog chain's noise over the band, both at the converter input.
 *
 * When it fires: the converter's part is more than half of σ² at the converter (info when
 * the range is nearly full, caution when there is room for more gain).
 *
 * What it recommends: more analog gain, which lifts the signal above the converter's floor
 * — as far as the converter's range allows.
 */
import {formatQuantity} from '../../units/format.js'
import type {RuleFinding} from '../rule.js'
import type {ChainRule, ChainRuleContext} from './rule.js'

function check({result}: ChainRuleContext): RuleFinding[] {
  const c = result.converter
  const sigma = result.noise.converterRms
  if (c === null || sigma === null || !(sigma > 0)) return []
  const own2 = c.noise ** 2 + c.quantization ** 2
  const share = own2 / sigma ** 2
  if (share <= 0.5) return []
  const used = result.rangeUsed ?? 1
  const room = used < 0.8
  return [{
    severity: room ? 'caution' : 'info',
    text:
      `The converter's own noise (${formatQuantity(c.noise, 'V')} rms with quantisation ${formatQuantity(c.quantization, 'V')}) is ` +
      `${(share * 100).toFixed(0)} % of the noise power at its input (${formatQuantity(sigma, 'V')} rms in all); the analog chain adds ` +
      `only ${formatQuantity(result.noise.outputRms, 'V')}. ` +
      (room
        ? `The chain uses ${(used * 100).toFixed(0)} % of the converter's range: more analog gain would lift the signal above the converter's floor and win resolution.`
        : `The chain already uses ${(used * 100).toFixed(0)} % of the converter's range, so more gain has little room; a quieter converter or a slower output data rate would help.`)
  }]
}

const rule: ChainRule<'chain-converter-noise'> = {id: 'chain-converter-noise', check}
export default rule
