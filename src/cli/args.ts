/**
 * Command-line arguments: the command, its operands and its options. Unknown options and
 * options that do not go with the command are errors with a hint, never ignored.
 */
import {parseArgs} from 'node:util'
import {TOPOLOGIES, type Topology} from '../engine/types.js'
import {FORMATS, type Format} from './formats.js'
import {parseShard, type Shard} from './shard.js'

export const COMMANDS = ['build', 'check', 'compare', 'merge', 'new'] as const
export type Command = (typeof COMMANDS)[number]

export interface CliArgs {
  command: Command | 'help' | 'version'
  /** Notes, folders or globs (build, check); the two sides (compare); the file (new). */
  operands: string[]
  out: string | null
  json: boolean
  formats: Format[]
  force: boolean
  quiet: boolean
  watch: boolean
  /** Worker threads; null = one per free core. */
  jobs: number | null
  markdown: boolean
  /** compare: relative change below which a value is left out, a fraction (default 0.001 = 0.1 %). */
  threshold: number
  topology: Topology
  strict: boolean
  /** `--yield`: the Monte Carlo of DESIGN §8.7 on every stage (100k trials unless the stage says). */
  yield: boolean
  debug: boolean
  /** `--shard i/n`: only the notes of shard i of n (build, check). */
  shard: Shard | null
  /** `--alternatives`: every stage with its input-technology alternatives (build, check; DESIGN §8.8). */
  alternatives: boolean
}

export class UsageError extends Error {}

/** compare's default threshold: changes under 0.1 % are rounding, not news. */
export const DEFAULT_THRESHOLD = 0.001

export const USAGE = `Usage:
  ampreview build NOTE… [--out DIR] [--format pdf,json,md] [--force] [--watch] [--shard I/N] [--alternatives]
  ampreview check NOTE… [--json] [--shard I/N] [--alternatives]
  ampreview compare OLD NEW [--markdown] [--threshold P%]
  ampreview merge RESULT.json…
  ampreview new FILE [--topology noninverting|inverting|follower|transimpedance|difference|lowpass-sallen-key|lowpass-mfb|instrumentation]
  ampreview --help | --version

NOTE is a Markdown file, a folder (every *.md inside it, sorted) or a glob ('designs/**/*.md').
OLD and NEW are each a --json result file, a note, or REV:PATH (a note at a git revision).
merge prints one result of the --json results of several shards, with the batch's exit code.

Options:
  --out DIR      write outputs into DIR instead of next to each note
  --format LIST  build outputs, comma-separated: pdf (default), json, md (Markdown + SVG charts)
  --force        rebuild notes even when their outputs are up to date
  --watch        keep running and rebuild a note each time it is saved
  --jobs N       worker threads for a batch, and for a large Monte Carlo (default: one per free core)
  --shard I/N    only the notes of shard I of N (split by a hash of each note's path)
  --alternatives evaluate every stage again with each archetype and amplifier block of its kind
  --json         check: print one JSON object on stdout; diagnostics also go to stderr
  --markdown     compare: print the comparison as Markdown (for a CI comment)
  --threshold P% compare: leave out values that changed by less than P % (default 0.1 %)
  --topology T   new: the stage topology of the starting note (default noninverting)
  --quiet        print only diagnostics
  --strict       treat warnings as errors
  --yield        build, check: Monte Carlo yield on every stage (100k trials unless a stage says)
  --debug        print stack traces of internal errors, and where a large Monte Carlo's trials ran

Exit codes: 0 all requirements met; 1 a requirement not met (compare: a verdict went from
met to not met); 2 a note could not be evaluated or the command was wrong.`

const only = (cmd: Command, option: string, allowed: Command[]): void => {
  if (!allowed.includes(cmd)) throw new UsageError(`\`${option}\` goes with ${allowed.map((c) => `\`${c}\``).join(' or ')}, not \`${cmd}\``)
}

function parseFormats(list: string): Format[] {
  const parts = list.split(',').map((s) => s.trim()).filter((s) => s !== '')
  for (const p of parts) {
    if (!(FORMATS as readonly string[]).includes(p)) throw new UsageError(`Unexpected format \`${p}\`, expected ${FORMATS.join(', ')}`)
  }
  if (parts.length === 0) throw new UsageError('Expected at least one format after `--format`')
  return FORMATS.filter((f) => parts.includes(f))
}

