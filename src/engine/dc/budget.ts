/**
 * The DC error budget, worst case and output-referred (DESIGN §4.2).
 *
 * Each key's formula is the one of the §4.2 table; the total is the sum of magnitudes and the
 * RSS the root of the sum of squares (common practice for independent worst-case terms).
 */
import {DATASHEET_TEMPERATURE} from '../constants.js'
import {nominalResistors, topologyModel, type ResistorValues} from '../topology/index.js'
import type {BiasUsed, DcBudget, DcKey, Resistor, StageInput} from '../types.js'
import {biasOverTemperature} from './bias.js'
import {maxOverCorners, type Spreads} from './corners.js'

/** The budget together with the bias currents it used. */
export interface DcAnalysis {
  budget: DcBudget
  bias: BiasUsed
}

const RESISTOR_INPUTS = ['rf', 'rg', 'rs', 'rcomp'] as const

function spreadsOf(input: StageInput, pick: (r: Resistor) => number): Spreads {
  const s: Spreads = {}
  for (const k of RESISTOR_INPUTS) {
    const r = input[k]
    if (r) s[k] = pick(r)
  }
  return s
}

/** The DC budget of a stage (DESIGN §4.2). */
export function dcAnalysis(input: StageInput): DcAnalysis {
  const model = topologyModel(input)
  const op = input.opamp
  const nominal = nominalResistors(input)
  const t = model.terms(nominal)
  const ng = t.noiseGain
  const [tmin, tmax] = input.temperature
  const dT = Math.max(tmax - DATASHEET_TEMPERATURE, DATASHEET_TEMPERATURE - tmin, 0)
  const bias = biasOverTemperature(op, input.temperature)
  const vfs = Math.max(Math.abs(t.gain * input.input[0]), Math.abs(t.gain * input.input[1]))
  const gainError = (r: ResistorValues): number => Math.abs(model.terms(r).gain / t.gain - 1)
  const vcmRef = op.vcmRef ?? (input.supply[0] + input.supply[1]) / 2
  const terms: Record<DcKey, () => number> = {
    vos: () => op.vos * ng,
    'vos-drift': () => op.vosDrift * dT * ng,
    // Tolerance and tempco together move the resistors for the ib term (DESIGN §4.2).
    ib: () => {
      const spread = spreadsOf(input, (r) => r.tolerance + r.tempco * dT)
      const mismatch = maxOverCorners(nominal, spread, (r) => {
        const c = model.terms(r)
        return Math.abs(c.rn - c.rp)
      })
      return bias.ibMax * mismatch * ng
    },
    ios: () => (bias.iosMax / 2) * (t.rn + t.rp) * ng,
    idark: () => input.idark * nominal.rf,
    cmrr: () => (ng * Math.max(...model.commonMode(input).map((v) => Math.abs(v - vcmRef)))) / op.cmrr,
    psrr: () => (ng * (input.supply[1] - input.supply[0]) * input.supplyTolerance) / op.psrr,
    'aol-gain': () => (vfs * ng) / (op.aol + ng),
    'resistor-tolerance': () => vfs * maxOverCorners(nominal, spreadsOf(input, (r) => r.tolerance), gainError),
    'resistor-tempco': () => vfs * maxOverCorners(nominal, spreadsOf(input, (r) => r.tempco * dT), gainError)
  }
  const contributors = model.dcKeys.map((key) => ({key, output: terms[key]()}))
  const worst = contributors.reduce((s, c) => s + c.output, 0)
  // hypot: no overflow of the squares for very large contributions.
  const rss = Math.hypot(...contributors.map((c) => c.output))
  const g = Math.abs(t.gain)
  return {
    budget: {
      temperatureSpan: dT,
      fullScaleOutput: vfs,
      contributors,
      worstCaseOutput: worst,
      rssOutput: rss,
      worstCaseInput: worst / g,
      rssInput: rss / g
    },
    bias
  }
}

/** The DC budget alone (DESIGN §4.2). */
export const dcBudget = (input: StageInput): DcBudget => dcAnalysis(input).budget
