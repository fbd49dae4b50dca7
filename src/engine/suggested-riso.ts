/**
 * Capacitive load and output isolation (DESIGN §8.3): how much phase margin `cload` costs,
 * and the smallest `riso` that brings the margin back to 60° (when some riso in the search
 * range reaches it) or else 45°, with the closed-loop bandwidth that riso leaves.
 *
 * The search mirrors `suggested-cf.ts`: riso replaces the stage's own in the netlist, scanned
 * upward on a tenth-decade grid from 0.1 Ω to 10 kΩ, and the first bracket that reaches the
 * target is refined by a bracketed search on ln riso. Phase margin rises with riso up to a
 * peak (riso puts a zero at 1/(2π·riso·cload) that cancels the load pole, common practice),
 * then settles back towards the unloaded margin as riso isolates the load: the first
 * crossing is the smallest riso.
 */
import {findCrossover, phaseMarginOf, spanStart} from './crossover.js'
import {createWorkspace, setResistance, type NodalWorkspace} from './nodal.js'
import {illinois} from './roots.js'
import {stabilityAnalysis} from './stability.js'
import {stageNetlist} from './topology/index.js'
import type {StageInput} from './types.js'

/** Search range of riso, Ω. */
export const RISO_RANGE: readonly [number, number] = [0.1, 10e3]
const STEPS_PER_DECADE = 10
const FREQ_RATIO = 10 ** 0.25

export interface CapacitiveLoadAdvice {
  /** Phase margin with the stage as given, degrees (null without crossover). */
  margin: number | null
  /** Phase margin with cload removed (riso as given), degrees. */
  marginWithoutLoad: number | null
  /** Margin the load costs, degrees (≥ 0 when both exist). */
  cost: number | null
  /** 60 when reachable in the search range, else 45; null when neither is. */
  target: number | null
  /** Smallest riso reaching the target, Ω; null when none does. */
  riso: number | null
  /** Closed-loop bandwidth at the load node with that riso, Hz. */
  bandwidth: number | null
}

/** The stage with riso set to a value (present in the netlist, so it can be changed in place). */
const withRiso = (input: StageInput, ohms: number): StageInput => ({
  ...input,
  riso: {value: ohms, tolerance: input.riso?.tolerance ?? 0, tempco: input.riso?.tempco ?? 0}
})

function marginOf(ws: NodalWorkspace, input: StageInput): number | null {
  return phaseMarginOf(findCrossover(ws, spanStart(input), 1e3 * input.opamp.gbw, FREQ_RATIO))
}

/**
 * Phase margin (degrees, −Infinity without crossover) against riso over the search grid,
 * in ascending riso: for the rule and the monotonicity check.
 */
export function marginOverRiso(input: StageInput): {riso: number[]; margin: number[]} {
  const ws = createWorkspace(stageNetlist(withRiso(input, RISO_RANGE[0])))
  const riso: number[] = []
  const margin: number[] = []
  const n = Math.round(Math.log10(RISO_RANGE[1] / RISO_RANGE[0]) * STEPS_PER_DECADE)
  for (let i = 0; i <= n; i++) {
    const r = RISO_RANGE[0] * 10 ** (i / STEPS_PER_DECADE)
    setResistance(ws, 'riso', r)
    riso.push(r)
    margin.push(marginOf(ws, input) ?? -Infinity)
  }
  return {riso, margin}
}

/** The load's cost and the riso advice; null when the stage has no cload. */
export function capacitiveLoadAdvice(input: StageInput): CapacitiveLoadAdvice | null {
  if (!(input.cload > 0) || input.topology === 'instrumentation') return null
  const margin = marginOf(createWorkspace(stageNetlist(input)), input)
  const marginWithoutLoad = marginOf(createWorkspace(stageNetlist({...input, cload: 0})), input)
  const cost = margin === null || marginWithoutLoad === null ? null : marginWithoutLoad - margin
  const scan = marginOverRiso(input)
  const best = Math.max(...scan.margin)
  const target = best >= 60 ? 60 : best >= 45 ? 45 : null
  let riso: number | null = null
  if (target !== null) {
    const i = scan.margin.findIndex((m) => m >= target)
    if (i === 0) riso = scan.riso[0] as number
    else {
      const ws = createWorkspace(stageNetlist(withRiso(input, RISO_RANGE[0])))
      const fn = (u: number): number => {
        setResistance(ws, 'riso', Math.exp(u))
        return Math.max(marginOf(ws, input) ?? -180, -180) - target
      }
      const lo = Math.log(scan.riso[i - 1] as number)
      const hi = Math.log(scan.riso[i] as number)
      riso = Math.exp(illinois(fn, lo, Math.max(scan.margin[i - 1] as number, -180) - target, hi, (scan.margin[i] as number) - target, 1e-6))
    }
  }
  const bandwidth = riso === null ? null : stabilityAnalysis(withRiso(input, riso)).stability.bandwidth
  return {margin, marginWithoutLoad, cost, target, riso, bandwidth}
}
