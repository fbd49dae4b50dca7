/**
 * bias-compensation-resistor: does the bias-current compensation resistor earn its place?
 *
 * What it checks: a stage with `rcomp` (or, on a follower, an `rf` put in to match the
 * source resistance) is evaluated three ways with the engine: as drawn; without the resistor
 * (rcomp removed with its capacitor; on a follower, rf and cf removed); and with the resistor
 * bypassed by a capacitor whose corner 1/(2π·R·C) is at most a tenth of the band's lower edge,
 * rounded up to a 1-2.2-4.7 decade value. The note carries the three rows as a table.
 *
 * When it fires: whenever such a resistor is present. The verdict compares, both at the
 * output, the cut in worst-case DC error against the rise in peak-to-peak noise over the band
 * (6.6 × rms, DESIGN §4.3); p-p is used because a DC error and a noise excursion both move a
 * reading by that much. It does not earn its place when IOS/IB > 0.5 (matching cancels only
 * the share of bias current the inputs have in common), when the input is JFET or CMOS (pA
 * bias currents), or when its added p-p noise is at least the DC error it removes.
 * Severity: caution when it does not earn its place, info when it does.
 *
 * What it recommends: remove it, or keep it and bypass it (the bypassed noise is quoted) —
 * but only with a film capacitor of at most 10 µF: a larger bypass is not suggested, and the
 * note advises removing the resistor or rethinking the impedances instead.
 */
