/**
 * Merging the results of several runs (the shards of one batch, DESIGN §8.10) into the
 * result of the whole batch: every note once, in the order a folder or glob batch lists
 * them (sorted by path), and the exit code the whole batch would have had — the highest
 * of the notes': 2 when a note has an error, 1 when a requirement is not met, else 0.
 * Pure; the CLI reads the files.
 */
import type {JsonNote, JsonRun} from './json.js'

export class MergeError extends Error {}

/** The exit code of one note from its result: the rule of the `build` and `check` commands. */
export function noteExitCode(n: Pick<JsonNote, 'diagnostics' | 'stages'>): 0 | 1 | 2 {
  if (n.diagnostics.some((d) => d.severity === 'error')) return 2
  return n.stages.some((s) => s.requirements.some((r) => r.met === false)) ? 1 : 0
}

/** Merge runs given by name (for messages); a note in two runs is an error. */
export function mergeRuns(runs: readonly {name: string; run: JsonRun}[]): {run: JsonRun; exitCode: 0 | 1 | 2} {
  const from = new Map<string, string>()
  const files: JsonNote[] = []
  for (const {name, run} of runs) {
    for (const f of run.files) {
      const earlier = from.get(f.file)
      if (earlier !== undefined) throw new MergeError(`${f.file} is in both ${earlier} and ${name}: merge the results of disjoint shards only`)
      from.set(f.file, name)
      files.push(f)
    }
  }
  // Plain code-unit order, as the batch sorts a folder's or a glob's notes.
  files.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0))
  const exitCode = files.reduce<0 | 1 | 2>((code, f) => Math.max(code, noteExitCode(f)) as 0 | 1 | 2, 0)
  return {run: {files}, exitCode}
}
