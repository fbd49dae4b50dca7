/**
 * The `ampreview` command as a function: arguments in; results and diagnostics written
 * through `io`; the exit code out (the highest of the notes': 0 met, 1 not met, 2 not
 * evaluated). It reads the environment and the terminal state only through `io` and never
 * exits the process, so the tests can run it in-process; `index.ts` is the executable.
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
import {buildId, lazyFaces, lazyFonts, templatesHash, toolVersion} from './resources.js'
import {scaffoldNote} from './scaffold.js'
import {summaryTable} from './summary.js'
import {watchNotes} from './watch.js'
import {freeCores} from './pool.js'
import {trialThreads} from './trials.js'
import {toJson} from '../results/json.js'


/** What the command sees of its process. */
export interface CliIO {
  out: (s: string) => void
  err: (s: string) => void
  env: NodeJS.ProcessEnv
  stdoutTTY: boolean
  stderrTTY: boolean
}

async function run(args: CliArgs, abort: AbortController, io: CliIO): Promise<number> {
  const {out, err} = io
  const version = await toolVersion()
  if (args.command === 'help') { out(`${USAGE}\n`); return 0 }
  if (args.command === 'version') { out(`ampreview ${version}\n`); return 0 }
  if (args.command === 'new') {
    out(`${await scaffoldNote(args.operands[0]!, args.topology)}\n`)
    return 0
  }
  const fonts = lazyFonts()
  // Large Monte Carlos of the notes evaluated in this thread spread over the free cores (or `--jobs`).
  const threads = trialThreads(args.jobs ?? freeCores())
  const res: Resources = {fonts, faces: lazyFaces(fonts), version, buildId: await buildId(), templates: new Map(), spread: threads.spread}
  try {
    return await runCommand(args, abort, io, res)
  } finally {
    const p = threads.parts()
    if (args.debug && p.threads + p.here > 0) {
      const why = threads.stopped()
      err(`ampreview: Monte Carlo trial parts: ${p.threads} on trial threads, ${p.here} in the main thread${why === null ? '' : `; later runs stayed in the main thread: ${why}`}\n`)
    }
    await threads.close()
  }
}

async function runCommand(args: CliArgs, abort: AbortController, io: CliIO, res: Resources): Promise<number> {
  const {out, err} = io
  if (args.command === 'compare') return compareCommand(args.operands[0]!, args.operands[1]!, args.markdown, res, out, args.threshold)

  if (args.command === 'merge') return mergeCommand(args.operands, out)

  const all = await expandNotes(args.operands)
  const notes = args.shard === null ? all : inShard(all, args.shard)
  const runOpts: RunOptions = {
    formats: args.command === 'build' ? args.formats : [], outDir: args.out, strict: args.strict, yield: args.yield,
    sourceDateEpoch: io.env['SOURCE_DATE_EPOCH'], alternatives: args.alternatives
  }
  if (args.watch) {
    await watchNotes(notes, res, runOpts, {out, err}, abort.signal)
    return 0
  }
  const tty = io.stderrTTY
  const color = useColor(tty, io.env)
  const progress = new Progress(notes.length, {tty, color, quiet: args.quiet || args.json, write: err})
  const items = await runBatch(notes, res, {
    run: runOpts, force: args.force, jobs: args.jobs, templateHash: args.command === 'build' ? await templatesHash() : '', progress, writeErr: err,
    interrupted: () => abort.signal.aborted
  })
  if (args.json) {
    out(`${toJson({files: items.map((it) => noteJson(it.outcome))})}\n`)
  } else if (!args.quiet) {
    out(summaryTable(items, useColor(io.stdoutTTY, io.env), process.cwd()))
  }
  const code = Math.max(0, ...items.map((it) => it.outcome.exitCode))
  return abort.signal.aborted ? Math.max(code, 130) : code
}

/** Run the command with `argv` (without `node` and the script); resolves with the exit code. */
export async function main(argv: string[], io: CliIO, abort: AbortController = new AbortController()): Promise<number> {
  const debug = argv.includes('--debug')
  const {err} = io
  try {
    return await run(parseCliArgs(argv), abort, io)
  } catch (error) {
    if (error instanceof UsageError) {
      err(`ampreview: ${printable(error.message)}\n\n${USAGE}\n`)
    } else if (error instanceof CompareInputError || error instanceof MergeError) {
      err(`ampreview: ${printable(error.message)}\n`)
    } else {
      err(`ampreview: ${printable(error instanceof Error ? error.message : String(error))}\n`)
      if (debug && error instanceof Error && error.stack) err(`${error.stack}\n`)
    }
    return 2
  }
}
