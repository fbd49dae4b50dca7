/**
 * The DC error budget, worst case and output-referred (DESIGN §4.2), and its residual after
 * a room-temperature calibration (DESIGN §4.6).
 *
 * Every term is read off the DC solve of `solve.ts` — the topology's own netlist with an
 * ideal (or, for `aol-gain`, finite-gain) op-amp — so the reference term NG·vref moves with
 * the resistors exactly as the signal term does, and a new topology needs no formula here.
 * Linear superposition gives each term on its own: `vos` is the output for vos alone, `ib`
 * for the bias current drawn out of both pins, `ios` for ±IOS/2, `idark` for the dark
 * current at the drive; `cmrr` and `psrr` are input-referred offsets (ΔVcm/CMRR, ΔVs/PSRR)
 * solved like vos. The total is the sum of magnitudes and the RSS the root of the sum of
 * squares (common practice for independent worst-case terms).
 */
import {DATASHEET_TEMPERATURE} from '../constants.js'
import {nominalResistors, topologyModel, type ResistorValues} from '../topology/index.js'
import type {BiasUsed, CalibratedBudget, DcBudget, DcKey, Resistor, StageInput} from '../types.js'
import {biasOverTemperature} from './bias.js'
import {maxOverCorners, type Spreads} from './corners.js'
import {solveStageDc, type DcExcitation} from './solve.js'

/** The budget together with the bias currents it used. */
export interface DcAnalysis {
  budget: DcBudget
  bias: BiasUsed
}

const RESISTOR_INPUTS = ['rf', 'rg', 'rs', 'rcomp', 'rp', 'rref', 'r1', 'r2', 'r3', 'riso'] as const

function spreadsOf(input: StageInput, pick: (r: Resistor) => number): Spreads {
  const s: Spreads = {}
  for (const k of RESISTOR_INPUTS) {
    const r = input[k]
    if (r) s[k] = pick(r)
  }
  return s
}

/** The two ends of a range (one when they coincide). */
const endsOf = (r: readonly [number, number]): number[] => (r[0] === r[1] ? [r[0]] : [...r])

/**
 * The signal points of the corner search: both ends of `input`, and for a differential
 * stage every pairing with both ends of `input-cm` (DESIGN §8.1), so that mismatch lets the
 * common mode through into the resistor terms.
 */
export function signalPoints(input: StageInput): DcExcitation[] {
  if (input.topology !== 'difference') return endsOf(input.input).map((v) => ({input: v}))
  return endsOf(input.input).flatMap((v) => endsOf(input.inputCm).map((cm) => ({input: v, inputCm: cm})))
}

/** The calibration table of DESIGN §4.6: which terms a calibration removes outright. */
const REMOVED: Record<'offset' | 'offset-and-gain', readonly DcKey[]> = {
  offset: ['vos'],
  'offset-and-gain': ['vos', 'resistor-tolerance', 'aol-gain', 'cmrr']
}

