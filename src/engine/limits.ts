/**
 * Physical limits as verdicts (DESIGN §4.6): `output-swing`, `input-common-mode`, `slew` and
 * `output-current`, each checked on every stage from the DC solve of `dc/solve.ts` (nominal
 * resistors, ideal op-amp, reference term included), with the rails taken at the low end of
 * `supply-tolerance`. A limit whose data is not entered is skipped (`met: null`) and names the
 * keys that would enable it; each rail uses its own `-neg`/`-pos` key or else the two-sided
 * one, and a rail with neither is not checked.
 */
import {nominalResistors} from './topology/index.js'
import {signalPoints} from './dc/budget.js'
import {solveStageDc, type DcSolution} from './dc/solve.js'
import type {Bounds, LimitResult, StageInput, SwingCheck} from './types.js'

/** The rails at the low end of the supply tolerance, [V−, V+], V. */
export const railsAtLowTolerance = (input: StageInput): [number, number] =>
  [input.supply[0] * (1 - input.supplyTolerance), input.supply[1] * (1 - input.supplyTolerance)]

/** DC solutions at the two ends of the input range (nominal resistors, ideal op-amp). */
export function operatingPoints(input: StageInput): DcSolution[] {
  const r = nominalResistors(input)
  return signalPoints(input).map((p) => solveStageDc(input, r, p))
}

const span = (values: number[]): [number, number] => [Math.min(...values), Math.max(...values)]

/** A two-rail window check; `neg`/`pos` are the headrooms (null: that rail is not checked). */
function window(key: 'output-swing' | 'input-common-mode', value: [number, number], rails: [number, number],
  neg: number | null, pos: number | null, keys: [string, string, string]): LimitResult {
  const [both, negKey, posKey] = keys
  const missing: string[] = []
  if (neg === null) missing.push(`${negKey} (or ${both})`)
  if (pos === null) missing.push(`${posKey} (or ${both})`)
  if (neg === null && pos === null) return {key, kind: 'limit', value, limit: null, met: null, missing: [both, negKey, posKey]}
  const limit: Bounds = [neg === null ? null : rails[0] + neg, pos === null ? null : rails[1] - pos]
  const met = (limit[0] === null || value[0] >= limit[0]) && (limit[1] === null || value[1] <= limit[1])
  return {key, kind: 'limit', value, limit, met, missing}
}

/** Every limit of DESIGN §4.6, in the order of `LIMIT_KEYS`. */
export const checkLimits = (input: StageInput): LimitResult[] => checkLimitsAt(input, operatingPoints(input))

/** The limits at given operating points (the instrumentation stage supplies its own, DESIGN §8.2). */
export function checkLimitsAt(input: StageInput, points: readonly DcSolution[]): LimitResult[] {
  const op = input.opamp
  const rails = railsAtLowTolerance(input)
  // The swing and slew limits are the op-amp's: at its output pin, before riso (DESIGN §8.3).
  const outSpan = span(points.map((p) => p.vpin))
  const swing = window('output-swing', outSpan, rails, op.swingHeadroomNeg ?? op.swingHeadroom, op.swingHeadroomPos ?? op.swingHeadroom,
    ['swing-headroom', 'swing-headroom-neg', 'swing-headroom-pos'])
  const pins = span(points.flatMap((p) => [p.vplus, p.vminus]))
  const cm = window('input-common-mode', pins, rails, op.cmHeadroomNeg ?? op.cmHeadroom, op.cmHeadroomPos ?? op.cmHeadroom,
    ['cm-headroom', 'cm-headroom-neg', 'cm-headroom-pos'])
  const amplitude = (outSpan[1] - outSpan[0]) / 2
  const signalFrequency = input.signalFrequency ?? input.band[1]
  const needed = 2 * Math.PI * signalFrequency * amplitude
  const slew: LimitResult = {
    key: 'slew', kind: 'limit', value: needed, limit: op.slew,
    met: op.slew === null ? null : needed <= op.slew,
    missing: op.slew === null ? ['slew'] : [],
    signalFrequency, amplitude,
    fullPowerBandwidth: op.slew === null || amplitude === 0 ? null : op.slew / (2 * Math.PI * amplitude)
  }
  const current = Math.max(...points.map((p) => Math.abs(p.iout)))
  const iout: LimitResult = {
    key: 'output-current', kind: 'limit', value: current, limit: op.ioutMax,
    met: op.ioutMax === null ? null : current <= op.ioutMax,
    missing: op.ioutMax === null ? ['iout-max'] : []
  }
  return [swing, cm, slew, iout]
}

/** The output span against the swing window, for the report and rules (DESIGN §4.1, §4.6). */
export function swingOf(input: StageInput, limits: readonly LimitResult[]): SwingCheck {
  const swing = limits.find((l) => l.key === 'output-swing')
  if (swing === undefined || swing.key !== 'output-swing') throw new RangeError('Unexpected missing output-swing limit, expected checkLimits output')
  const rails = railsAtLowTolerance(input)
  const outputSpan = swing.value
  const allowed: [number, number] = [swing.limit?.[0] ?? rails[0], swing.limit?.[1] ?? rails[1]]
  const excess: [number, number] = [Math.max(0, allowed[0] - outputSpan[0]), Math.max(0, outputSpan[1] - allowed[1])]
  return {outputSpan, allowed, excess, fits: excess[0] === 0 && excess[1] === 0}
}
