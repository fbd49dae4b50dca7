/**
 * The chain's DC budget (DESIGN §8.6): every stage's contributors carried to the chain's
 * output through the gains of the later stages, each keeping its key with `source` = the
 * stage id, then the converter's own terms. Worst case = Σ|e|, RSS = root of the sum of
 * squares over all terms (each stage's and the converter's terms independent), input-referred
 * = total ÷ |ΠGk|, in LSB = total ÷ LSB.
 */
import {DATASHEET_TEMPERATURE} from '../constants.js'
import type {Calibration} from '../types.js'
import {lsbOf, type AdcParams, type ChainDc, type ChainDcContributor, type ChainDcTotals, type ChainStage} from './types.js'

/** The converter's DC terms, magnitudes at its input, V (DESIGN §8.6). */
export function converterTerms(adc: AdcParams, dT: number, vmax: number, calibration: Calibration): {key: string; output: number}[] {
  const lsb = lsbOf(adc)
  const offsetRemoved = calibration !== 'none'
  const gainRemoved = calibration === 'offset-and-gain'
  return [
    {key: 'offset', output: offsetRemoved ? 0 : adc.offset},
    {key: 'offset-drift', output: adc.offsetDrift * dT},
    {key: 'gain-error', output: gainRemoved ? 0 : adc.gainError * vmax},
    {key: 'gain-drift', output: adc.gainDrift * dT * vmax},
    {key: 'inl', output: adc.inl * lsb}
  ]
}

/** ΔT = max(Tmax − 25, 25 − Tmin, 0), K (as DESIGN §4.2). */
export const temperatureSpanOf = ([tmin, tmax]: readonly [number, number]): number =>
  Math.max(tmax - DATASHEET_TEMPERATURE, DATASHEET_TEMPERATURE - tmin, 0)

/** Π|Gj| for j > k, for every k. */
export function laterGains(stages: readonly ChainStage[]): number[] {
  const out = new Array<number>(stages.length).fill(1)
  for (let k = stages.length - 2; k >= 0; k--) out[k] = out[k + 1] * Math.abs(stages[k + 1].gain)
  return out
}

function totals(rows: readonly ChainDcContributor[], gain: number, lsb: number | null): ChainDcTotals {
  const worst = rows.reduce((s, c) => s + c.output, 0)
  return {worstCaseOutput: worst, rssOutput: Math.hypot(...rows.map((c) => c.output)), worstCaseInput: worst / Math.abs(gain), worstCaseLsb: lsb === null ? null : worst / lsb}
}

/**
 * The chain's DC budget.
 * @param vmax
 *   max|Vadc| over the chain's output span, V (the converter's gain terms scale with it).
 */
export function chainDc(stages: readonly ChainStage[], adc: AdcParams | null, dT: number, vmax: number, calibration: Calibration): ChainDc {
  const later = laterGains(stages)
  const gain = stages.reduce((g, s) => g * s.gain, 1)
  const lsb = adc === null ? null : lsbOf(adc)
  const carried = (pick: (s: ChainStage) => readonly {key: string; output: number}[], cal: Calibration): ChainDcContributor[] => [
    ...stages.flatMap((s, k) => pick(s).map((c) => ({source: s.id, key: c.key, output: c.output * later[k]}))),
    ...(adc === null ? [] : converterTerms(adc, dT, vmax, cal).map((c) => ({source: adc.name, ...c})))
  ]
  const contributors = carried((s) => s.contributors, 'none')
  let calibrated: ChainDc['calibrated'] = null
  if (calibration !== 'none') {
    const rows = carried((s) => s.calibrated ?? s.contributors, calibration)
    calibrated = {calibration, contributors: rows, ...totals(rows, gain, lsb)}
  }
  return {contributors, ...totals(contributors, gain, lsb), calibrated}
}
