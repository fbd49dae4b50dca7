/**
 * Loop stability and closed-loop response (DESIGN §4.4).
 *
 * The loop gain T(f) comes from the loop broken at the op-amp's output source (`nodal.ts`,
 * loop mode), swept on a log grid from min(fL, 1 Hz)/10 to 10·gbw (the report's curves);
 * the crossover and phase margin come from `crossover.ts`. Bandwidth is the lowest frequency
 * where |H| = |H(0)|/√2; peaking is 20·lg(max|H|/|H(0)|), at least 0 dB.
 */
import {wrapDeg} from './complex.js'
import {findCrossover, phaseMarginOf, phaseOf, refineCrossover, spanStart, TOL_U, type Crossover} from './crossover.js'
import {createWorkspace, solveClosed, solveLoop, type NodalWorkspace} from './nodal.js'
import {goldenMax, illinois} from './roots.js'
import {suggestCf} from './suggested-cf.js'
import {stageNetlist} from './topology/index.js'
import type {Stability, StageCurves, StageInput} from './types.js'

/** Loop-gain curves of `StageCurves`. */
export type LoopCurves = Pick<StageCurves, 'frequency' | 'loopGainMagnitude' | 'loopGainPhase' | 'closedLoopMagnitude' | 'closedLoopPhase'>

export interface StabilityAnalysis {
  stability: Stability
  curves: LoopCurves
}

// Sweep density: the curves are for charts; crossover, bandwidth and peak are refined off-grid.
const POINTS_PER_DECADE = 12

/** Stability figures and loop curves of a stage (DESIGN §4.4). */
export function stabilityAnalysis(input: StageInput): StabilityAnalysis {
  const ws = createWorkspace(stageNetlist(input))
  const f0 = spanStart(input)
  const f1 = 10 * input.opamp.gbw
  const decades = Math.log10(f1 / f0)
  const n = Math.max(2, Math.min(Math.ceil(decades * POINTS_PER_DECADE), 299))
  const ratio = (f1 / f0) ** (1 / n)
  const frequency: number[] = []
  const loopGainMagnitude: number[] = []
  const loopGainPhase: number[] = []
  const closedLoopMagnitude: number[] = []
  const closedLoopPhase: number[] = []
  let closedWrapped = 0
  let crossover: Crossover | null = null
  let wrapped = 0
  for (let i = 0; i <= n; i++) {
    const f = i === n ? f1 : f0 * ratio ** i
    solveLoop(ws, f)
    const m = Math.hypot(ws.tre, ws.tim)
    const w = phaseOf(ws)
    const phase = i === 0 ? w : loopGainPhase[i - 1] + wrapDeg(w - wrapped)
    if (crossover === null && i > 0 && loopGainMagnitude[i - 1] >= 1 && m < 1) {
      crossover = refineCrossover(ws, frequency[i - 1], f, loopGainPhase[i - 1], wrapped)
    }
    wrapped = w
    solveClosed(ws, f)
    frequency.push(f)
    loopGainMagnitude.push(m)
    loopGainPhase.push(phase)
    closedLoopMagnitude.push(Math.hypot(ws.hre, ws.him))
    const cw = (Math.atan2(ws.him, ws.hre) * 180) / Math.PI
    closedLoopPhase.push(i === 0 ? cw : closedLoopPhase[i - 1] + wrapDeg(cw - closedWrapped))
    closedWrapped = cw
  }
  // A loop still above 1 at 10·gbw (unusual): keep scanning without storing curves.
  if (crossover === null && loopGainMagnitude[n] >= 1) crossover = findCrossover(ws, f1, 1e4 * f1, ratio, loopGainPhase[n])

  solveClosed(ws, 0)
  const h0 = Math.hypot(ws.hre, ws.him)
  return {
    stability: {
      phaseMargin: phaseMarginOf(crossover),
      crossover: crossover?.frequency ?? null,
      bandwidth: bandwidthOf(ws, frequency, closedLoopMagnitude, h0),
      peaking: peakingOf(ws, frequency, closedLoopMagnitude, h0),
      suggestedCf: input.topology === 'transimpedance' ? suggestCf(input) : null
    },
    curves: {frequency, loopGainMagnitude, loopGainPhase, closedLoopMagnitude, closedLoopPhase}
  }
}

const lnClosed = (ws: NodalWorkspace, u: number): number => {
  solveClosed(ws, Math.exp(u))
  return Math.log(Math.hypot(ws.hre, ws.him))
}

/** Lowest frequency where |H| falls to |H(0)|/√2, Hz; null when not within the span. */
function bandwidthOf(ws: NodalWorkspace, f: number[], mag: number[], h0: number): number | null {
  const target = Math.log(h0 / Math.SQRT2)
  const fn = (u: number): number => lnClosed(ws, u) - target
  const i = mag.findIndex((m) => m <= h0 / Math.SQRT2)
  if (i < 0) return null
  if (i > 0) return Math.exp(illinois(fn, Math.log(f[i - 1]), Math.log(mag[i - 1]) - target, Math.log(f[i]), Math.log(mag[i]) - target, TOL_U))
  // Already below at the span's start: search downward a decade at a time (12 at most).
  let hi = Math.log(f[0])
  let fHi = Math.log(mag[0]) - target
  for (let d = 0; d < 12; d++) {
    const lo = hi - Math.LN10
    const fLo = fn(lo)
    if (fLo > 0) return Math.exp(illinois(fn, lo, fLo, hi, fHi, TOL_U))
    hi = lo
    fHi = fLo
  }
  return null
}

/** 20·lg(max|H|/|H(0)|), dB, ≥ 0; the grid maximum refined by golden section. */
function peakingOf(ws: NodalWorkspace, f: number[], mag: number[], h0: number): number {
  let j = 0
  for (let i = 1; i < mag.length; i++) if (mag[i] > mag[j]) j = i
  let best = mag[j]
  // Refine only an interior maximum above |H(0)|: a response that never rises has 0 dB.
  if (j > 0 && j < mag.length - 1 && best > h0) {
    const [, ln] = goldenMax((u) => lnClosed(ws, u), Math.log(f[j - 1]), Math.log(f[j + 1]), 30)
    best = Math.max(best, Math.exp(ln))
  }
  return Math.max(0, 20 * Math.log10(best / h0))
}
