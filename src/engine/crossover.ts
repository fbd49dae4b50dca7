/**
 * Loop-gain crossover search (DESIGN §4.4): the first frequency where |T| falls through 1,
 * refined on ln|T| against ln f, with the phase of T unwrapped from the lowest frequency
 * (where T is real and positive for these DC-coupled loops). Phase margin = 180° + ∠T(fc)
 * (common practice).
 */
import {wrapDeg} from './complex.js'
import {solveLoop, type NodalWorkspace} from './nodal.js'
import {illinois} from './roots.js'
import type {StageInput} from './types.js'

const DEG = 180 / Math.PI
/** Phase of the last loop solve, degrees in (−180, 180]. */
export const phaseOf = (ws: NodalWorkspace): number => Math.atan2(ws.tim, ws.tre) * DEG
/** Bracket width at which frequency searches stop, in ln f (relative 1e-9). */
export const TOL_U = 1e-9

/** A crossover: frequency (Hz) and unwrapped phase of T there (degrees). */
export interface Crossover {
  frequency: number
  phase: number
}

/** Lowest frequency of the analysed span, Hz: min(fL, 1 Hz)/10 (DESIGN §4.4 charts). */
export const spanStart = (input: StageInput): number => Math.min(input.band[0], 1) / 10

/**
 * Refine a crossover bracketed by fa (|T| ≥ 1, unwrapped phase `phaseA`) and fb (|T| < 1).
 */
export function refineCrossover(ws: NodalWorkspace, fa: number, fb: number, phaseA: number, wrappedA: number): Crossover {
  const lnMag = (u: number): number => {
    solveLoop(ws, Math.exp(u))
    return Math.log(Math.hypot(ws.tre, ws.tim))
  }
  const ua = Math.log(fa)
  const ub = Math.log(fb)
  const u = illinois(lnMag, ua, lnMag(ua), ub, lnMag(ub), TOL_U)
  solveLoop(ws, Math.exp(u))
  return {frequency: Math.exp(u), phase: phaseA + wrapDeg(phaseOf(ws) - wrappedA)}
}

/**
 * Scan T upward from f0 by `ratio` to fEnd and return the first crossover, or null.
 * `phase0` is the unwrapped phase at f0 (default: its principal value).
 */
export function findCrossover(ws: NodalWorkspace, f0: number, fEnd: number, ratio: number, phase0?: number): Crossover | null {
  solveLoop(ws, f0)
  let f = f0
  let mag = Math.hypot(ws.tre, ws.tim)
  let wrapped = phaseOf(ws)
  let phase = phase0 ?? wrapped
  while (f < fEnd) {
    const fn = f * ratio
    solveLoop(ws, fn)
    const m = Math.hypot(ws.tre, ws.tim)
    const w = phaseOf(ws)
    if (mag >= 1 && m < 1) return refineCrossover(ws, f, fn, phase, wrapped)
    phase += wrapDeg(w - wrapped)
    wrapped = w
    mag = m
    f = fn
  }
  return null
}

/** Phase margin, degrees, for a crossover (or null when there is none). */
export const phaseMarginOf = (c: Crossover | null): number | null => (c === null ? null : 180 + c.phase)
