/**
 * The signed DC error model of one stage for the Monte Carlo (DESIGN §8.7): the random
 * variables, and each trial's signed error sum at one input end and one temperature.
 *
 * Every term is the signed form of its worst-case term of §4.2 (and of its residual of §4.6
 * with a calibration), computed with the same coefficients, so that each term's magnitude in
 * a trial is at most the budget's worst case for it and the worst-case sum bounds every
 * trial:
 *
 * - `vos`, `vos-drift`, `ios`, `idark`, `cmrr`, `psrr`: the drawn source times its nominal
 *   transfer to the output (from the nodal solve at nominal resistors, as the budget takes
 *   them); vos-drift × (T − 25), cmrr × (Vcm − Vcm,ref) at that input end, psrr × the drawn
 *   supply deviation.
 * - `ib`: the drawn IB on both pins times the closed-form transfer at the trial's resistors at
 *   T, R·(1 + t + c·(T − 25)) — the product of the bias current and the resistor mismatch is
 *   kept, and stays inside the budget's corner box of ±(tolerance + tempco·ΔT).
 * - `aol-gain`: Aol at its minimum, the budget's signed value at nominal resistors.
 * - `resistor-tolerance`: Vout,ideal(x, R·(1 + t)) − Vout,ideal(x, R), closed form.
 * - `resistor-tempco`: Vout,ideal(x, R·(1 + c·(T − 25))) − Vout,ideal(x, R), closed form. The
 *   two resistor terms are taken apart as the budget takes them; the cross product t·c·(T − 25)
 *   (a few parts per million of the resistor terms) is left out with them.
 *
 * Calibration (§4.6): `vos` is removed; what remains of `ib`, `ios`, `idark` is the same draw
 * scaled to the increase over 25 °C (IB,max − ib)/IB,max etc.; `offset-and-gain` also removes
 * `resistor-tolerance`, `aol-gain` and `cmrr`.
 */
import {DATASHEET_TEMPERATURE} from '../constants.js'
import {biasOverTemperature} from '../dc/bias.js'
import {signalPoints} from '../dc/budget.js'
import {solveStageDc} from '../dc/solve.js'
import {nominalResistors, RESISTOR_KEYS, type ResistorKey} from '../topology/index.js'
import type {Resistor, StageInput, YieldDistribution} from '../types.js'
import {closedFormOf, R_INDEX, signalFormOf, type ClosedForm, type SignalForm} from './closed-form.js'

/**
 * How a variable is drawn from its uniform u: `Symmetric` uniform within ± scale, `Normal` a
 * truncated normal of σ = scale/3 at ± scale, `Positive` uniform in [0, scale].
 */
export const DrawKind = {Symmetric: 0, Normal: 1, Positive: 2} as const
export type DrawKind = (typeof DrawKind)[keyof typeof DrawKind]

/** Fixed slots of the variable vector (the RNG's variable index is the slot, so adding a resistor changes no other draw). */
export const SLOT = {vos: 0, vosDrift: 1, ib: 2, ios: 3, idark: 4, cmrr: 5, psrr: 6, supply: 7} as const
const TOL0 = 8
const TC0 = TOL0 + RESISTOR_KEYS.length
export const SLOT_COUNT = TC0 + RESISTOR_KEYS.length

/** One random variable of the model. */
export interface YieldVariable {
  /** Name in the results: a DC key, `supply`, or `<resistor>:tolerance` / `<resistor>:tempco`. */
  name: string
  slot: number
  kind: DrawKind
  scale: number
}

/** One input end (and common mode) of the stage. */
export interface YieldPoint {
  x: number
  cm: number
  /** Vout,ideal at nominal resistors, V. */
  nominal: number
  /** Vcm − Vcm,ref at nominal resistors, V. */
  cmDeviation: number
  /** The finite-Aol error at nominal resistors (signed), V. */
  aol: number
}

/** The compiled model (see module header). */
export interface YieldModel {
  form: ClosedForm
  /** The same closed form at every input end of one resistor set, less the ends' nominals (the trial loop's resistor terms). */
  signal: SignalForm
  variables: YieldVariable[]
  points: YieldPoint[]
  /** Tmin, 25 °C, Tmax (duplicates dropped), °C. */
  temperatures: number[]
  nominal: Float64Array
  /** Indices (R_INDEX) of the resistors that move. */
  moving: Int32Array
  /**
   * The variables as typed arrays for the trial loop, grouped by kind: slots and scales of the
   * symmetric uniforms [0, kindEnds[0]), the truncated normals [kindEnds[0], kindEnds[1]) and
   * the positive uniforms [kindEnds[1], end).
   */
  varSlot: Int32Array
  varScale: Float64Array
  kindEnds: [number, number]
  vref: number
  /** Nominal transfers: vos → out, (ib+ − ib−) → out, source current → out. */
  kVos: number
  kIos: number
  kIdark: number
  supplySpan: number
  /** Calibration: scale of ib, ios, idark draws in the residual; gain terms removed. */
  calibrated: boolean
  gainCalibrated: boolean
  ibResidual: number
  iosResidual: number
  idarkResidual: number
}

