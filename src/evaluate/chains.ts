/**
 * The evaluate phase of measurement chains (DESIGN §8.6).
 *
 * `chainInputs` works out, before any stage is evaluated, the input range of every later
 * stage of a chain: the previous stage's output span (ideal op-amp, nominal parts, the DC
 * solve of the stage itself); a given `input` that differs from it by more than 1 % of the
 * span is a warning at that key. `evaluateChains` then builds each chain from its stages'
 * own evaluations (gain, DC contributors, output span, and the spectral view of the same
 * netlist) and runs the chain rules. Pure apart from messages on the file.
 */
import type {VFile} from 'vfile'
import {checkChainRequirements, DEFAULT_YIELD_TRIALS, dcAnalysis, evaluateChain, evaluateInstrumentation, inaGain, operatingPoints, runChainYield, stageSpectrum, withoutMonteCarlo, type ChainInput, type TrialSpread, type ChainResult, type ChainStage} from '../engine/index.js'
import type {YieldOptions} from '../engine/types.js'
import type {StageInput, StageResult} from '../engine/types.js'
import type {ChainBlockNode} from '../note/chain-types.js'
import {chainMessages} from '../note/chain-messages.js'
import type {ParsedNote, StageBlockNode} from '../note/types.js'
import {runChainRules} from '../rules/chain/index.js'
import type {RuleNote} from '../rules/types.js'
import {formatRange} from '../units/index.js'
import {applyWaivers, chainWaiversOf} from './waivers.js'

export interface ChainEvaluation {
  block: ChainBlockNode
  input: ChainInput
  result: ChainResult
  notes: RuleNote[]
  /** The stages' topologies, in signal order (the first one sets the input's unit). */
  topologies: string[]
}

/** The output span [low, high] of a stage over its input range (V). */
export function outputSpanOf(input: StageInput): [number, number] {
  // An instrumentation stage has no netlist: G·vd + vref from its block model (DESIGN §8.2).
  const v = input.topology === 'instrumentation' && input.ina !== null && input.rg !== null
    ? input.input.map((vd) => inaGain(input.ina!, input.rg!.value) * vd + input.vref)
    : operatingPoints(input).map((p) => p.vout)
  return [Math.min(...v), Math.max(...v)]
}

/** Which chain (and which earlier stage) each later chain stage takes its input from. */
export interface ChainPlan {
  /** Stage id → the id of the stage before it in its chain. */
  previous: Map<string, string>
  /** Chains with a valid input, in document order. */
  chains: {block: ChainBlockNode; input: ChainInput}[]
}

export function chainPlan(parsed: ParsedNote): ChainPlan {
  const previous = new Map<string, string>()
  const chains: ChainPlan['chains'] = []
  for (const block of parsed.chains ?? []) {
    if (block.input === null) continue
    chains.push({block, input: block.input})
    block.input.stages.forEach((id, i) => {
      if (i > 0) previous.set(id, block.input!.stages[i - 1]!)
    })
  }
  return {previous, chains}
}

const differsByOnePercent = (given: readonly [number, number], computed: readonly [number, number]): boolean => {
  const span = Math.abs(computed[1] - computed[0])
  const tol = 0.01 * (span > 0 ? span : Math.max(Math.abs(computed[0]), Math.abs(computed[1]), 1e-30))
  return Math.abs(given[0] - computed[0]) > tol || Math.abs(given[1] - computed[1]) > tol
}

/**
 * The stage's input for evaluation: its own, or — for a later stage of a chain — the output
 * span of the stage before it (already worked out in `spans`), warning where a given input
 * differs by more than 1 % of that span.
 */
export function chainedInput(block: StageBlockNode, input: StageInput, plan: ChainPlan, spans: Map<string, [number, number]>, file: VFile): StageInput {
  const prev = plan.previous.get(input.id)
  if (prev === undefined) return input
  const computed = spans.get(prev)
  if (computed === undefined) return input
  if (block.inputFromChain !== true && differsByOnePercent(input.input, computed)) {
    const entry = block.entries.find((e) => e.key === 'input')
    file.message(chainMessages.inputDiffers(input.id, formatRange(input.input[0], input.input[1], 'V'), formatRange(computed[0], computed[1], 'V'), prev),
      {place: entry ? {line: entry.line, column: entry.column} : block.position?.start, ruleId: 'input-from-chain', source: 'ampreview'})
  }
  return {...input, input: [computed[0], computed[1]]}
}

