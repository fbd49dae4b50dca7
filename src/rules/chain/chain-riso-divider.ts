/**
 * chain-riso-divider: a stage drives the next one through its isolation resistor.
 *
 * What it checks: every stage of the chain that has `riso` (DESIGN §8.3) and is followed by
 * a stage with a finite input resistance Rin — an inverting stage's rg (+ its rs), a filter's
 * r1 (DESIGN §8.6). The chain cascades stages as ideal sources, so it does not see the
 * divider riso/(riso + Rin) that the next stage's input forms with riso. When the driving
 * stage declares its own `rload`, its figures already hold riso into rload; what they miss is
 * Rin in parallel with rload, the fraction 1 − [R∥/(riso + R∥)]/[rload/(riso + rload)],
 * R∥ = rload·Rin/(rload + Rin) (riso/(riso + Rin) again without rload).
 *
 * When it fires: always in that case (caution), with the divider error as a fraction and
 * carried to the chain's output full scale (V, and LSB with a converter). A multiple-feedback
 * filter's r1 and an inverting stage's rg load the source at DC, so the error is a gain
 * error; a Sallen–Key input draws no current at DC (its capacitors are open), so there the
 * divider acts on the response in and above the passband, where the input impedance falls
 * towards r1.
 *
 * What it recommends: count riso in the next stage's input resistor (reduce rg or r1 by riso
 * so that riso + Rin is the intended value); a gain calibration removes the 25 °C part, the
 * difference between riso's tempco and the input resistor's remains.
 */
import type {StageInput} from '../../engine/types.js'
import {formatQuantity} from '../../units/format.js'
import type {RuleFinding} from '../rule.js'
import type {ChainRule, ChainRuleContext} from './rule.js'

/** The next stage's input resistance that riso divides into, with its name; null when its input draws no current. */
export function inputResistanceOf(input: StageInput): {ohms: number; what: string; atDc: boolean} | null {
  switch (input.topology) {
    case 'inverting': {
      if (input.rg === null) return null
      const rs = input.rs?.value ?? 0
      return {ohms: input.rg.value + rs, what: rs > 0 ? 'rg + rs' : 'rg', atDc: true}
    }
    case 'lowpass-mfb':
      return input.r1 === null ? null : {ohms: input.r1.value, what: 'r1', atDc: true}
    case 'lowpass-sallen-key':
      return input.r1 === null ? null : {ohms: input.r1.value, what: 'r1', atDc: false}
    default:
      // Non-inverting and follower inputs are the op-amp's + pin; difference,
      // instrumentation and transimpedance stages can only be first (DESIGN §8.6).
      return null
  }
}

/** A driving stage's rload that its own figures divide by (finite, positive). */
const hasLoad = (rload: number | null): rload is number => rload !== null && rload > 0 && Number.isFinite(rload)

/**
 * The fraction of the signal lost to the next stage's Rin that the driving stage's figures do
 * not hold: riso/(riso + Rin) without an rload; with one, what Rin in parallel adds to the
 * division by riso into rload the stage already counts (module header).
 */
export function missingDivision(riso: number, rin: number, rload: number | null): number {
  if (!hasLoad(rload)) return riso / (riso + rin)
  const parallel = (rload * rin) / (rload + rin)
  return 1 - (parallel / (riso + parallel)) / (rload / (riso + rload))
}

function check({result, stages}: ChainRuleContext): RuleFinding[] {
  const out: RuleFinding[] = []
  const fullScale = Math.max(Math.abs(result.outputSpan[0]), Math.abs(result.outputSpan[1]))
  const lsb = result.converter?.lsb ?? null
  for (let k = 0; k + 1 < stages.length; k++) {
    const riso = stages[k]!.input.riso?.value ?? 0
    if (!(riso > 0)) continue
    const next = stages[k + 1]!.input
    const rin = inputResistanceOf(next)
    if (rin === null || !(rin.ohms > 0)) continue
    const rload = stages[k]!.input.rload
    const divider = missingDivision(riso, rin.ohms, rload)
    const atOutput = divider * fullScale
    const lead =
      `Stage ${stages[k]!.input.id} drives stage ${next.id} through riso = ${formatQuantity(riso, 'Ω')} into its ${rin.what} = ${formatQuantity(rin.ohms, 'Ω')}: ` +
      (!hasLoad(rload)
        ? `the chain takes each stage as an ideal source, so the divider riso/(riso + Rin) = ${(divider * 100).toPrecision(3)} % is not in the chain's figures. `
        : `stage ${stages[k]!.input.id}'s figures hold riso into its rload = ${formatQuantity(rload, 'Ω')}, not into rload in parallel with Rin, so a further ` +
          `${(divider * 100).toPrecision(3)} % of the signal is lost that the chain's figures do not show. `)
    const effect = rin.atDc
      ? `It is a gain error of ${formatQuantity(atOutput, 'V')} at the chain output's full scale (${formatQuantity(fullScale, 'V')})` +
        (lsb === null ? '' : `, ${(atOutput / lsb).toPrecision(3)} LSB`) + '. '
      : 'At DC the Sallen–Key input draws no current, so the DC gain keeps its value; in and above the passband its input impedance falls ' +
        `towards r1, and the response there is off by up to that much (${formatQuantity(atOutput, 'V')} at the chain output's full scale): ` +
        'riso adds to r1 and moves f0 and Q. '
    const advice = `Consider counting riso in stage ${next.id}'s ${rin.what === 'r1' ? 'r1' : 'rg'} (reduce it by ${formatQuantity(riso, 'Ω')})` +
      (rin.atDc ? '; a gain calibration removes the 25 °C part, not the difference between the two resistors’ tempcos.' : '.')
    out.push({severity: 'caution', text: lead + effect + advice})
  }
  return out
}

const rule: ChainRule<'chain-riso-divider'> = {id: 'chain-riso-divider', check}
export default rule
