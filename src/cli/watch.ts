/**
 * `build --watch`: build once, then rebuild a note each time it is saved and print its
 * verdicts. Watches each note's folder (editors often save by rename), debounces bursts of
 * events, and keeps fonts and templates loaded between builds.
 */
import {watch, type FSWatcher} from 'node:fs'
import {basename, dirname, resolve} from 'node:path'
import {outputClashes} from './batch.js'
import {BuildCache, resultDigest} from './cache.js'
import {formatDiagnostic, printable} from './diagnostics.js'
import {failedOutcome, outputPath, processNote, type NoteOutcome, type Resources, type RunOptions} from './pipeline.js'

export interface WatchIo {
  out: (s: string) => void
  err: (s: string) => void
}

const verdictLine = (o: NoteOutcome, seconds: number): string => {
  const result = o.exitCode === 2 ? 'error, no output written' : `${o.met} met, ${o.notMet} not met`
  return `${printable(o.file)}: ${result} (${seconds.toFixed(2)} s)${o.outputs.length > 0 ? ` → ${printable(o.outputs.join(', '))}` : ''}\n`
}

/** Resolves when `signal` aborts; every watcher is closed then. */
export async function watchNotes(all: string[], res: Resources, opts: RunOptions, io: WatchIo, signal: AbortSignal): Promise<void> {
  // A note whose outputs would replace a note (or another's outputs) is reported, never built or watched.
  const clashes = outputClashes(all, opts)
  const notes = all.filter((_n, i) => clashes[i] === null)
  all.forEach((note, i) => {
    const why = clashes[i]
    if (why == null) return
    const o = failedOutcome(note, why)
    for (const d of o.diagnostics) io.err(`${formatDiagnostic(note, d)}\n`)
    io.out(verdictLine(o, 0))
  })
  const building = new Map<string, Promise<void>>()
  /** Notes whose debounce delay is running: more events for them are the same save. */
  const waiting = new Set<string>()
  const again = new Set<string>()
  const outDir = opts.outDir === null ? null : resolve(opts.outDir)
  /** One cache per output folder for the whole session, so that notes built at once do not lose each other's records. */
  const caches = new Map<string, Promise<BuildCache>>()
  const build = async (note: string): Promise<void> => {
    const t0 = performance.now()
    // Outputs replace only files this note wrote (the folder's cache says which); what a
    // save writes is recorded there too, with no key (a later `build` rebuilds once).
    const dir = dirname(outputPath(note, outDir, 'pdf'))
    let opened = caches.get(dir)
    if (opened === undefined) { opened = BuildCache.open(dir); caches.set(dir, opened) }
    const cache = await opened
    const previous = cache.entry(resolve(note))
    const o = await processNote(note, res, {...opts, owned: previous?.owned ?? []}).catch((e: unknown) => {
      io.err(`${printable(note)}: internal error: ${e instanceof Error ? e.message : String(e)}\n`)
      return null
    })
    if (o === null) return
    if (o.records !== undefined && o.records.length > 0) {
      const owned = [...new Set([...(previous?.owned ?? []), ...o.records.map((r) => r.path)])].sort()
      await cache.set(resolve(note), {key: '', outputs: o.records, images: o.inputs ?? [], result: resultDigest(o.stages), owned})
    }
    for (const d of o.diagnostics) io.err(`${formatDiagnostic(note, d)}\n`)
    io.out(verdictLine(o, (performance.now() - t0) / 1000))
  }
  const schedule = (note: string): void => {
    if (signal.aborted || waiting.has(note)) return
    // An event while the note builds: build once more afterwards, with what was saved last.
    if (building.has(note)) { again.add(note); return }
    waiting.add(note)
    const p = new Promise<void>((r) => setTimeout(r, 30)).then(() => {
      waiting.delete(note)
      return build(note)
    }).finally(() => {
      building.delete(note)
      if (again.delete(note)) schedule(note)
    })
    building.set(note, p)
  }
  for (const note of notes) {
    if (signal.aborted) return
    await build(note)
  }
  const watchers: FSWatcher[] = []
  const byDir = new Map<string, Map<string, string>>()
  for (const note of notes) {
    const dir = dirname(resolve(note))
    if (!byDir.has(dir)) byDir.set(dir, new Map())
    byDir.get(dir)!.set(basename(note), note)
  }
  for (const [dir, names] of byDir) {
    watchers.push(watch(dir, (_event, name) => {
      const note = name === null ? undefined : names.get(name.toString())
      if (note !== undefined) schedule(note)
    }).on('error', (e) => io.err(`cannot watch ${printable(dir)} any longer: ${e.message}\n`)))
  }
  io.err(`watching ${notes.length} note(s); press Ctrl-C to stop\n`)
  // The signal may have fired already, during the first builds.
  if (!signal.aborted) await new Promise<void>((r) => signal.addEventListener('abort', () => r(), {once: true}))
  for (const w of watchers) w.close()
  await Promise.all(building.values())
}