export function parseCliArgs(argv: string[]): CliArgs {
  let parsed
  try {
    parsed = parseArgs({
      args: argv, allowPositionals: true, strict: true,
      options: {
        out: {type: 'string'}, format: {type: 'string'}, jobs: {type: 'string'}, topology: {type: 'string'},
        json: {type: 'boolean'}, force: {type: 'boolean'}, quiet: {type: 'boolean', short: 'q'}, watch: {type: 'boolean'},
        markdown: {type: 'boolean'}, threshold: {type: 'string'}, strict: {type: 'boolean'}, yield: {type: 'boolean'}, debug: {type: 'boolean'}, shard: {type: 'string'},
        alternatives: {type: 'boolean'},
        help: {type: 'boolean', short: 'h'}, version: {type: 'boolean', short: 'v'}
      }
    })
  } catch (error) {
    throw new UsageError(error instanceof Error ? error.message : String(error))
  }
  const {values: v, positionals} = parsed
  const [first, ...operands] = positionals
  const command: CliArgs['command'] = v.help ? 'help' : v.version ? 'version' : (first as Command)
  const args: CliArgs = {
    command, operands, out: v.out ?? null, json: v.json ?? false, formats: ['pdf'], force: v.force ?? false,
    quiet: v.quiet ?? false, watch: v.watch ?? false, jobs: null, markdown: v.markdown ?? false, threshold: DEFAULT_THRESHOLD,
    topology: 'noninverting', strict: v.strict ?? false, yield: v.yield ?? false, debug: v.debug ?? false, shard: null,
    alternatives: v.alternatives ?? false
  }
  if (command === 'help' || command === 'version') return args
  if (first === undefined) throw new UsageError('Expected a command: build, check, compare, merge or new')
  if (!(COMMANDS as readonly string[]).includes(first)) {
    throw new UsageError(`Unexpected command \`${first}\`, expected one of ${COMMANDS.join(', ')}`)
  }
  const cmd = first as Command
  if (v.out !== undefined) only(cmd, '--out', ['build'])
  if (v.format !== undefined) { only(cmd, '--format', ['build']); args.formats = parseFormats(v.format) }
  if (v.force) only(cmd, '--force', ['build'])
  if (v.watch) only(cmd, '--watch', ['build'])
  if (v.json) only(cmd, '--json', ['check'])
  if (v.alternatives) only(cmd, '--alternatives', ['build', 'check'])
  if (v.markdown) only(cmd, '--markdown', ['compare'])
  if (v.threshold !== undefined) {
    only(cmd, '--threshold', ['compare'])
    const m = /^\s*(\d+(?:\.\d+)?)\s*%\s*$/.exec(v.threshold)
    if (m === null) throw new UsageError(`Unexpected \`--threshold ${v.threshold}\`, expected a percentage such as \`1%\``)
    args.threshold = Number(m[1]) / 100
  }
  if (v.jobs !== undefined) {
    only(cmd, '--jobs', ['build', 'check'])
    if (!/^[1-9]\d*$/.test(v.jobs)) throw new UsageError(`Unexpected \`--jobs ${v.jobs}\`, expected a whole number ≥ 1`)
    args.jobs = Number(v.jobs)
  }
  if (v.shard !== undefined) {
    only(cmd, '--shard', ['build', 'check'])
    const shard = parseShard(v.shard)
    if (shard === null) throw new UsageError(`Unexpected \`--shard ${v.shard}\`, expected I/N with 1 ≤ I ≤ N, e.g. \`--shard 2/8\``)
    if (v.watch) throw new UsageError('`--shard` does not go with `--watch`')
    args.shard = shard
  }
  if (v.topology !== undefined) {
    only(cmd, '--topology', ['new'])
    if (!(TOPOLOGIES as readonly string[]).includes(v.topology)) {
      throw new UsageError(`Unexpected topology \`${v.topology}\`, expected one of ${TOPOLOGIES.join(', ')}`)
    }
    args.topology = v.topology as Topology
  }
  if ((cmd === 'build' || cmd === 'check') && operands.length === 0) throw new UsageError(`Expected at least one NOTE after \`${cmd}\``)
  if (cmd === 'compare' && operands.length !== 2) throw new UsageError('Expected two operands after `compare`: OLD NEW')
  if (cmd === 'merge' && operands.length === 0) throw new UsageError('Expected at least one RESULT.json after `merge`')
  if (cmd === 'new' && operands.length !== 1) throw new UsageError('Expected one FILE after `new`')
  return args
}