/** One evaluated stage, as far as a chain needs it. */
export interface EvaluatedStage {
  input: StageInput
  result: StageResult
}

/**
 * A stage's DC residuals under the chain's calibration when the stage states another one: the
 * DC budget of its own netlist, or the block model for an instrumentation stage (no netlist).
 */
function calibratedAs(input: StageInput, calibration: ChainInput['calibration']): readonly {key: string; output: number}[] | null {
  const recal = withoutMonteCarlo({...input, calibration})
  const dc = input.topology === 'instrumentation' ? evaluateInstrumentation(recal).dc : dcAnalysis(recal).budget
  return dc.calibrated?.contributors ?? null
}

/** The chain's Monte Carlo options: its own `yield`, else the defaults with `--yield`, else null (off). */
export const chainYieldOptions = (input: ChainInput, forced: boolean): YieldOptions | null =>
  input.yield ?? (forced || input.require.yield !== undefined ? {trials: DEFAULT_YIELD_TRIALS, seed: 1, distribution: 'uniform'} : null)

/**
 * Evaluate every planned chain whose stages were all evaluated.
 * @param options
 *   `yield`: the Monte Carlo on every chain without a `yield` of its own (`--yield`); `spread`:
 *   its trials on other threads (the same bytes).
 */
export function evaluateChains(plan: ChainPlan, stages: ReadonlyMap<string, EvaluatedStage>, file: VFile, options: {yield?: boolean; spread?: TrialSpread} = {}): ChainEvaluation[] {
  const out: ChainEvaluation[] = []
  for (const {block, input} of plan.chains) {
    // Read (and check) the chain's waivers whether or not the chain can be evaluated.
    const waivers = chainWaiversOf(block, file)
    const evaluated = input.stages.map((id) => stages.get(id))
    if (evaluated.some((s) => s === undefined)) continue
    try {
      const views = (evaluated as EvaluatedStage[]).map((s): ChainStage => {
        const own = s.result.dc.calibrated
        const calibrated = input.calibration === 'none' ? null
          : own !== null && own.calibration === input.calibration ? own.contributors
            : calibratedAs(s.input, input.calibration)
        return {
          id: s.input.id, gain: s.result.gain, contributors: s.result.dc.contributors, calibrated,
          outputSpan: s.result.swing.outputSpan, inputSpan: s.input.input, bandwidth: s.result.stability.bandwidth,
          spectrum: stageSpectrum(s.input)
        }
      })
      const cascade = evaluateChain(input, views)
      const yieldOptions = chainYieldOptions(input, options.yield === true)
      let result: ChainResult = cascade
      if (yieldOptions !== null) {
        const y = runChainYield(input, (evaluated as EvaluatedStage[]).map((s) => ({input: s.input, gain: s.result.gain})), cascade.dc, yieldOptions, options.spread)
        // The `yield` requirement is judged on the Monte Carlo, which the cascade does not run: its verdicts again, with it.
        const requirements = [...checkChainRequirements(input, {...cascade, yield: y}), ...cascade.requirements.filter((r) => r.kind === 'limit')]
        result = {...cascade, yield: y, requirements}
      }
      const notes = applyWaivers(block, runChainRules({input, result, stages: evaluated as EvaluatedStage[]}), waivers, file)
      out.push({block, input, result, notes, topologies: (evaluated as EvaluatedStage[]).map((s) => s.input.topology)})
    } catch (error) {
      const m = file.message(`Could not evaluate chain \`${block.id}\`: ${error instanceof Error ? error.message : String(error)}`,
        {place: block.position?.start, ruleId: 'evaluation-failed', source: 'ampreview'})
      m.fatal = true
    }
  }
  return out
}
