/**
 * What a practice or safety rule returns. Each rule is a pure function of a stage's inputs
 * and results; `src/rules/index.ts` stamps the rule id and runs them in order.
 */
import type {NoteRuleId} from './ids.js'

export const SEVERITIES = ['info', 'caution', 'warning', 'safety'] as const
export type Severity = (typeof SEVERITIES)[number]

/** A small table a note carries (e.g. the compensation-resistor comparison). */
export interface NoteTable {
  header: string[]
  rows: string[][]
}

export interface RuleNote {
  /** Rule id (`src/rules/ids.ts`). */
  rule: NoteRuleId
  severity: Severity
  /** One paragraph quoting the numbers that triggered it and what to consider. */
  text: string
  table?: NoteTable
  /**
   * The author's reason when the stage's `accept:` map accepts this rule (set by
   * src/evaluate, never by a rule): the note is shown as accepted and is no warning.
   */
  accepted?: string
}
