/**
 * The evaluate phase: each valid stage block through the engine, then the rules.
 * Pure: a block the engine cannot evaluate becomes a fatal message on the file.
 */
import type {VFile} from 'vfile'
import {DEFAULT_YIELD_TRIALS, evaluateStage, type TrialSpread} from '../engine/index.js'
import type {StageInput, StageResult} from '../engine/types.js'
import type {ParsedNote, StageBlockNode, StageRole} from '../note/types.js'
import {runRules} from '../rules/index.js'
import type {RuleNote} from '../rules/types.js'
import {chainedInput, chainPlan, evaluateChains, type ChainEvaluation} from './chains.js'
import {evaluateAlternatives, type StageAlternatives} from './alternatives.js'

export {candidatesOf, compareScores, dominantOf, scoreOf, withCandidate, type AlternativeCandidate, type AlternativeEvaluation, type AlternativeScore, type StageAlternatives} from './alternatives.js'

export {chainPlan, chainedInput, evaluateChains, outputSpanOf, type ChainEvaluation, type ChainPlan, type EvaluatedStage} from './chains.js'
import {applyWaivers, roleOf, waiversOf} from './waivers.js'

export {evaluateMessages, roleOf} from './waivers.js'

export interface StageEvaluation {
  block: StageBlockNode
  input: StageInput
  result: StageResult
  /** The rules' notes, those of accepted rules marked with the author's reason. */
  notes: RuleNote[]
  /** `baseline` stages are shown but count toward neither the verdict nor the exit code. */
  role: StageRole
  /** The stage with every candidate amplifier (DESIGN §8.8); null when not asked for. */
  alternatives: StageAlternatives | null
}

/** How the note is evaluated, beyond what it says itself. */
export interface EvaluateOptions {
  /** Evaluate the alternatives of every stage, whatever its block says (`--alternatives`). (default: false) */
  alternatives?: boolean
  /** The Monte Carlo (DESIGN §8.7) on every stage without a `yield` of its own, at the default trials and seed (`--yield`). (default: false) */
  yield?: boolean
  /** Runs large Monte Carlos' trials on other threads (the CLI's trial threads); the results are the same bytes. (optional: in this thread) */
  spread?: TrialSpread
}

/**
 * Evaluate every stage of the note whose block parsed cleanly, returned in document order.
 * Stages of a chain are evaluated in signal order, each later one on the output range of
 * the one before (DESIGN §8.6, ./chains.ts); a stage that leaves its input to a chain that
 * could not be read is not evaluated (the chain's errors say why).
 */
export function evaluateNote(parsed: ParsedNote, file: VFile, options: EvaluateOptions = {}): StageEvaluation[] {
  return evaluateNoteWithChains(parsed, file, options).stages
}

/** The stage with the default Monte Carlo when `options.yield` asks for it and the stage has none. */
const withYieldOption = (input: StageInput, options: EvaluateOptions): StageInput =>
  options.yield === true && !input.yield ? {...input, yield: {trials: DEFAULT_YIELD_TRIALS, seed: 1, distribution: 'uniform'}} : input

/** Evaluate the note's stages, then its chains from those evaluations. */
export function evaluateNoteWithChains(parsed: ParsedNote, file: VFile, options: EvaluateOptions = {}): {stages: StageEvaluation[]; chains: ChainEvaluation[]} {
  const plan = chainPlan(parsed)
  const byId = new Map(parsed.stages.filter((b) => b.input !== null).map((b) => [b.id, b] as const))
  const done = new Map<StageBlockNode, StageEvaluation>()
  const spans = new Map<string, [number, number]>()
  const order: StageBlockNode[] = []
  for (const {input} of plan.chains) for (const id of input.stages) {
    const b = byId.get(id)
    if (b !== undefined && !order.includes(b)) order.push(b)
  }
  for (const b of parsed.stages) if (!order.includes(b)) order.push(b)
  for (const block of order) {
    if (block.input === null) continue
    if (block.inputFromChain === true && !plan.previous.has(block.id)) continue
    const ev = evaluateOne(block, withYieldOption(chainedInput(block, block.input, plan, spans, file), options), parsed, file, options)
    if (ev === null) continue
    done.set(block, ev)
    spans.set(block.id, [ev.result.swing.outputSpan[0], ev.result.swing.outputSpan[1]])
  }
  const stages = parsed.stages.flatMap((b) => {
    const ev = done.get(b)
    return ev === undefined ? [] : [ev]
  })
  const chains = evaluateChains(plan, new Map(stages.map((ev) => [ev.input.id, ev] as const)), file, {yield: options.yield === true, ...(options.spread ? {spread: options.spread} : {})})
  return {stages, chains}
}

function evaluateOne(block: StageBlockNode, input: StageInput, parsed: ParsedNote, file: VFile, options: EvaluateOptions): StageEvaluation | null {
  const waivers = waiversOf(block, file)
  try {
    const result = evaluateStage(input, options.spread ? {spread: options.spread} : {})
    const notes = applyWaivers(block, runRules({input, result, context: parsed.meta.context}), waivers, file)
    const alternatives = block.alternatives === true || options.alternatives === true
      ? evaluateAlternatives(input, result, [...parsed.opamps, ...(parsed.inas ?? [])], file, block.position?.start, options.spread ? {spread: options.spread} : {}) : null
    return {block, input, result, notes, role: roleOf(block), alternatives}
  } catch (error) {
    const m = file.message(
      `Could not evaluate stage \`${block.id}\`: ${error instanceof Error ? error.message : String(error)}`,
      {place: block.position?.start, ruleId: 'evaluation-failed', source: 'ampreview'}
    )
    m.fatal = true
    return null
  }
}
