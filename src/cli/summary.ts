/**
 * The table printed at the end of a batch: note, stages, requirements met / not met,
 * output, time. Plain text columns; the verdict is a word, colour only adds to it.
 */
import {relative} from 'node:path'
import type {BatchItem} from './batch.js'
import {paint} from './progress.js'

export function summaryTable(items: BatchItem[], color: boolean, cwd: string): string {
  const rows = items.map((it) => {
    const o = it.outcome
    const result = o.exitCode === 2 ? 'error' : o.exitCode === 1 ? 'NOT MET' : 'met'
    const output = it.upToDate ? `up to date (${o.outputs.map((p) => relative(cwd, p)).join(', ')})`
      : o.outputs.length > 0 ? o.outputs.map((p) => relative(cwd, p)).join(', ') : '—'
    return [o.file, o.exitCode === 2 ? '—' : String(it.stages), o.exitCode === 2 ? '—' : `${o.met} / ${o.notMet}`,
      result, output, `${it.seconds.toFixed(2)} s`]
  })
  const header = ['note', 'stages', 'met / not met', 'result', 'output', 'time']
  const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c]!.length)))
  const line = (r: string[]): string => r.map((cell, c) => cell.padEnd(widths[c]!)).join('  ').trimEnd()
  const body = rows.map((r) => {
    const text = line(r)
    const code = r[3] === 'met' ? 32 : r[3] === 'NOT MET' ? 33 : 31
    return color ? text.replace(r[3]!.padEnd(widths[3]!), paint(true, code, r[3]!.padEnd(widths[3]!))) : text
  })
  return [line(header), ...body].join('\n') + '\n'
}
