/**
 * The signed DC error of an instrumentation stage for the chain's Monte Carlo (DESIGN §8.2,
 * §8.7): the block model of `../instrumentation.ts`, term by term with signs, each term's
 * magnitude at most its worst-case term there, so the worst-case sum bounds every trial. At
 * input end vd, common mode vcm and temperature T (dt = T − 25):
 *
 *   vos        = vos-in·G + vos-out                       (truncated normals, σ = max/3)
 *   vos-drift  = (vos-in-drift·G + vos-out-drift)·dt      (truncated normals)
 *   ib         = IB·(Rs+ − Rs−)·G, Rs± = rs·(1 + t± + c±·dt)  (IB uniform as for an op-amp; each
 *                leg's tolerance and tempco its own draw: |ΔRs| ≤ 2·rs·(tol + tc·ΔT), the budget's)
 *   ios        = IOS·rs·G                                 (truncated normal)
 *   cmrr       = G·(vcm − Vcm,ref)·c, c uniform within ±1/CMRR
 *   psrr       = G·(supply span)·s·p, s within ±supply-tolerance, p within ±1/PSRR
 *   gain-error = e·G·vd                                   (truncated normal of gain-error)
 *   resistor-tolerance = G·vd·(G(rg·(1 + t))/G − 1)
 *   resistor-tempco    = G·vd·(G(rg·(1 + c·dt))/G − 1) + d·dt·G·vd   (d: gain-drift, truncated normal)
 *   nonlinearity       = n·|G|·(vd,max − vd,min)          (truncated normal of nonlinearity)
 *
 * Calibration as the block model's: `vos` removed; `ib`, `ios` scaled to the rise over
 * 25 °C; `offset-and-gain` also removes gain-error, resistor-tolerance and cmrr.
 */
import {DATASHEET_TEMPERATURE} from '../constants.js'
import {biasOverTemperature} from '../dc/bias.js'
import {inaAsOpamp, inaGain} from '../ina-archetypes.js'
import type {StageInput, YieldDistribution} from '../types.js'
import {DrawKind, type YieldVariable} from './model.js'

/** Slots of the instrumentation model's variables. */
export const INA_SLOT = {
  vosIn: 0, vosOut: 1, vosInDrift: 2, vosOutDrift: 3, ib: 4, ios: 5, cmrr: 6, psrr: 7, supply: 8, gainError: 9, gainDrift: 10, nonlinearity: 11,
  rgTol: 12, rgTc: 13, rsPlusTol: 14, rsMinusTol: 15, rsPlusTc: 16, rsMinusTc: 17
} as const
export const INA_SLOT_COUNT = 18

export interface InaYieldModel {
  variables: YieldVariable[]
  /** Input ends × common-mode ends: vd, vcm and the nominal output G·vd + vref. */
  points: {x: number; cm: number; nominal: number}[]
  g: number
  gainConstant: number
  rg: number
  rs: number
  vcmRef: number
  supplySpan: number
  /** |G|·(vd,max − vd,min), V. */
  nlSpan: number
  calibrated: boolean
  gainCalibrated: boolean
  ibResidual: number
  iosResidual: number
}

const endsOf = (r: readonly [number, number]): number[] => (r[0] === r[1] ? [r[0]] : [...r])