const resistorOf = (input: StageInput, k: ResistorKey): Resistor | null => (k === 'rshunt' ? null : input[k])

/** The model of a stage, or null when its topology has no closed form (DESIGN §8.7). */
export function yieldModel(input: StageInput, distribution: YieldDistribution): YieldModel | null {
  const form = closedFormOf(input)
  const signal = signalFormOf(input)
  if (form === null || signal === null) return null
  const op = input.opamp
  const bias = biasOverTemperature(op, input.temperature, input)
  const nomR = nominalResistors(input)
  const nominal = new Float64Array(RESISTOR_KEYS.map((k) => nomR[k]))
  const variables: YieldVariable[] = []
  const add = (name: string, slot: number, kind: DrawKind, scale: number): void => {
    if (scale > 0 && Number.isFinite(scale)) variables.push({name, slot, kind, scale})
  }
  const isTransimpedance = input.topology === 'transimpedance'
  add('vos', SLOT.vos, DrawKind.Normal, op.vos)
  add('vos-drift', SLOT.vosDrift, DrawKind.Normal, op.vosDrift)
  // Bipolar inputs: both pins one polarity; others either sign, one draw per part (§8.7).
  add('ib', SLOT.ib, op.inputType === 'bipolar' ? DrawKind.Positive : DrawKind.Symmetric, bias.ibMax)
  add('ios', SLOT.ios, DrawKind.Normal, bias.iosMax)
  if (isTransimpedance) add('idark', SLOT.idark, DrawKind.Positive, bias.idarkMax)
  add('cmrr', SLOT.cmrr, DrawKind.Symmetric, 1 / op.cmrr)
  add('psrr', SLOT.psrr, DrawKind.Symmetric, 1 / op.psrr)
  add('supply', SLOT.supply, DrawKind.Symmetric, input.supplyTolerance)
  const rKind = distribution === 'normal' ? DrawKind.Normal : DrawKind.Symmetric
  const moving: number[] = []
  RESISTOR_KEYS.forEach((k, i) => {
    const r = resistorOf(input, k)
    const nom = nominal[i] as number
    if (r === null || !(nom > 0) || !Number.isFinite(nom)) return
    const before = variables.length
    add(`${k}:tolerance`, TOL0 + i, rKind, r.tolerance)
    add(`${k}:tempco`, TC0 + i, rKind, r.tempco)
    if (variables.length > before) moving.push(i)
  })
  const [tmin, tmax] = input.temperature
  const temperatures = [...new Set([tmin, DATASHEET_TEMPERATURE, tmax])].sort((a, b) => a - b)
  const vcmRef = op.vcmRef ?? (input.supply[0] + input.supply[1]) / 2
  const points = signalPoints(input).map((p): YieldPoint => {
    const ideal = solveStageDc(input, nomR, p)
    const x = p.input ?? 0
    const cm = p.inputCm ?? 0
    return {
      x,
      cm,
      // The closed form's own nominal, so that a trial whose resistors do not move has no resistor term at all.
      nominal: form(nominal, x, cm, input.vref, 0, 0, 0),
      cmDeviation: ideal.vplus - vcmRef,
      aol: solveStageDc(input, nomR, {...p, aol: op.aol}).vout - ideal.vout
    }
  })
  const out = (ex: Parameters<typeof solveStageDc>[2]): number => solveStageDc(input, nomR, {references: false, ...ex}).vout
  const residual = (max: number, at25: number): number => (max > 0 ? Math.max(0, max - at25) / max : 0)
  return {
    form,
    signal,
    variables,
    points,
    temperatures,
    nominal,
    moving: new Int32Array(moving),
    ...groupedByKind(variables),
    vref: input.vref,
    kVos: out({vos: 1}),
    kIos: out({ibPlus: 0.5, ibMinus: -0.5}),
    kIdark: isTransimpedance ? out({input: 1}) : 0,
    supplySpan: input.supply[1] - input.supply[0],
    calibrated: input.calibration !== 'none',
    gainCalibrated: input.calibration === 'offset-and-gain',
    ibResidual: residual(bias.ibMax, op.ib),
    iosResidual: residual(bias.iosMax, op.ios),
    idarkResidual: residual(bias.idarkMax, input.idark)
  }
}

function groupedByKind(variables: readonly YieldVariable[]): Pick<YieldModel, 'varSlot' | 'varScale' | 'kindEnds'> {
  const order = [DrawKind.Symmetric, DrawKind.Normal, DrawKind.Positive].flatMap((kind) => variables.filter((v) => v.kind === kind))
  const symmetric = variables.filter((v) => v.kind === DrawKind.Symmetric).length
  const normal = variables.filter((v) => v.kind === DrawKind.Normal).length
  return {varSlot: Int32Array.from(order, (v) => v.slot), varScale: Float64Array.from(order, (v) => v.scale), kindEnds: [symmetric, symmetric + normal]}
}

export const tolSlot = (resistorIndex: number): number => TOL0 + resistorIndex
export const tcSlot = (resistorIndex: number): number => TC0 + resistorIndex
export {R_INDEX}
