/**
 * The transimpedance feedback-capacitor suggestion (DESIGN §4.4): the smallest Cf in
 * 0 … 1 µF that gives a 60° phase margin; 0 when Cf = 0 already does; null when no Cf in the
 * range does. Cf replaces the stage's own cf.
 *
 * Phase margin is not monotonic in Cf (it rises as Cf cancels the input pole, can pass the
 * op-amp's unity-follower margin while the crossover sits well below the second pole, and
 * tends back to that margin at very large Cf), so the first Cf that reaches 60° is bracketed
 * on a half-decade scan from 1 fF, then found by a bracketed search on ln Cf.
 */
import {MAX_SUGGESTED_CF, TARGET_PHASE_MARGIN} from './constants.js'
import {createWorkspace, setCapacitance, type NodalWorkspace} from './nodal.js'
import {illinois} from './roots.js'
import {findCrossover, phaseMarginOf, spanStart} from './crossover.js'
import {stageNetlist} from './topology/index.js'
import type {StageInput} from './types.js'

const SCAN_START = 1e-15
const SCAN_STEP = Math.sqrt(10)
// Quarter-decade steps keep the phase change between samples far below half a turn.
const FREQ_RATIO = 10 ** 0.25

/** Phase margin (degrees) with Cf = c, or null without crossover. */
function marginWith(ws: NodalWorkspace, input: StageInput, c: number): number | null {
  setCapacitance(ws, 'cf', c)
  return phaseMarginOf(findCrossover(ws, spanStart(input), 1e3 * input.opamp.gbw, FREQ_RATIO))
}

/** Smallest Cf (F) giving 60°, 0 if Cf = 0 does, null if none ≤ 1 µF (DESIGN §4.4). */
export function suggestCf(input: StageInput): number | null {
  if (input.topology !== 'transimpedance' || !input.rf) return null
  const ws = createWorkspace(stageNetlist(input))
  const excess = (c: number): number => (marginWith(ws, input, c) ?? -Infinity) - TARGET_PHASE_MARGIN
  if (excess(0) >= 0) return 0
  let lo = SCAN_START / SCAN_STEP
  let fLo = excess(lo)
  if (fLo >= 0) return lo
  for (let c = SCAN_START; c <= MAX_SUGGESTED_CF * (1 + 1e-12); c *= SCAN_STEP) {
    const hi = Math.min(c, MAX_SUGGESTED_CF)
    const fHi = excess(hi)
    if (fHi >= 0) {
      // Bracketed search on ln Cf; a missing crossover counts as far below target.
      const fn = (u: number): number => Math.max(excess(Math.exp(u)), -180)
      return Math.exp(illinois(fn, Math.log(lo), Math.max(fLo, -180), Math.log(hi), fHi, 1e-7))
    }
    lo = hi
    fLo = fHi
  }
  return null
}
