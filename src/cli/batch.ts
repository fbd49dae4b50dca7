/**
 * A batch of notes: each one either up to date in its output folder's cache or processed
 * (in-thread or on the worker pool), with progress as notes finish. Stops handing out new
 * notes on SIGINT and lets the ones under way finish, so no partial file is left behind.
 */
import {lstat, readFile} from 'node:fs/promises'
import {basename, dirname, resolve} from 'node:path'
import {BuildCache, buildKey, CACHE_FILE, resultDigest, type CacheEntry} from './cache.js'
import {formatDiagnostic} from './diagnostics.js'
import {imagesUnchanged} from './images.js'
import {failedOutcome, noteResources, outputFile, outputPath, runNote, type NoteOutcome, type Resources, type RunOptions} from './pipeline.js'
import {removeStaleTemporaries} from './write.js'
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
    const cache = outputs.find((o) => basename(o) === CACHE_FILE)
    if (cache !== undefined) return `Not built: its output ${cache} would replace the build cache; rename the note or build it with \`--out DIR\``
    for (const o of outputs) claimed.set(o, note)
    return null
  })
}

/**
 * Why a note's outputs must not be written over what is there, if so: an existing file at
 * one of its output paths that this folder's cache does not record as written by this
 * note (a hand-written file, or another note's output). `--force` replaces them anyway.
 */
async function foreignOutputs(note: string, outputs: readonly string[], cache: BuildCache): Promise<string | null> {
  const self = resolve(note)
  for (const o of outputs) {
    if (!(await lstat(o).then(() => true, () => false))) continue
    const owner = cache.ownerOf(o)
    if (owner === self) continue
    return owner === null
      ? `Not built: ${o} exists and was not written by ampreview for this note; remove it, build into another folder with \`--out DIR\`, or replace it with \`--force\``
      : `Not built: ${o} is the output of ${owner}; build notes of the same name into different \`--out\` folders`
  }
  return null
}

export async function runBatch(notes: string[], res: Resources, b: BatchOptions): Promise<BatchItem[]> {
  const building = b.run.formats.length > 0
  const outDir = b.run.outDir === null ? null : resolve(b.run.outDir)
  const caches = new Map<string, Promise<BuildCache>>()
  const cacheFor = (note: string): Promise<BuildCache> => {
    const dir = dirname(outputPath(note, outDir, 'pdf'))
    let c = caches.get(dir)
    // A folder's leftover temporary files of killed runs go when its cache is first opened.
    if (!c) { c = removeStaleTemporaries(dir).then(() => BuildCache.open(dir)); caches.set(dir, c) }
    return c
  }
  // The path as given is part of the key: the JSON output records it.
  const optionsOf = (note: string): string =>
    JSON.stringify({formats: b.run.formats, strict: b.run.strict, epoch: b.run.sourceDateEpoch ?? null, file: note, ...(b.run.alternatives === true ? {alternatives: true} : {}), ...(b.run.yield === true ? {yield: true} : {})})
  const clashes = building ? outputClashes(notes, b.run) : notes.map(() => null)
  const runner = runnerFor(notes.length, b.jobs, res, building)
  const items: (BatchItem | null)[] = notes.map(() => null)
  /**
   * The outcome of an unchanged note from its cache entry, or null to rebuild: its images
   * read as they did, and evaluated again (no report drawn) to the result recorded at the
   * build. The verdict is this evaluation's, never a field of the cache file.
   */
  const fromCache = async (note: string, source: Uint8Array, entry: CacheEntry): Promise<NoteOutcome | null> => {
    if (!(await imagesUnchanged(note, entry.images))) return null
    const fresh = (await runNote(source, note, noteResources(note, res), {formats: [], strict: b.run.strict, sourceDateEpoch: b.run.sourceDateEpoch, alternatives: b.run.alternatives === true, yield: b.run.yield === true})).outcome
    if (fresh.exitCode === 2 || resultDigest(fresh.stages) !== entry.result) return null
    return {...fresh, diagnostics: [], outputs: entry.outputs.map((o) => o.path)}
  }
  try {
    let nextIndex = 0
    const one = async (note: string, i: number): Promise<void> => {
      const t0 = performance.now()
      let refusal = clashes[i] ?? null
      const source = building && refusal === null ? await readFile(note).then((x) => new Uint8Array(x), () => null) : null
      const key = source === null ? null : buildKey({source, template: b.templateHash, version: `${res.version} ${res.buildId}`, options: optionsOf(note)})
      const cache = building && refusal === null ? await cacheFor(note) : null
      const hit = key !== null && cache !== null && !b.force ? await cache.hit(resolve(note), key) : null
      const cached = hit !== null && source !== null ? await fromCache(note, source, hit) : null
      if (cached === null && cache !== null && !b.force) {
        refusal = await foreignOutputs(note, b.run.formats.map((f) => outputFile(note, outDir, f)), cache)
      }
      let item: BatchItem
      if (refusal !== null) {
        item = {upToDate: false, stages: 0, seconds: 0, outcome: failedOutcome(note, refusal)}
      } else if (cached !== null) {
        item = {upToDate: true, stages: cached.stages.length, seconds: (performance.now() - t0) / 1000, outcome: cached}
      } else if (b.interrupted()) {
        item = {upToDate: false, stages: 0, seconds: 0, outcome: failedOutcome(note, 'not processed: the batch was interrupted')}
      } else {
        const previous = cache?.entry(resolve(note)) ?? null
        const run: RunOptions = cache === null || b.force ? b.run : {...b.run, owned: previous?.owned ?? []}
        // An internal failure of one note (a bug) must not take the rest of the batch down.
        const outcome = await runner.run(note, run).catch((error: unknown) =>
          failedOutcome(note, `internal error: ${error instanceof Error ? error.message : String(error)}`))
        item = {upToDate: false, stages: outcome.stages.length, seconds: (performance.now() - t0) / 1000, outcome}
        if (cache !== null && key !== null) {
          const written = outcome.records ?? []
          const owned = [...new Set([...(previous?.owned ?? []), ...written.map((r) => r.path)])].sort()
          // A failed note keeps the record of what it wrote before (still ours), with no key.
          await cache.set(resolve(note), outcome.exitCode === 2
            ? (previous === null ? null : {...previous, key: ''})
            : {key, outputs: written, images: outcome.inputs ?? [], result: resultDigest(outcome.stages), owned})
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