import {evaluateStage, withoutMonteCarlo} from '../engine/index.js'
import type {Resistor, StageInput, StageResult} from '../engine/types.js'
import {roundUpToSeries} from './e-series.js'
import {formatFixed, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

/**
 * Largest bypass capacitor the rule suggests, F. Film capacitors are practical up to about
 * 10 µF (common practice); above that only an electrolytic remains, whose leakage current on
 * a precision node would upset the very match the resistor is there for. Beyond this value
 * the rule advises removing or rethinking the part instead of a capacitor.
 */
export const FILM_MAX = 10e-6

/** IOS/IB above which matching the input resistances buys little (DESIGN §4.2). */
const IOS_RATIO_LIMIT = 0.5

type Element = 'rcomp' | 'rf'

/** Which element is the compensation resistor, or null when the stage has none. */
function compensationElement(input: StageInput): {name: Element; resistor: Resistor} | null {
  if (input.rcomp !== null && input.rcomp.value > 0) return {name: 'rcomp', resistor: input.rcomp}
  if (input.topology === 'follower' && input.rf !== null && input.rf.value > 0) return {name: 'rf', resistor: input.rf}
  return null
}

/**
 * Smallest E3 (1-2.2-4.7) capacitance C with 1/(2π·R·C) ≤ fL/10, F.
 */
export function bypassCapacitor(resistance: number, bandLow: number): number {
  return roundUpToSeries(10 / (2 * Math.PI * resistance * bandLow), 'E3')
}

function withoutElement(input: StageInput, element: Element): StageInput {
  return element === 'rcomp' ? {...input, rcomp: null, ccomp: 0} : {...input, rf: null, cf: 0}
}

function bypassed(input: StageInput, element: Element, c: number): StageInput {
  return element === 'rcomp' ? {...input, ccomp: Math.max(input.ccomp, c)} : {...input, cf: Math.max(input.cf, c)}
}

function row(label: string, r: StageResult): string[] {
  return [label, formatQuantity(r.dc.worstCaseOutput, 'V'), formatQuantity(r.dc.rssOutput, 'V'), formatQuantity(r.noise.outputRms, 'V')]
}

function check({input, result}: RuleContext): RuleFinding[] {
  const found = compensationElement(input)
  if (found === null) return []
  const {name, resistor} = found
  const fL = input.band[0]
  const c = bypassCapacitor(resistor.value, fL)
  // Only the DC and noise figures of the variants are read: no Monte Carlo for them.
  const without = evaluateStage(withoutMonteCarlo(withoutElement(input, name)))
  const bypass = evaluateStage(withoutMonteCarlo(bypassed(input, name, c)))

  const dcSaving = without.dc.worstCaseOutput - result.dc.worstCaseOutput
  const noiseCost = result.noise.outputPeakToPeak - without.noise.outputPeakToPeak
  const ratio = result.bias.ibMax > 0 ? result.bias.iosMax / result.bias.ibMax : null

  const reasons: string[] = []
  if (input.opamp.inputType === 'jfet' || input.opamp.inputType === 'cmos') {
    const kind = input.opamp.inputType === 'jfet' ? 'JFET' : 'CMOS'
    reasons.push(`the input is ${kind}, whose bias current (${formatQuantity(result.bias.ibMax, 'A')} at worst here) makes IB·R negligible`)
  }
  if (ratio !== null && ratio > IOS_RATIO_LIMIT) {
    reasons.push(`IOS/IB is ${formatFixed(ratio, {decimals: 2})} (${formatQuantity(result.bias.iosMax, 'A')} against ${formatQuantity(result.bias.ibMax, 'A')}), above ${formatFixed(IOS_RATIO_LIMIT, {decimals: 2})}, so matching cancels little of the bias current`)
  }
  if (dcSaving <= 0) {
    reasons.push(`it removes no DC error (the worst case is ${formatQuantity(-dcSaving, 'V')} lower without it)`)
  } else if (noiseCost >= dcSaving) {
    reasons.push(`its added noise, ${formatQuantity(noiseCost, 'V')} p-p, is at least the ${formatQuantity(dcSaving, 'V')} of worst-case DC error it removes`)
  }

  const what = name === 'rcomp'
    ? `The bias-compensation resistor rcomp = ${formatQuantity(resistor.value, 'Ω')}`
    : `The feedback resistor rf = ${formatQuantity(resistor.value, 'Ω')} of this follower, there to match the source resistance,`
  const comparison =
    `Compared at the output: worst-case DC error ${formatQuantity(result.dc.worstCaseOutput, 'V')} as drawn against ` +
    `${formatQuantity(without.dc.worstCaseOutput, 'V')} without it, and noise ${formatQuantity(result.noise.outputPeakToPeak, 'V')} p-p ` +
    `against ${formatQuantity(without.noise.outputPeakToPeak, 'V')} p-p (p-p = 6.6 × rms over ` +
    `${formatQuantity(fL, 'Hz')} … ${formatQuantity(input.band[1], 'Hz')}).`
  const existing = name === 'rcomp' ? input.ccomp : input.cf
  const corner = (cap: number): string => formatQuantity(1 / (2 * Math.PI * resistor.value * cap), 'Hz')
  const practical = existing >= c || c <= FILM_MAX
  const bypassText = existing >= c
    ? `It is already bypassed by ${formatQuantity(existing, 'F')} (corner ${corner(existing)}, at most a tenth of the band's lower edge), ` +
      `which keeps its noise out of the band: ${formatQuantity(result.noise.outputRms, 'V')} rms.`
    : practical
      ? `Bypassing ${name} with ${formatQuantity(c, 'F')} of film (corner ${corner(c)}, at most a tenth of the band's lower edge) keeps its ` +
        `DC effect and brings the noise to ${formatQuantity(bypass.noise.outputRms, 'V')} rms ` +
        `(${formatQuantity(result.noise.outputRms, 'V')} rms as drawn).`
      : `A bypass capacitor is no answer here: a corner at a tenth of the band's lower edge takes ${formatQuantity(c, 'F')}, beyond the ` +
        `${formatQuantity(FILM_MAX, 'F')} a film capacitor reaches, and an electrolytic's leakage would upset the very match ${name} is there for. ` +
        `Remove ${name}, or rethink the impedances around the inputs (lower resistances, or an input type with lower bias current).`
  const rows = [row('As drawn', result), row(`Without ${name}`, without)]
  if (practical) rows.push(row(`${name} bypassed by ${formatQuantity(Math.max(existing, c), 'F')}`, bypass))
  const table = {header: ['Variant', 'DC worst case', 'DC RSS', 'Noise rms over band'], rows}

  if (reasons.length > 0) {
    return [{
      severity: 'caution',
      text:
        `${what} does not earn its place: ${reasons.join('; ')}. ${comparison} Consider removing it. ` +
        (existing >= c || !practical ? bypassText : `If it stays, ${bypassText.charAt(0).toLowerCase()}${bypassText.slice(1)}`),
      table
    }]
  }
  return [{
    severity: 'info',
    text: `${what} earns its place: it cuts the worst-case DC error by ${formatQuantity(dcSaving, 'V')} and ${noiseCost >= 0 ? 'adds' : 'even removes'} ${formatQuantity(Math.abs(noiseCost), 'V')} p-p of noise${ratio === null ? '' : ` (IOS/IB = ${formatFixed(ratio, {decimals: 2})})`}. ${comparison} ${bypassText}`,
    table
  }]
}

const rule: Rule<'bias-compensation-resistor'> = {id: 'bias-compensation-resistor', check}
export default rule