/** The DC budget of a stage (DESIGN §4.2, §4.6). */
export function dcAnalysis(input: StageInput): DcAnalysis {
  const model = topologyModel(input)
  const op = input.opamp
  const nominal = nominalResistors(input)
  const [tmin, tmax] = input.temperature
  const dT = Math.max(tmax - DATASHEET_TEMPERATURE, DATASHEET_TEMPERATURE - tmin, 0)
  const bias = biasOverTemperature(op, input.temperature, input)
  const out = (ex: DcExcitation, r: ResistorValues = nominal): number => Math.abs(solveStageDc(input, r, {references: false, ...ex}).vout)
  const points = signalPoints(input)
  const ideal = (p: DcExcitation, r: ResistorValues): number => solveStageDc(input, r, p).vout
  const nominalOut = points.map((p) => ideal(p, nominal))
  const vfs = Math.max(...nominalOut.map(Math.abs))
  // max over both input ends (and common-mode ends) of |Vout,ideal(input, corner) − Vout,ideal(input, nominal)|
  const resistorTerm = (spreads: Spreads): number =>
    maxOverCorners(nominal, spreads, (r) => Math.max(...points.map((p, i) => Math.abs(ideal(p, r) - (nominalOut[i] as number)))))
  // IB drawn out of both pins, worst resistor corner (tolerance and tempco together, DESIGN §4.2).
  const ibTerm = (amps: number): number =>
    amps === 0 ? 0 : maxOverCorners(nominal, spreadsOf(input, (r) => r.tolerance + r.tempco * dT), (r) => out({ibPlus: amps, ibMinus: amps}, r))
  const iosTerm = (amps: number): number => out({ibPlus: amps / 2, ibMinus: -amps / 2})
  const vcmRef = op.vcmRef ?? (input.supply[0] + input.supply[1]) / 2
  // The + pin's DC voltage over the input range (the common mode, DESIGN §4.2).
  const vcm = points.map((p) => solveStageDc(input, nominal, p).vplus)
  const cmrrTerm = (): number => out({vos: Math.max(...vcm.map((v) => Math.abs(v - vcmRef))) / op.cmrr})
  const aolTerm = (): number =>
    Math.max(...points.map((p, i) => Math.abs(solveStageDc(input, nominal, {...p, aol: op.aol}).vout - (nominalOut[i] as number))))
  const terms: Record<DcKey, () => number> = {
    vos: () => out({vos: op.vos}),
    'vos-drift': () => out({vos: op.vosDrift * dT}),
    ib: () => ibTerm(bias.ibMax),
    ios: () => iosTerm(bias.iosMax),
    idark: () => out({input: bias.idarkMax}),
    cmrr: cmrrTerm,
    psrr: () => out({vos: ((input.supply[1] - input.supply[0]) * input.supplyTolerance) / op.psrr}),
    'aol-gain': aolTerm,
    // Terms of the instrumentation block (DESIGN §8.2); no op-amp topology lists them.
    'gain-error': () => 0,
    nonlinearity: () => 0,
    'resistor-tolerance': () => resistorTerm(spreadsOf(input, (r) => r.tolerance)),
    'resistor-tempco': () => resistorTerm(spreadsOf(input, (r) => r.tempco * dT))
  }
  const contributors = model.dcKeys.map((key) => ({key, output: terms[key]()}))
  const g = Math.abs(solveStageDc(input, nominal, {input: 1, references: false}).vout)
  const totals = totalsOf(contributors, g)

  let calibrated: CalibratedBudget | null = null
  if (input.calibration !== 'none') {
    const removed = REMOVED[input.calibration]
    // What remains of a current term is its increase over the 25 °C value (DESIGN §4.6).
    const residual: Partial<Record<DcKey, () => number>> = {
      ib: () => ibTerm(Math.max(0, bias.ibMax - op.ib)),
      ios: () => iosTerm(Math.max(0, bias.iosMax - op.ios)),
      idark: () => out({input: Math.max(0, bias.idarkMax - input.idark)})
    }
    const rows = contributors.map(({key, output}) => ({
      key,
      output: removed.includes(key) ? 0 : (residual[key]?.() ?? output)
    }))
    calibrated = {calibration: input.calibration, contributors: rows, ...totalsOf(rows, g)}
  }
  return {
    budget: {temperatureSpan: dT, fullScaleOutput: vfs, contributors, ...totals, calibrated, networkCmrr: networkCmrrOf(input, nominal, g)},
    bias
  }
}

/**
 * The difference network's own CMRR (DESIGN §8.1): G the nominal differential gain, Acm the
 * ideal op-amp's output per volt of common mode (both legs moved together, reference
 * zeroed), maximised over the tolerance corners (tempco not included), in dB.
 */
function networkCmrrOf(input: StageInput, nominal: ResistorValues, gain: number): number | null {
  if (input.topology !== 'difference') return null
  const spreads = spreadsOf(input, (r) => r.tolerance)
  if (Object.values(spreads).every((s) => !(s > 0))) return null
  const acm = maxOverCorners(nominal, spreads, (r) => Math.abs(solveStageDc(input, r, {input: 0, inputCm: 1, references: false}).vout))
  return acm > 0 ? 20 * Math.log10(gain / acm) : null
}

function totalsOf(rows: {output: number}[], gain: number): Pick<DcBudget, 'worstCaseOutput' | 'rssOutput' | 'worstCaseInput' | 'rssInput'> {
  const worst = rows.reduce((s, c) => s + c.output, 0)
  // hypot: no overflow of the squares for very large contributions.
  const rss = Math.hypot(...rows.map((c) => c.output))
  return {worstCaseOutput: worst, rssOutput: rss, worstCaseInput: worst / gain, rssInput: rss / gain}
}

/** The DC budget alone (DESIGN §4.2). */
export const dcBudget = (input: StageInput): DcBudget => dcAnalysis(input).budget
