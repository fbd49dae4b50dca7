/**
 * The evaluate phase: each valid stage block through the engine, then the rules.
 * Pure: a block the engine cannot evaluate becomes a fatal message on the file.
 */
import type {VFile} from 'vfile'
import {evaluateStage} from '../engine/index.js'
import type {StageInput, StageResult} from '../engine/types.js'
import type {ParsedNote, StageBlockNode} from '../note/types.js'
import {runRules} from '../rules/index.js'
import type {RuleNote} from '../rules/types.js'

export interface StageEvaluation {
  block: StageBlockNode
  input: StageInput
  result: StageResult
  notes: RuleNote[]
}

/** Evaluate every stage of the note whose block parsed cleanly, in document order. */
export function evaluateNote(parsed: ParsedNote, file: VFile): StageEvaluation[] {
  const out: StageEvaluation[] = []
  for (const block of parsed.stages) {
    if (block.input === null) continue
    try {
      const result = evaluateStage(block.input)
      const notes = runRules({input: block.input, result, context: parsed.meta.context})
      out.push({block, input: block.input, result, notes})
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
