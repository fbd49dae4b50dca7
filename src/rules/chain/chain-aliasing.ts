/**
 * chain-aliasing: the chain passes noise and signal above half the sample rate.
 *
 * What it checks: the chain's −3 dB bandwidth against fs/2, and fs against 2·fH.
 *
 * When it fires: fs ≤ 2·fH → warning (the band itself aliases; no alias rejection exists);
 * bandwidth above fs/2 with no filter stage → warning; with a filter stage → caution. The
 * wideband noise then folds into the band: the text quotes the noise integrated to 10× the
 * chain's bandwidth.
 *
 * What it recommends: an anti-alias low-pass stage before the converter, or a sample rate
 * well above twice the chain's bandwidth (a delta-sigma converter's modulator rate usually is).
 */
import {formatQuantity} from '../../units/format.js'
import type {RuleFinding} from '../rule.js'
import {isFilterTopology, type ChainRule, type ChainRuleContext} from './rule.js'

function check({input, result, stages}: ChainRuleContext): RuleFinding[] {
  const fs = result.converter?.sampleRate ?? null
  if (fs === null) return []
  const fH = input.band[1]
  if (fs <= 2 * fH) {
    return [{
      severity: 'warning',
      text: `The sample rate ${formatQuantity(fs, 'Hz')} is not above twice the band's top (${formatQuantity(fH, 'Hz')}): the band itself aliases, ` +
        'and alias rejection is not defined. Raise the sample rate or narrow the band.'
    }]
  }
  const bw = result.bandwidth
  if (bw === null || bw <= fs / 2) return []
  const filtered = stages.some((s) => isFilterTopology(s.input.topology))
  const wide = result.noise.widebandRms
  const alias = result.aliasRejection
  return [{
    severity: filtered ? 'caution' : 'warning',
    text:
      `The chain's bandwidth, ${formatQuantity(bw, 'Hz')}, is above half the sample rate (${formatQuantity(fs / 2, 'Hz')})` +
      (filtered ? '' : ' and the chain has no filter stage') +
      `: wideband noise folds into the band (${wide === null ? "more" : formatQuantity(wide, 'V')} rms integrated to 10× the bandwidth, against ` +
      `${formatQuantity(result.noise.outputRms, 'V')} in the band)` +
      (alias === null ? '' : `, and the alias rejection at fs − fH is only ${alias.toFixed(1)} dB`) +
      '. Consider an anti-alias low-pass stage before the converter, with its corner well under fs/2.'
  }]
}

const rule: ChainRule<'chain-aliasing'> = {id: 'chain-aliasing', check}
export default rule
