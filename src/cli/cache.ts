/**
 * The content-hash build cache: one small JSON file per output folder
 * (`.ampreview-cache.json`). A note whose source, template, tool version and options are
 * unchanged, and whose outputs are all still there, is "up to date" and not rebuilt.
 *
 * The file is rewritten atomically after every note, so a crash leaves the previous
 * version; a file that cannot be read or parsed is treated as empty (it never blocks a
 * build) and is replaced on the next write.
 */
import {createHash} from 'node:crypto'
import {readFile, stat} from 'node:fs/promises'
import {join} from 'node:path'
import {writeAtomic} from './write.js'

export const CACHE_FILE = '.ampreview-cache.json'
const CACHE_VERSION = 1

export interface CacheEntry {
  /** Hash of everything the outputs depend on. */
  key: string
  outputs: string[]
  exitCode: 0 | 1
  stages: number
  met: number
  notMet: number
}

interface CacheFile {
  version: number
  entries: Record<string, CacheEntry>
}

/** The key of a build: note bytes, template files, tool version, options. */
export function buildKey(parts: {source: Uint8Array; template: string; version: string; options: string}): string {
  const h = createHash('sha256')
  for (const p of [parts.version, parts.options, parts.template]) h.update(p).update('\0')
  h.update(parts.source)
  return h.digest('hex')
}

const isEntry = (e: unknown): e is CacheEntry => {
  if (typeof e !== 'object' || e === null) return false
  const x = e as Record<string, unknown>
  return typeof x['key'] === 'string' && Array.isArray(x['outputs']) && (x['exitCode'] === 0 || x['exitCode'] === 1)
}

export class BuildCache {
  private entries: Record<string, CacheEntry> = {}
  private writing: Promise<void> = Promise.resolve()
  private constructor(private readonly dir: string) {}

  static async open(dir: string): Promise<BuildCache> {
    const cache = new BuildCache(dir)
    try {
      const parsed = JSON.parse(await readFile(join(dir, CACHE_FILE), 'utf8')) as Partial<CacheFile>
      if (parsed.version === CACHE_VERSION && parsed.entries && typeof parsed.entries === 'object') {
        for (const [k, e] of Object.entries(parsed.entries)) if (isEntry(e)) cache.entries[k] = e
      }
    } catch {
      // Missing or corrupt: start empty; the next write replaces it.
    }
    return cache
  }

  /** The entry for a note if its key matches and every output still exists. */
  async hit(note: string, key: string): Promise<CacheEntry | null> {
    const e = this.entries[note]
    if (!e || e.key !== key) return null
    for (const o of e.outputs) {
      if (!(await stat(o).then((s) => s.isFile(), () => false))) return null
    }
    return e
  }

  /** Record a note's entry (or drop it with null) and write the file atomically. */
  set(note: string, entry: CacheEntry | null): Promise<void> {
    if (entry === null) delete this.entries[note]
    else this.entries[note] = entry
    const body = `${JSON.stringify({version: CACHE_VERSION, entries: this.entries} satisfies CacheFile, null, 1)}\n`
    this.writing = this.writing.then(() => writeAtomic(join(this.dir, CACHE_FILE), body)).catch(() => undefined)
    return this.writing
  }
}
