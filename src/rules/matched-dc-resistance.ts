/**
 * matched-dc-resistance: would matching the DC resistances at the two inputs pay?
 *
 * What it checks: the `ib` term is the largest DC contributor and the + and − inputs see
 * different DC resistances (Rp ≠ Rn, DESIGN §4.1, by more than 1 %). The rule builds the
 * matched variant and evaluates it with the engine: rcomp = Rn − Rs (noninverting, follower
 * with Rn > Rp), rcomp = Rn (inverting, transimpedance), or on a follower whose + side is
 * larger an rf = Rs + Rcomp. The new resistor takes the tolerance and tempco of the part it
 * replaces, else of rf (zero when there is none).
 *
 * When it fires: the variant at least halves the `ib` term and cuts the worst-case DC error
 * by at least 20 %, and the noise budget allows it: every noise requirement (`noise-rms`,
 * `noise-pp`) is still met with the added resistor's noise, or there is none.
 * Severity: caution when the output-error requirement fails as drawn and the variant meets
 * it; info otherwise.
 *
 * What it recommends: the matching resistor, with the saving and the noise it costs.
 */
import {evaluateStage, withoutMonteCarlo} from '../engine/index.js'
import type {Resistor, StageInput, StageResult} from '../engine/types.js'
import {formatPercent, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'
import {dcResistances, dcTerm, largestDcTerm} from './stage-terms.js'

const MISMATCH = 0.01
const IB_CUT = 0.5
const TOTAL_CUT = 0.2

interface Variant {
  input: StageInput
  /** What changed, for the text. */
  change: string
}

function grade(like: Resistor | null, value: number): Resistor {
  return {value, tolerance: like?.tolerance ?? 0, tempco: like?.tempco ?? 0}
}

/** The stage with Rp = Rn, or null when no single added or changed resistor gets there. */
function matchedVariant(input: StageInput, rn: number, rp: number): Variant | null {
  const rs = input.rs?.value ?? 0
  const like = input.rcomp ?? input.rf
  const setRcomp = (value: number): Variant =>
    value > 0
      ? {input: {...input, rcomp: grade(like, value)}, change: `rcomp = ${formatQuantity(value, 'Ω')}`}
      : {input: {...input, rcomp: null, ccomp: 0}, change: 'rcomp removed'}
  switch (input.topology) {
    case 'inverting':
    case 'transimpedance':
      return setRcomp(rn)
    case 'noninverting':
      return rn >= rs ? setRcomp(rn - rs) : null
    case 'follower':
      if (rn >= rs) return setRcomp(rn - rs)
      return {input: {...input, rf: grade(input.rf, rp)}, change: `rf = ${formatQuantity(rp, 'Ω')}`}
    case 'lowpass-mfb':
      return setRcomp(rn)
    // Matching is set by the network itself (difference) or by the filter's values (Sallen-Key).
    case 'difference':
    case 'lowpass-sallen-key':
    case 'instrumentation':
      return null
  }
}

function noiseAllowed(input: StageInput, variant: StageResult): boolean {
  const rms = input.require['noise-rms']
  const pp = input.require['noise-pp']
  return (rms === undefined || variant.noise.outputRms <= rms) && (pp === undefined || variant.noise.outputPeakToPeak <= pp)
}

function check({input, result}: RuleContext): RuleFinding[] {
  const largest = largestDcTerm(result)
  if (largest === null || largest.key !== 'ib') return []
  const {rn, rp} = dcResistances(input)
  if (Math.abs(rn - rp) <= MISMATCH * Math.max(rn, rp)) return []
  const variant = matchedVariant(input, rn, rp)
  if (variant === null) return []
  // Only the DC and noise figures of the variant are read: no Monte Carlo for it.
  const matched = evaluateStage(withoutMonteCarlo(variant.input))
  const ibBefore = largest.output
  const ibAfter = dcTerm(matched, 'ib')
  const saving = result.dc.worstCaseOutput - matched.dc.worstCaseOutput
  if (ibAfter > IB_CUT * ibBefore || saving < TOTAL_CUT * result.dc.worstCaseOutput) return []
  if (!noiseAllowed(input, matched)) return []

  const limit = input.require['output-error']
  const rescues = limit !== undefined && result.dc.worstCaseOutput > limit && matched.dc.worstCaseOutput <= limit
  const noiseAdded = matched.noise.outputRms - result.noise.outputRms
  const budget = input.require['noise-rms'] === undefined && input.require['noise-pp'] === undefined
    ? 'there is no noise requirement'
    : 'the noise requirement is still met'
  return [{
    severity: rescues ? 'caution' : 'info',
    text:
      `The bias-current term is the largest DC error (${formatQuantity(ibBefore, 'V')} at the output) and the inputs see ` +
      `Rn = ${formatQuantity(rn, 'Ω')} and Rp = ${formatQuantity(rp, 'Ω')}. With ${variant.change} (Rp = Rn) the term falls to ` +
      `${formatQuantity(ibAfter, 'V')} and the worst case from ${formatQuantity(result.dc.worstCaseOutput, 'V')} to ` +
      `${formatQuantity(matched.dc.worstCaseOutput, 'V')}, a saving of ${formatQuantity(saving, 'V')} ` +
      `(${formatPercent(saving / result.dc.worstCaseOutput)}), while the noise ${noiseAdded >= 0 ? 'rises' : 'changes'} by ` +
      `${formatQuantity(Math.abs(noiseAdded), 'V')} rms to ${formatQuantity(matched.noise.outputRms, 'V')} rms and ${budget}.` +
      (rescues && limit !== undefined ? ` It would bring the output error within its ${formatQuantity(limit, 'V')} limit.` : '') +
      ' Consider adding it, of the same grade as the feedback parts, and bypassing it with a capacitor to keep its noise out of the band.'
  }]
}

const rule: Rule<'matched-dc-resistance'> = {id: 'matched-dc-resistance', check}
export default rule
