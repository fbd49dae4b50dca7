/**
 * Diagnostics as the CLI prints them: `FILE:LINE:COLUMN: SEVERITY: MESSAGE`, one a line,
 * in file order, and as the JSON objects of DESIGN §6.
 */
import type {VFile} from 'vfile'
import type {VFileMessage} from 'vfile-message'
import {isNoteRuleId} from '../rules/index.js'

export type DiagnosticSeverity = 'error' | 'warning' | 'info'

/**
 * What a diagnostic is about, so that policy (`--strict`) never reads message text:
 * `input` (the note as written), `note` (a practice or safety rule's note; `rule` is its
 * rule id), `requirement` (a requirement not met), `build` (rendering, writing).
 */
export const DIAGNOSTIC_KINDS = ['input', 'note', 'requirement', 'build'] as const
export type DiagnosticKind = (typeof DIAGNOSTIC_KINDS)[number]

export interface Diagnostic {
  severity: DiagnosticSeverity
  message: string
  line: number
  column: number
  /** The id of what raised it (a rule id, `requirement-not-met`, `unknown-key`, …); null when none. */
  rule: string | null
  kind: DiagnosticKind
}

/** The kind of a message with this rule id. */
export const kindOf = (rule: string | null): DiagnosticKind =>
  rule === null ? 'input' : isNoteRuleId(rule) ? 'note' : rule === 'requirement-not-met' || rule === 'limit-not-met' ? 'requirement' : rule === 'build' ? 'build' : 'input'

/** A diagnostic made by the CLI itself (not from a VFile message). */
export const cliDiagnostic = (severity: DiagnosticSeverity, message: string, rule: string | null = null, kind: DiagnosticKind = kindOf(rule)): Diagnostic =>
  ({severity, message, line: 1, column: 1, rule, kind})

/**
 * `--strict`: every warning becomes an error except an unmet requirement (already exit
 * code 1); chosen by kind, never by the wording. Accepted notes are info, never warnings.
 */
export const strictly = (ds: readonly Diagnostic[]): Diagnostic[] =>
  ds.map((d) => (d.severity === 'warning' && d.kind !== 'requirement' ? {...d, severity: 'error'} : d))

const severityOf = (m: VFileMessage): DiagnosticSeverity => (m.fatal === true ? 'error' : m.fatal === false ? 'warning' : 'info')

/** The file's messages in line/column order (stable for equal places). */
export function diagnosticsOf(file: VFile): Diagnostic[] {
  return file.messages
    .map((m, i) => ({d: {severity: severityOf(m), message: m.reason, line: m.line ?? 1, column: m.column ?? 1, rule: m.ruleId ?? null, kind: kindOf(m.ruleId ?? null)}, i}))
    .sort((a, b) => a.d.line - b.d.line || a.d.column - b.d.column || a.i - b.i)
    .map((x) => x.d)
}

/** C0 and C1 controls, DEL, line and paragraph separators, and bidirectional overrides. */
const CONTROLS = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g
const NAMED: Record<string, string> = {'\n': '\\n', '\r': '\\r', '\t': '\\t'}

/**
 * A path (or any text from a file or its name) as printed: control characters escaped
 * (`\n`, `\x1b`, `\u202e`), so that a file name cannot forge diagnostic lines or colour
 * the terminal. Backslashes themselves are left as they are.
 */
export const printable = (s: string): string => s.replace(CONTROLS, (c) => {
  const code = c.charCodeAt(0)
  return NAMED[c] ?? (code <= 0xff ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u${code.toString(16).padStart(4, '0')}`)
})

/** `FILE:LINE:COLUMN: SEVERITY: MESSAGE [rule-id]`; the id of a rule's note is always printed. */
export const formatDiagnostic = (file: string, d: Diagnostic): string =>
  `${printable(file)}:${d.line}:${d.column}: ${d.severity}: ${printable(d.message.replace(/\s*\n\s*/g, ' '))}${d.kind === 'note' && d.rule !== null ? ` [${d.rule}]` : ''}`

export const hasErrors = (ds: Diagnostic[]): boolean => ds.some((d) => d.severity === 'error')
