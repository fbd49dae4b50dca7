/**
 * `ampreview compare OLD NEW`: each side is a `--json` result file, a note (evaluated
 * here, no PDF), or `REV:PATH`, a note as it is at a git revision (read with `git show`).
 */
import {execFileSync} from 'node:child_process'
import {readFile} from 'node:fs/promises'
import {isAbsolute, relative} from 'node:path'
import {compareRuns, comparisonText, type RunJson} from '../results/compare.js'
import {noteJson} from '../results/json.js'
import {noteResources, readNote, runNote, type NoteOutcome, type NoteResources, type Resources} from './pipeline.js'

export class CompareInputError extends Error {}

const notEvaluated = (shownAs: string, o: NoteOutcome): CompareInputError => {
  const first = o.diagnostics.find((d) => d.severity === 'error')
  return new CompareInputError(`${shownAs} could not be evaluated${first ? `: ${first.line}:${first.column}: ${first.message}` : ''}`)
}

/** Evaluate a note's bytes (no output formats) as one run, shown as `shownAs`. */
async function noteRun(bytes: Uint8Array, shownAs: string, res: NoteResources): Promise<RunJson> {
  const o: NoteOutcome = (await runNote(bytes, shownAs, res, {formats: [], strict: false, sourceDateEpoch: undefined})).outcome
  if (o.exitCode === 2) throw notEvaluated(shownAs, o)
  // One run of one note, as `check --json` prints it.
  return {files: [noteJson(o)]}
}

/** What is wrong with a parsed result file, if anything: the fields a comparison reads. */
export function resultProblem(x: unknown): string | null {
  const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v)
  if (!isObject(x) || !Array.isArray(x['files'])) return 'no `files` array'
  for (const [i, f] of x['files'].entries()) {
    if (!isObject(f) || typeof f['file'] !== 'string' || !Array.isArray(f['stages'])) return `files[${i}] has no \`file\` and \`stages\``
    for (const [j, st] of f['stages'].entries()) {
      const where = `files[${i}].stages[${j}]`
      if (!isObject(st) || typeof st['id'] !== 'string') return `${where} has no \`id\``
      for (const k of ['dc', 'noise', 'stability']) if (!isObject(st[k])) return `${where} has no \`${k}\` object`
      if (!Array.isArray(st['requirements']) || !Array.isArray((st['dc'] as Record<string, unknown>)['contributors']) ||
        !Array.isArray((st['noise'] as Record<string, unknown>)['contributors'])) return `${where} lacks its requirements or contributors`
    }
  }
  return null
}

/**
 * The commit a `REV` of `REV:PATH` names, as a full id: refused when it starts with `-`
 * (git would read an option, such as `--output=FILE`), resolved with `git rev-parse
 * --verify --end-of-options REV^{commit}` so that nothing but a commit gets through.
 */
function resolveCommit(rev: string): string {
  if (rev.startsWith('-')) throw new CompareInputError(`The revision \`${rev}\` of \`${rev}:PATH\` starts with \`-\`: give a branch, tag or commit`)
  try {
    const id = execFileSync('git', ['rev-parse', '--verify', '--quiet', '--end-of-options', `${rev}^{commit}`], {encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe']}).trim()
    if (/^[0-9a-f]{40,64}$/.test(id)) return id
  } catch {
    // Not a commit, or not a git repository: said below.
  }
  throw new CompareInputError(`The revision \`${rev}\` is not a commit of the git repository here (\`git rev-parse --verify ${rev}^{commit}\` found none)`)
}

/** `PATH` of `REV:PATH` as git reads it: relative to the working folder, like every other operand. */
const gitPath = (path: string): string => {
  const rel = isAbsolute(path) ? relative(process.cwd(), path) : path
  return rel.startsWith('./') || rel.startsWith('../') ? rel : `./${rel}`
}

async function load(side: string, res: Resources): Promise<RunJson> {
  const rev = /^([^:]+):(.+\.md)$/.exec(side)
  if (side.endsWith('.json')) {
    try {
      const parsed: unknown = JSON.parse(await readFile(side, 'utf8'))
      const problem = resultProblem(parsed)
      if (problem !== null) throw new Error(problem)
      return parsed as RunJson
    } catch (error) {
      throw new CompareInputError(`${side} is not an ampreview result (${error instanceof Error ? error.message : String(error)})`)
    }
  }
  if (rev && !(await readFile(side).then(() => true, () => false))) {
    const commit = resolveCommit(rev[1]!)
    let bytes: Uint8Array
    try {
      // `git show` takes one `REV:PATH` object name (no `--` before it): it is built from the
      // resolved commit id and a `./`-led path, after `--end-of-options`, so no part of the
      // operand as written can read as an option.
      bytes = new Uint8Array(execFileSync('git', ['show', '--end-of-options', `${commit}:${gitPath(rev[2]!)}`], {stdio: ['ignore', 'pipe', 'pipe'], maxBuffer: 64 * 1024 * 1024}))
    } catch (error) {
      const why = (error as {stderr?: unknown}).stderr
      const first = why instanceof Uint8Array || typeof why === 'string' ? why.toString().trim().split('\n')[0] : ''
      throw new CompareInputError(`git could not show ${rev[2]} at revision ${rev[1]}${first ? ` (${first})` : ''}`)
    }
    // Straight from git's output: no temporary file. Images are never needed (no PDF).
    return noteRun(bytes, side, noteResources(rev[2]!, res))
  }
  const read = await readNote(side, res)
  if (!read.ok) throw notEvaluated(side, read.outcome)
  return noteRun(read.bytes, side, read.resources)
}

/** Prints the comparison; returns the exit code (1 when a verdict went from met to not met). */
export async function compareCommand(oldSide: string, newSide: string, markdown: boolean, res: Resources, out: (s: string) => void, threshold = 0.001): Promise<number> {
  const c = compareRuns(await load(oldSide, res), await load(newSide, res), {threshold})
  out(comparisonText(c, markdown))
  return c.regressed ? 1 : 0
}
