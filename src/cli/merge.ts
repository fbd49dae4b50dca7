/**
 * `ampreview merge RESULT.json…`: the `--json` results of the shards of one batch
 * (`check --json --shard i/n`) as one result on stdout, with the exit code the whole
 * batch would have had (src/results/merge.ts).
 */
import {readFile} from 'node:fs/promises'
import {mergeRuns} from '../results/merge.js'
import {toJson, type JsonRun} from '../results/json.js'
import {CompareInputError, resultProblem} from './compare.js'

async function readRun(path: string): Promise<JsonRun> {
  try {
    const parsed: unknown = JSON.parse(await readFile(path, 'utf8'))
    const problem = resultProblem(parsed)
    if (problem !== null) throw new Error(problem)
    for (const [i, f] of (parsed as {files: Record<string, unknown>[]}).files.entries()) {
      if (!Array.isArray(f['diagnostics'])) throw new Error(`files[${i}] has no \`diagnostics\``)
    }
    return parsed as JsonRun
  } catch (error) {
    throw new CompareInputError(`${path} is not an ampreview result (${error instanceof Error ? error.message : String(error)})`)
  }
}

/** Prints the merged result; returns its exit code. */
export async function mergeCommand(paths: readonly string[], out: (s: string) => void): Promise<number> {
  const runs = await Promise.all(paths.map(async (name) => ({name, run: await readRun(name)})))
  const merged = mergeRuns(runs)
  out(`${toJson(merged.run)}\n`)
  return merged.exitCode
}
