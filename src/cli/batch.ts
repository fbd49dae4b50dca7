/**
 * A batch of notes: each one either up to date in its output folder's cache or processed
 * (in-thread or on the worker pool), with progress as notes finish. Stops handing out new
 * notes on SIGINT and lets the ones under way finish, so no partial file is left behind.
 */
import {readFile} from 'node:fs/promises'
import {dirname, resolve} from 'node:path'
import {BuildCache, buildKey, imageInputsHash} from './cache.js'
import {formatDiagnostic} from './diagnostics.js'
import {failedOutcome, outputFile, outputPath, type NoteOutcome, type Resources, type RunOptions} from './pipeline.js'
import {runnerFor} from './pool.js'
import type {Progress} from './progress.js'

export interface BatchItem {
  outcome: NoteOutcome
  /** True when the cache said the outputs were up to date. */
  upToDate: boolean
  seconds: number
  /** Stages evaluated (from the cache when up to date). */
  stages: number
}

export interface BatchOptions {
  run: RunOptions
  force: boolean
  jobs: number | null
  /** Hash of the template folder, part of each cache key. */
  templateHash: string
  progress: Progress
  writeErr: (s: string) => void
  /** Set when the user interrupts: no new note starts. */
  interrupted: () => boolean
}

const statusWord = (o: NoteOutcome): string => (o.exitCode === 2 ? 'error' : o.exitCode === 1 ? 'not met' : 'ok')

/**
 * Why a note must not be built with these options, if so: one of its outputs would replace
 * a note of the batch (a note named `<name>.review.md` beside `<name>.md` built with `--format md`), or would be the
 * same file as an earlier note's output (notes of the same name built into one `--out`).
 */
export function outputClashes(notes: readonly string[], run: RunOptions): (string | null)[] {
  const outDir = run.outDir === null ? null : resolve(run.outDir)
  const sources = new Map(notes.map((n) => [resolve(n), n]))
  const claimed = new Map<string, string>()
  return notes.map((note) => {
    const outputs = run.formats.map((f) => outputFile(note, outDir, f))
    const source = outputs.map((o) => sources.get(o)).find((s) => s !== undefined)
    if (source !== undefined) {
      return `Not built: its output would replace the note ${source}; build it with \`--out DIR\` into another folder`
    }
    const earlier = outputs.map((o) => claimed.get(o)).find((e) => e !== undefined)
    if (earlier !== undefined) return `Not built: its output files would be the same as those of ${earlier}; build notes of the same name into different \`--out\` folders`
    for (const o of outputs) claimed.set(o, note)
    return null
  })
}

export async function runBatch(notes: string[], res: Resources, b: BatchOptions): Promise<BatchItem[]> {
  const building = b.run.formats.length > 0
  const caches = new Map<string, Promise<BuildCache>>()
  const cacheFor = (note: string): Promise<BuildCache> => {
    const dir = dirname(outputPath(note, b.run.outDir === null ? null : resolve(b.run.outDir), 'pdf'))
    let c = caches.get(dir)
    if (!c) { c = BuildCache.open(dir); caches.set(dir, c) }
    return c
  }
  // The path as given is part of the key: the JSON output records it.
  const optionsOf = (note: string): string =>
    JSON.stringify({formats: b.run.formats, strict: b.run.strict, epoch: b.run.sourceDateEpoch ?? null, file: note})
  const wantPdf = b.run.formats.includes('pdf')
  const clashes = building ? outputClashes(notes, b.run) : notes.map(() => null)
  const runner = runnerFor(notes.length, b.jobs, res, building)
  const items: (BatchItem | null)[] = notes.map(() => null)
  try {
    let nextIndex = 0
    const one = async (note: string, i: number): Promise<void> => {
      const t0 = performance.now()
      const clash = clashes[i] ?? null
      const key = building && clash === null
        ? await readFile(note).then(async (source) => buildKey({
          source, template: b.templateHash, version: res.version, options: optionsOf(note),
          inputs: wantPdf ? await imageInputsHash(source, note) : ''
        }), () => null)
        : null
      const cache = building && clash === null ? await cacheFor(note) : null
      const hit = key !== null && cache !== null && !b.force ? await cache.hit(resolve(note), key) : null
      let item: BatchItem
      if (clash !== null) {
        item = {upToDate: false, stages: 0, seconds: 0, outcome: failedOutcome(note, clash)}
      } else if (hit) {
        item = {upToDate: true, stages: hit.stages, seconds: (performance.now() - t0) / 1000, outcome: {
          file: note, sourceSha256: '', diagnostics: [], stages: [], met: hit.met, notMet: hit.notMet, exitCode: hit.exitCode, outputs: hit.outputs
        }}
      } else if (b.interrupted()) {
        item = {upToDate: false, stages: 0, seconds: 0, outcome: failedOutcome(note, 'not processed: the batch was interrupted')}
      } else {
        // An internal failure of one note (a bug) must not take the rest of the batch down.
        const outcome = await runner.run(note, b.run).catch((error: unknown) =>
          failedOutcome(note, `internal error: ${error instanceof Error ? error.message : String(error)}`))
        item = {upToDate: false, stages: outcome.stages.length, seconds: (performance.now() - t0) / 1000, outcome}
        if (cache !== null && key !== null) {
          await cache.set(resolve(note), outcome.exitCode === 2 ? null : {
            key, outputs: outcome.outputs, exitCode: outcome.exitCode, stages: outcome.stages.length, met: outcome.met, notMet: outcome.notMet
          })
        }
      }
      items[i] = item
      b.progress.clear()
      for (const d of item.outcome.diagnostics) b.writeErr(`${formatDiagnostic(note, d)}\n`)
      b.progress.note(note, item.upToDate ? 'up to date' : statusWord(item.outcome), item.seconds)
    }
    // As many lanes as the runner has threads: each lane takes the next note when free.
    const lane = async (): Promise<void> => {
      while (nextIndex < notes.length) {
        const i = nextIndex++
        await one(notes[i]!, i)
      }
    }
    await Promise.all(Array.from({length: runner.size}, lane))
  } finally {
    await runner.close()
  }
  return items.map((x, i) => x ?? {upToDate: false, stages: 0, seconds: 0, outcome: failedOutcome(notes[i]!, 'not processed')})
}
