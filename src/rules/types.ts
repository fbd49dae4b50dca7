/**
 * What a practice or safety rule returns. Each rule is a pure function of a stage's inputs
 * and results; `src/rules/index.ts` stamps the rule id and runs them in order.
 */
export const SEVERITIES = ['info', 'caution', 'warning', 'safety'] as const
export type Severity = (typeof SEVERITIES)[number]

/** A small table a note carries (e.g. the compensation-resistor comparison). */
export interface NoteTable {
  header: string[]
  rows: string[][]
}

export interface RuleNote {
  /** Rule id, from `src/rules/index.ts`. */
  rule: string
  severity: Severity
  /** One paragraph quoting the numbers that triggered it and what to consider. */
  text: string
  table?: NoteTable
}
