#!/usr/bin/env node
/**
 * The `ampreview` command: arguments, the notes to process, output (results on stdout,
 * diagnostics and progress on stderr) and the exit code — the highest of the notes':
 * 0 met, 1 not met, 2 not evaluated. No stack trace unless --debug.
 */
import {parseCliArgs, USAGE, UsageError, type CliArgs} from './args.js'
import {printable} from './diagnostics.js'
import {runBatch} from './batch.js'
import {CompareInputError, compareCommand} from './compare.js'
import {mergeCommand} from './merge.js'
import {MergeError} from '../results/merge.js'
import {inShard} from './shard.js'
import {expandNotes} from './inputs.js'
import {noteJson, type Resources, type RunOptions} from './pipeline.js'
import {Progress, useColor} from './progress.js'
import {lazyFonts, templatesHash, toolVersion} from './resources.js'
import {scaffoldNote} from './scaffold.js'
import {summaryTable} from './summary.js'
import {watchNotes} from './watch.js'
import {toJson} from '../results/json.js'

const out = (s: string): void => { process.stdout.write(s) }
const err = (s: string): void => { process.stderr.write(s) }

async function run(args: CliArgs, abort: AbortController): Promise<number> {
  const version = await toolVersion()
  if (args.command === 'help') { out(`${USAGE}\n`); return 0 }
  if (args.command === 'version') { out(`ampreview ${version}\n`); return 0 }
  if (args.command === 'new') {
    out(`${await scaffoldNote(args.operands[0]!, args.topology)}\n`)
    return 0
  }
  const res: Resources = {fonts: lazyFonts(), version, templates: new Map()}
  if (args.command === 'compare') return compareCommand(args.operands[0]!, args.operands[1]!, args.markdown, res, out)

  if (args.command === 'merge') return mergeCommand(args.operands, out)

  const all = await expandNotes(args.operands)
  const notes = args.shard === null ? all : inShard(all, args.shard)
  const runOpts: RunOptions = {
    formats: args.command === 'build' ? args.formats : [], outDir: args.out, strict: args.strict,
    sourceDateEpoch: process.env['SOURCE_DATE_EPOCH']
  }
  if (args.watch) {
    await watchNotes(notes, res, runOpts, {out, err}, abort.signal)
    return 0
  }
  const tty = process.stderr.isTTY === true
  const color = useColor(tty, process.env)
  const progress = new Progress(notes.length, {tty, color, quiet: args.quiet || args.json, write: err})
  const items = await runBatch(notes, res, {
    run: runOpts, force: args.force, jobs: args.jobs, templateHash: args.command === 'build' ? await templatesHash() : '', progress, writeErr: err,
    interrupted: () => abort.signal.aborted
  })
  if (args.json) {
    out(`${toJson({files: items.map((it) => noteJson(it.outcome))})}\n`)
  } else if (!args.quiet) {
    out(summaryTable(items, useColor(process.stdout.isTTY === true, process.env), process.cwd()))
  }
  const code = Math.max(0, ...items.map((it) => it.outcome.exitCode))
  return abort.signal.aborted ? Math.max(code, 130) : code
}

const argv = process.argv.slice(2)
const debug = argv.includes('--debug')
const abort = new AbortController()
// First Ctrl-C, or SIGTERM (how CI cancels a job): finish the notes under way (no partial
// files), start no more, exit 130. A second signal: leave now.
const interrupt = (): void => {
  if (abort.signal.aborted) process.exit(130)
  abort.abort()
  err('\nampreview: interrupted; finishing the notes under way (Ctrl-C again to stop at once)\n')
}
process.on('SIGINT', interrupt)
process.on('SIGTERM', interrupt)
try {
  process.exitCode = await run(parseCliArgs(argv), abort)
} catch (error) {
  if (error instanceof UsageError) {
    err(`ampreview: ${printable(error.message)}\n\n${USAGE}\n`)
  } else if (error instanceof CompareInputError || error instanceof MergeError) {
    err(`ampreview: ${printable(error.message)}\n`)
  } else {
    err(`ampreview: ${printable(error instanceof Error ? error.message : String(error))}\n`)
    if (debug && error instanceof Error && error.stack) err(`${error.stack}\n`)
  }
  process.exitCode = 2
}
