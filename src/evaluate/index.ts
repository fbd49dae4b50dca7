/**
 * The evaluate phase: each valid stage block through the engine, then the rules.
 * Pure: a block the engine cannot evaluate becomes a fatal message on the file.
 */
import type {VFile} from 'vfile'
import {evaluateStage} from '../engine/index.js'
import type {StageInput, StageResult} from '../engine/types.js'
import type {ParsedNote, StageBlockNode, StageRole} from '../note/types.js'
import {runRules} from '../rules/index.js'
import type {RuleNote} from '../rules/types.js'
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
}

/** Evaluate every stage of the note whose block parsed cleanly, in document order. */
export function evaluateNote(parsed: ParsedNote, file: VFile): StageEvaluation[] {
  const out: StageEvaluation[] = []
  for (const block of parsed.stages) {
    const waivers = waiversOf(block, file)
    if (block.input === null) continue
    try {
      const result = evaluateStage(block.input)
      const notes = applyWaivers(block, runRules({input: block.input, result, context: parsed.meta.context}), waivers, file)
      out.push({block, input: block.input, result, notes, role: roleOf(block)})
    } catch (error) {
      const m = file.message(
        `Could not evaluate stage \`${block.id}\`: ${error instanceof Error ? error.message : String(error)}`,
        {place: block.position?.start, ruleId: 'evaluation-failed', source: 'ampreview'}
      )
      m.fatal = true
    }
  }
  return out
}
