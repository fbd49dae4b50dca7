/**
 * Low-pass figures from the solved response (DESIGN §8.4): the passband gain H(0), f0 where
 * the phase of H(f)/H(0) passes −90°, and Q = |H(f0)/H(0)|. For a second-order low-pass
 * section H = H0·ω0²/(s² + s·ω0/Q + ω0²) (standard active-filter texts) the phase is −90°
 * exactly at ω0 and |H(jω0)/H0| = Q, so these read the section's own f0 and Q off the
 * nodal solution, op-amp included, without a per-topology formula.
 */
import {wrapDeg} from './complex.js'
import {spanStart, TOL_U} from './crossover.js'
import {createWorkspace, solveClosed, type NodalWorkspace} from './nodal.js'
import {illinois} from './roots.js'
import {stageNetlist} from './topology/index.js'
import type {FilterFigures, StageInput, Topology} from './types.js'

/** Topologies that report `filter` figures. */
export const FILTER_TOPOLOGIES: readonly Topology[] = ['lowpass-sallen-key', 'lowpass-mfb']
export const isFilterTopology = (t: Topology): boolean => FILTER_TOPOLOGIES.includes(t)

const DEG = 180 / Math.PI
const POINTS_PER_DECADE = 24

/** Phase of H(f)/H(0), degrees in (−180, 180]. */
function relativePhase(ws: NodalWorkspace, f: number, h0re: number, h0im: number): number {
  solveClosed(ws, f)
  // H/H0 = H·conj(H0)/|H0|²: only the angle is needed.
  const re = ws.hre * h0re + ws.him * h0im
  const im = ws.him * h0re - ws.hre * h0im
  return Math.atan2(im, re) * DEG
}

/** f0, Q and passband gain of a low-pass stage; null for other topologies. */
export function filterFigures(input: StageInput): FilterFigures | null {
  if (!isFilterTopology(input.topology)) return null
  const ws = createWorkspace(stageNetlist(input))
  solveClosed(ws, 0)
  const h0re = ws.hre
  const h0im = ws.him
  const h0 = Math.hypot(h0re, h0im)
  const f0 = spanStart(input)
  const f1 = 10 * input.opamp.gbw
  const ratio = 10 ** (1 / POINTS_PER_DECADE)
  let fa = f0
  let wrappedA = relativePhase(ws, fa, h0re, h0im)
  let phaseA = wrappedA
  for (let f = f0 * ratio; f <= f1 * ratio; f *= ratio) {
    const w = relativePhase(ws, f, h0re, h0im)
    const phase = phaseA + wrapDeg(w - wrappedA)
    if (phaseA > -90 && phase <= -90) {
      // Refine on ln f: the unwrapped phase, continued from fa, against −90°.
      const base = phaseA
      const wrapA = wrappedA
      const fn = (u: number): number => base + wrapDeg(relativePhase(ws, Math.exp(u), h0re, h0im) - wrapA) + 90
      const u = illinois(fn, Math.log(fa), phaseA + 90, Math.log(f), phase + 90, TOL_U)
      const fc = Math.exp(u)
      solveClosed(ws, fc)
      return {f0: fc, q: Math.hypot(ws.hre, ws.him) / h0, passbandGain: Math.sign(h0re) * h0}
    }
    fa = f
    wrappedA = w
    phaseA = phase
  }
  return {f0: null, q: null, passbandGain: Math.sign(h0re) * h0}
}
