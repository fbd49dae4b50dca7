/**
 * Command-line arguments: the command, its notes and its options. Unknown options are
 * errors with a hint, never ignored.
 */
import {parseArgs} from 'node:util'

export const COMMANDS = ['build', 'check'] as const
export type Command = (typeof COMMANDS)[number]

export interface CliArgs {
  command: Command | 'help' | 'version'
  notes: string[]
  out: string | null
  json: boolean
  debug: boolean
  strict: boolean
}

export class UsageError extends Error {}

export const USAGE = `Usage:
  ampreview build NOTE… [--out DIR]    evaluate each note and write its PDF report
  ampreview check NOTE… [--json]       evaluate and print diagnostics; no PDF
  ampreview --help | --version

NOTE is a Markdown file, or a folder (every *.md directly inside it).

Options:
  --out DIR    write PDFs into DIR instead of next to each note
  --json       (check) print one JSON object on stdout; diagnostics also go to stderr
  --strict     treat warnings as errors
  --debug      print stack traces of internal errors

Exit codes: 0 all requirements met; 1 a requirement not met; 2 a note could not be evaluated.`

export function parseCliArgs(argv: string[]): CliArgs {
  let parsed
  try {
    parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      strict: true,
      options: {
        out: {type: 'string'},
        json: {type: 'boolean', default: false},
        debug: {type: 'boolean', default: false},
        strict: {type: 'boolean', default: false},
        help: {type: 'boolean', short: 'h', default: false},
        version: {type: 'boolean', short: 'v', default: false}
      }
    })
  } catch (error) {
    throw new UsageError(error instanceof Error ? error.message : String(error))
  }
  const {values, positionals} = parsed
  const base = {out: values.out ?? null, json: values.json ?? false, debug: values.debug ?? false, strict: values.strict ?? false}
  if (values.help) return {command: 'help', notes: [], ...base}
  if (values.version) return {command: 'version', notes: [], ...base}
  const [command, ...notes] = positionals
  if (command === undefined) throw new UsageError('Expected a command, `build` or `check`')
  if (!(COMMANDS as readonly string[]).includes(command)) {
    throw new UsageError(`Unexpected command \`${command}\`, expected \`build\` or \`check\``)
  }
  if (notes.length === 0) throw new UsageError(`Expected at least one NOTE after \`${command}\``)
  if (command === 'check' && base.out !== null) throw new UsageError('`--out` goes with `build`, not `check`')
  if (command === 'build' && base.json) throw new UsageError('`--json` goes with `check`, not `build`')
  return {command: command as Command, notes, ...base}
}
