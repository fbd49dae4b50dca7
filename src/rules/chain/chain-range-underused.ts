/**
 * chain-range-underused: the chain's output covers under half of the converter's range.
 *
 * What it checks: the fraction of the converter's input span that the chain's output span
 * covers (`rangeUsed`).
 *
 * When it fires: under 50 % (caution): every bit of range left unused is a bit of
 * resolution lost (common practice).
 *
 * What it recommends: more gain, or a converter range (reference) that matches the signal;
 * an offset to centre a unipolar signal in a bipolar range.
 */
import {formatRange} from '../../units/format.js'
import type {RuleFinding} from '../rule.js'
import type {ChainRule, ChainRuleContext} from './rule.js'

function check({result}: ChainRuleContext): RuleFinding[] {
  const used = result.rangeUsed
  const c = result.converter
  if (used === null || c === null || used >= 0.5) return []
  const lost = Math.log2(1 / Math.max(used, 1e-12))
  return [{
    severity: 'caution',
    text:
      `The chain's output spans ${formatRange(result.outputSpan[0], result.outputSpan[1], 'V')}, ${(used * 100).toFixed(0)} % of the converter's ` +
      `${formatRange(c.input[0], c.input[1], 'V')}: about ${lost.toFixed(1)} bits of the converter's resolution go unused. Consider more gain, ` +
      'a converter range that matches the signal, or an offset that centres the signal in the range.'
  }]
}

const rule: ChainRule<'chain-range-underused'> = {id: 'chain-range-underused', check}
export default rule
