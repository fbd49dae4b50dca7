/**
 * Stage responses at one frequency, for callers outside the sweeps: the closed-loop signal
 * gain and the loop gain (DESIGN §4.4), both from the nodal solver.
 */
import type {Complex} from './complex.js'
import {createWorkspace, setCapacitance, solveClosed, solveLoop} from './nodal.js'
import {stageNetlist} from './topology/index.js'
import type {StageInput} from './types.js'

/**
 * Closed-loop signal gain H(f): V/V, or V/A for transimpedance (current into the − pin).
 * @param f
 *   Frequency, Hz (0 for DC).
 */
export function closedLoopGain(input: StageInput, f: number): Complex {
  const ws = createWorkspace(stageNetlist(input))
  solveClosed(ws, f)
  return {re: ws.hre, im: ws.him}
}

/**
 * Loop gain T(f), V/V: the loop broken at the op-amp's output source, which drives 1 V into
 * the network with every independent source at zero; T = −A(f)·(V+ − V−).
 * @param cf
 *   Replaces the stage's cf (F) when given (optional).
 */
export function loopGain(input: StageInput, f: number, cf?: number): Complex {
  const ws = createWorkspace(stageNetlist(input))
  if (cf !== undefined) setCapacitance(ws, 'cf', cf)
  solveLoop(ws, f)
  return {re: ws.tre, im: ws.tim}
}