/** The model of an instrumentation stage (null when it lacks its block or rg). */
export function inaYieldModel(input: StageInput, distribution: YieldDistribution): InaYieldModel | null {
  const ina = input.ina
  const rgR = input.rg
  if (ina === null || rgR === null) return null
  const g = inaGain(ina, rgR.value)
  const bias = biasOverTemperature(inaAsOpamp(ina), input.temperature, input)
  const variables: YieldVariable[] = []
  const add = (name: string, slot: number, kind: DrawKind, scale: number): void => {
    if (scale > 0 && Number.isFinite(scale)) variables.push({name, slot, kind, scale})
  }
  const S = INA_SLOT
  add('vos-in', S.vosIn, DrawKind.Normal, ina.vosIn)
  add('vos-out', S.vosOut, DrawKind.Normal, ina.vosOut)
  add('vos-in-drift', S.vosInDrift, DrawKind.Normal, ina.vosInDrift)
  add('vos-out-drift', S.vosOutDrift, DrawKind.Normal, ina.vosOutDrift)
  const rs = input.rs?.value ?? 0
  if (rs > 0) {
    add('ib', S.ib, ina.inputType === 'bipolar' ? DrawKind.Positive : DrawKind.Symmetric, bias.ibMax)
    add('ios', S.ios, DrawKind.Normal, bias.iosMax)
  }
  add('cmrr', S.cmrr, DrawKind.Symmetric, 1 / ina.cmrr)
  add('psrr', S.psrr, DrawKind.Symmetric, 1 / ina.psrr)
  add('supply', S.supply, DrawKind.Symmetric, input.supplyTolerance)
  add('gain-error', S.gainError, DrawKind.Normal, ina.gainError)
  add('gain-drift', S.gainDrift, DrawKind.Normal, ina.gainDrift)
  add('nonlinearity', S.nonlinearity, DrawKind.Normal, ina.nonlinearity)
  const rKind = distribution === 'normal' ? DrawKind.Normal : DrawKind.Symmetric
  add('rg:tolerance', S.rgTol, rKind, rgR.tolerance)
  add('rg:tempco', S.rgTc, rKind, rgR.tempco)
  if (rs > 0 && variables.some((v) => v.slot === S.ib)) {
    add('rs+:tolerance', S.rsPlusTol, rKind, input.rs?.tolerance ?? 0)
    add('rs-:tolerance', S.rsMinusTol, rKind, input.rs?.tolerance ?? 0)
    add('rs+:tempco', S.rsPlusTc, rKind, input.rs?.tempco ?? 0)
    add('rs-:tempco', S.rsMinusTc, rKind, input.rs?.tempco ?? 0)
  }
  const vd = endsOf(input.input)
  const vcm = endsOf(input.inputCm)
  const residual = (max: number, at25: number): number => (max > 0 ? Math.max(0, max - at25) / max : 0)
  return {
    variables,
    points: vd.flatMap((x) => vcm.map((cm) => ({x, cm, nominal: g * x + input.vref}))),
    g,
    gainConstant: ina.gainConstant,
    rg: rgR.value,
    rs,
    vcmRef: ina.vcmRef ?? (input.supply[0] + input.supply[1]) / 2,
    supplySpan: input.supply[1] - input.supply[0],
    nlSpan: Math.abs(g) * (Math.max(...vd) - Math.min(...vd)),
    calibrated: input.calibration !== 'none',
    gainCalibrated: input.calibration === 'offset-and-gain',
    ibResidual: residual(bias.ibMax, ina.ib),
    iosResidual: residual(bias.iosMax, ina.ios)
  }
}

/** The signed error at point p and temperature t (°C): full, or the calibrated residual. */
export function inaPointError(m: InaYieldModel, v: Float64Array, p: number, t: number, calibrated: boolean): number {
  const S = INA_SLOT
  const q = m.points[p]
  const g = m.g
  const dt = t - DATASHEET_TEMPERATURE
  const gvd = g * q.x
  const cal = calibrated && m.calibrated
  const gainCal = calibrated && m.gainCalibrated
  const vos = cal ? 0 : v[S.vosIn] * g + v[S.vosOut]
  const drift = (v[S.vosInDrift] * g + v[S.vosOutDrift]) * dt
  const dRs = m.rs * (v[S.rsPlusTol] - v[S.rsMinusTol] + (v[S.rsPlusTc] - v[S.rsMinusTc]) * dt)
  const ib = v[S.ib] * dRs * g * (cal ? m.ibResidual : 1)
  const ios = v[S.ios] * m.rs * g * (cal ? m.iosResidual : 1)
  const cmrr = gainCal ? 0 : g * (q.cm - m.vcmRef) * v[S.cmrr]
  const psrr = g * m.supplySpan * v[S.supply] * v[S.psrr]
  const gainError = gainCal ? 0 : v[S.gainError] * gvd
  const gainAt = (rg: number): number => 1 + m.gainConstant / rg
  const tol = gainCal ? 0 : gvd * (gainAt(m.rg * (1 + v[S.rgTol])) / g - 1)
  const tc = gvd * (gainAt(m.rg * (1 + v[S.rgTc] * dt)) / g - 1) + v[S.gainDrift] * dt * gvd
  const nl = v[S.nonlinearity] * m.nlSpan
  return vos + drift + ib + ios + cmrr + psrr + gainError + tol + tc + nl
}
