/**
 * low-value-resistor: a feedback or gain resistor of a few ohms.
 *
 * What it checks: rf and rg under 10 Ω. At that size the copper and solder joints in series
 * (taken here as 10 mΩ, common practice for a short trace with two joints) are a gain error of
 * their own, and the feedback network loads the output.
 *
 * When it fires: rf or rg under 10 Ω. Severity caution.
 *
 * What it recommends: quotes the 10 mΩ share and the current the feedback network draws at the
 * full-scale output; consider scaling the network up, or a Kelvin (four-terminal) connection.
 */
import type {StageInput} from '../engine/types.js'
import {formatPercent, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const LOW = 10
const COPPER = 0.01

/** Current the feedback network draws from the output at full scale, A. */
function networkCurrent(input: StageInput, vfs: number): number {
  const rf = input.rf?.value ?? 0
  const rg = input.rg?.value ?? 0
  switch (input.topology) {
    case 'noninverting':
      return rf + rg > 0 ? vfs / (rf + rg) : 0
    case 'inverting':
    case 'transimpedance':
      return rf > 0 ? vfs / rf : 0
    case 'follower':
      return 0
    // The §8 networks do not sit across a virtual ground: the output-current limit (DC solve) covers them.
    case 'difference':
    case 'lowpass-sallen-key':
    case 'lowpass-mfb':
    case 'instrumentation':
      return 0
  }
}

function check({input, result}: RuleContext): RuleFinding[] {
  const low: string[] = []
  for (const name of ['rf', 'rg'] as const) {
    const r = input[name]
    if (r !== null && r.value > 0 && r.value < LOW) {
      low.push(`${name} = ${formatQuantity(r.value, 'Ω')} (10 mΩ of copper is ${formatPercent(COPPER / r.value)} of it)`)
    }
  }
  if (low.length === 0) return []
  const current = networkCurrent(input, result.dc.fullScaleOutput)
  return [{
    severity: 'caution',
    text:
      `Very low resistance in the feedback network: ${low.join('; ')}.` +
      (current > 0 ? ` At the full-scale output of ${formatQuantity(result.dc.fullScaleOutput, 'V')} the network draws ${formatQuantity(current, 'A')} from the output.` : '') +
      ' Consider scaling the network up, or a Kelvin connection at the low-value resistor, and check the output can drive the load.'
  }]
}

const rule: Rule<'low-value-resistor'> = {id: 'low-value-resistor', check}
export default rule
