#!/usr/bin/env node
/**
 * The `ampreview` command: arguments, the notes to process, output to stdout/stderr and
 * the exit code (the highest of the notes': 0 met, 1 not met, 2 not evaluated).
 * No stack trace unless --debug.
 */
import {readdir, stat} from 'node:fs/promises'
import {join} from 'node:path'
import {parseCliArgs, USAGE, UsageError, type CliArgs} from './args.js'
import {formatDiagnostic} from './diagnostics.js'
import {jsonStage, toJson} from '../report/json.js'
import {processNote, type NoteOutcome, type Resources} from './pipeline.js'
import {loadFonts, toolVersion} from './resources.js'

/** Files as given; a folder stands for the *.md files directly inside it, sorted. */
async function expandNotes(args: string[]): Promise<string[]> {
  const out: string[] = []
  for (const a of args) {
    const s = await stat(a).catch(() => null)
    if (s?.isDirectory()) {
      const names = (await readdir(a)).filter((n) => n.toLowerCase().endsWith('.md')).sort()
      out.push(...names.map((n) => join(a, n)))
    } else {
      out.push(a)
    }
  }
  return out
}

async function run(args: CliArgs): Promise<number> {
  const version = await toolVersion()
  if (args.command === 'help') { process.stdout.write(`${USAGE}\n`); return 0 }
  if (args.command === 'version') { process.stdout.write(`ampreview ${version}\n`); return 0 }
  const res: Resources = {fonts: await loadFonts(), version, templates: new Map()}
  const notes = await expandNotes(args.notes)
  if (notes.length === 0) { process.stderr.write('ampreview: no notes found (a folder needs *.md files)\n'); return 2 }
  const outcomes: NoteOutcome[] = []
  for (const note of notes) {
    const o = await processNote(note, res, {
      pdf: args.command === 'build', outDir: args.out, strict: args.strict, sourceDateEpoch: process.env['SOURCE_DATE_EPOCH']
    }).catch((error: unknown): NoteOutcome => {
      if (args.debug && error instanceof Error && error.stack) process.stderr.write(`${error.stack}\n`)
      return {file: note, sourceSha256: '', evaluations: [], exitCode: 2, output: null,
        diagnostics: [{severity: 'error', message: `internal error: ${error instanceof Error ? error.message : String(error)}`, line: 1, column: 1}]}
    })
    outcomes.push(o)
    for (const d of o.diagnostics) process.stderr.write(`${formatDiagnostic(o.file, d)}\n`)
    if (args.command === 'build') {
      process.stdout.write(o.output !== null ? `${o.output}\n` : '')
      if (o.output === null) process.stderr.write(`${o.file}: no PDF written (errors above)\n`)
    }
  }
  if (args.json) {
    process.stdout.write(`${toJson({
      files: outcomes.map((o) => ({
        file: o.file, sourceSha256: o.sourceSha256,
        diagnostics: o.diagnostics.map((d) => ({severity: d.severity, message: d.message, line: d.line, column: d.column})),
        stages: o.evaluations.map(jsonStage)
      }))
    })}\n`)
  } else if (args.command === 'check') {
    for (const o of outcomes) {
      const verdict = o.exitCode === 2 ? 'not evaluated' : o.exitCode === 1 ? 'requirement not met' : 'all requirements met'
      process.stdout.write(`${o.file}: ${o.evaluations.length} stage(s), ${verdict}\n`)
    }
  }
  return Math.max(0, ...outcomes.map((o) => o.exitCode))
}

const argv = process.argv.slice(2)
const debug = argv.includes('--debug')
try {
  process.exitCode = await run(parseCliArgs(argv))
} catch (error) {
  if (error instanceof UsageError) {
    process.stderr.write(`ampreview: ${error.message}\n\n${USAGE}\n`)
    process.exitCode = 2
  } else {
    process.stderr.write(`ampreview: internal error: ${error instanceof Error ? error.message : String(error)}\n`)
    if (debug && error instanceof Error && error.stack) process.stderr.write(`${error.stack}\n`)
    process.exitCode = 2
  }
}
