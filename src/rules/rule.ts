/**
 * The shape of one practice or safety rule, and what it is given.
 *
 * A rule is a pure function of one evaluated stage and the document's hazard contexts: no
 * I/O, clock, randomness or environment. It returns plain findings; `src/rules/index.ts`
 * stamps the rule id on each and keeps the rules in order.
 */
import type {StageInput, StageResult} from '../engine/types.js'
import type {HazardContext} from '../note/types.js'
import type {RuleNote} from './types.js'

/** Everything a rule may look at. */
export interface RuleContext {
  /** The stage as evaluated (SI, defaults applied). */
  input: StageInput
  /** The engine's result for `input`. */
  result: StageResult
  /** Hazard contexts from the note's front matter (may be empty). */
  context: readonly HazardContext[]
}

/** A note before its rule id is stamped on. */
export type RuleFinding = Omit<RuleNote, 'rule'>

/** One rule: its id (kebab-case, ours) and its check. */
export interface Rule<Id extends string = string> {
  id: Id
  /**
   * Findings for one stage; an empty array when the rule has nothing to say.
   */
  check(ctx: RuleContext): RuleFinding[]
}
