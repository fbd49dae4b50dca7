/**
 * `ampreview compare OLD NEW`: each side is a `--json` result file, a note (evaluated
 * here, no PDF), or `REV:PATH`, a note as it is at a git revision (read with `git show`).
 */
import {execFileSync} from 'node:child_process'
import {mkdtempSync, rmSync, writeFileSync} from 'node:fs'
import {readFile} from 'node:fs/promises'
import {tmpdir} from 'node:os'
import {basename, join} from 'node:path'
import {compareRuns, comparisonText, type RunJson} from '../report/compare.js'
import {noteJson, processNote, type Resources} from './pipeline.js'

export class CompareInputError extends Error {}

async function noteRun(path: string, shownAs: string, res: Resources): Promise<RunJson> {
  const o = await processNote(path, res, {formats: [], outDir: null, strict: false, sourceDateEpoch: undefined})
  if (o.exitCode === 2) {
    const first = o.diagnostics.find((d) => d.severity === 'error')
    throw new CompareInputError(`${shownAs} could not be evaluated${first ? `: ${first.line}:${first.column}: ${first.message}` : ''}`)
  }
  return noteJson({...o, file: shownAs}) as RunJson
}

async function load(side: string, res: Resources): Promise<RunJson> {
  const rev = /^([^:]+):(.+\.md)$/.exec(side)
  if (side.endsWith('.json')) {
    try {
      const parsed = JSON.parse(await readFile(side, 'utf8')) as RunJson
      if (!Array.isArray(parsed.files)) throw new Error('no `files` array')
      return parsed
    } catch (error) {
      throw new CompareInputError(`${side} is not an ampreview result (${error instanceof Error ? error.message : String(error)})`)
    }
  }
  if (rev && !(await readFile(side).then(() => true, () => false))) {
    let text: string
    try {
      text = execFileSync('git', ['show', `${rev[1]}:${rev[2]}`], {encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe']})
    } catch {
      throw new CompareInputError(`git could not show ${rev[2]} at revision ${rev[1]}`)
    }
    const dir = mkdtempSync(join(tmpdir(), 'ampreview-compare-'))
    try {
      const p = join(dir, basename(rev[2]!))
      writeFileSync(p, text)
      return await noteRun(p, side, res)
    } finally {
      rmSync(dir, {recursive: true, force: true})
    }
  }
  return noteRun(side, side, res)
}

/** Prints the comparison; returns the exit code (1 when a verdict went from met to not met). */
export async function compareCommand(oldSide: string, newSide: string, markdown: boolean, res: Resources, out: (s: string) => void): Promise<number> {
  const c = compareRuns(await load(oldSide, res), await load(newSide, res))
  out(comparisonText(c, markdown))
  return c.regressed ? 1 : 0
}
