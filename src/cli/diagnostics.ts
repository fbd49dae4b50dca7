/**
 * Diagnostics as the CLI prints them: `FILE:LINE:COLUMN: SEVERITY: MESSAGE`, one a line,
 * in file order, and as the JSON objects of DESIGN §6.
 */
import type {VFile} from 'vfile'
import type {VFileMessage} from 'vfile-message'

export type DiagnosticSeverity = 'error' | 'warning' | 'info'

export interface Diagnostic {
  severity: DiagnosticSeverity
  message: string
  line: number
  column: number
}

const severityOf = (m: VFileMessage): DiagnosticSeverity => (m.fatal === true ? 'error' : m.fatal === false ? 'warning' : 'info')

/** The file's messages in line/column order (stable for equal places). */
export function diagnosticsOf(file: VFile): Diagnostic[] {
  return file.messages
    .map((m, i) => ({d: {severity: severityOf(m), message: m.reason, line: m.line ?? 1, column: m.column ?? 1}, i}))
    .sort((a, b) => a.d.line - b.d.line || a.d.column - b.d.column || a.i - b.i)
    .map((x) => x.d)
}

export const formatDiagnostic = (file: string, d: Diagnostic): string =>
  `${file}:${d.line}:${d.column}: ${d.severity}: ${d.message.replace(/\s*\n\s*/g, ' ')}`

export const hasErrors = (ds: Diagnostic[]): boolean => ds.some((d) => d.severity === 'error')
