/**
 * The table printed at the end of a batch: note, stages, requirements met / not met,
 * output, time. Plain text columns; the verdict is a word, colour only adds to it.
 */
import {relative} from 'node:path'
import type {BatchItem} from './batch.js'
import {printable} from './diagnostics.js'
import {paint} from './progress.js'

/** The output cell: each file relative to `cwd`, a Markdown report's SVG figures counted rather than listed. */
function outputCell(outputs: string[], cwd: string): string {
  const svgs = outputs.filter((p) => p.endsWith('.svg')).length
  const named = outputs.filter((p) => !p.endsWith('.svg')).map((p) => printable(relative(cwd, p)))
  return [...named, ...(svgs > 0 ? [`${svgs} SVG figure${svgs === 1 ? '' : 's'}`] : [])].join(', ')
}

export function summaryTable(items: BatchItem[], color: boolean, cwd: string): string {
  const rows = items.map((it) => {
    const o = it.outcome
    const result = o.exitCode === 2 ? 'error' : o.exitCode === 1 ? 'NOT MET' : 'met'
    const output = it.upToDate ? `up to date (${outputCell(o.outputs, cwd)})`
      : o.outputs.length > 0 ? outputCell(o.outputs, cwd) : '—'
    return [printable(o.file), o.exitCode === 2 ? '—' : String(it.stages), o.exitCode === 2 ? '—' : `${o.met} / ${o.notMet}`,
      result, output, `${it.seconds.toFixed(2)} s`]
  })
  const header = ['note', 'stages', 'met / not met', 'result', 'output', 'time']
  const RESULT = 3
  const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c]!.length)))
  // Colour is added to the result cell itself, after padding, so the columns stay aligned.
  const line = (r: string[], paintResult: boolean): string => r.map((cell, c) => {
    const padded = cell.padEnd(widths[c]!)
    if (c !== RESULT || !paintResult) return padded
    const code = cell === 'met' ? 32 : cell === 'NOT MET' ? 33 : 31
    return paint(true, code, cell) + padded.slice(cell.length)
  }).join('  ').trimEnd()
  return [line(header, false), ...rows.map((r) => line(r, color))].join('\n') + '\n'
}
