/**
 * The content-hash build cache: one small JSON file per output folder
 * (`.ampreview-cache.json`). The file is never trusted: anyone can edit it (or commit one).
 * A note is "up to date" only when its key (source, template, tool version, options) is
 * unchanged, every image it shows still reads as it did (the same checks as the build),
 * and every recorded output lies inside the output folder, is a regular file and has the
 * recorded size and SHA-256 — every output of the set from the same build. The verdict
 * and exit code are never read from the file: the note is evaluated again (cheap, no
 * report drawn), and its §6 result must hash to the one recorded at the build.
 *
 * The file is rewritten atomically after every note, so a crash leaves the previous
 * version; a file that cannot be read or parsed is treated as empty (it never blocks a
 * build) and is replaced on the next write.
 */
import {createHash} from 'node:crypto'
import {lstat, readFile} from 'node:fs/promises'
import {isAbsolute, join, relative, resolve, sep} from 'node:path'
import type {ImageInput} from './images.js'
import {writeAtomic} from './write.js'

export const CACHE_FILE = '.ampreview-cache.json'
const CACHE_VERSION = 2

/** One output file as written: where, how long, its hash. */
export interface OutputRecord {
  path: string
  size: number
  sha256: string
}

export interface CacheEntry {
  /** Hash of everything the outputs depend on, images apart. */
  key: string
  outputs: OutputRecord[]
  /** The images the outputs embed, as read at the build. */
  images: ImageInput[]
  /** SHA-256 of the note's §6 stage results at the build (`resultDigest`). */
  result: string
  /** Every file this note's builds wrote here, the latest and earlier ones: ours to replace. */
  owned: string[]
}

interface CacheFile {
  version: number
  entries: Record<string, CacheEntry>
}

export interface KeyParts {
  /** The note's bytes. */
  source: Uint8Array
  /** Hash of the template folder. */
  template: string
  /** The tool's version. */
  version: string
  /** The options that change the outputs, serialised. */
  options: string
}

/** The key of a build: note bytes, template files, tool version, options. */
export function buildKey(parts: KeyParts): string {
  const h = createHash('sha256')
  // Each part is length-prefixed, so no two different sets of parts give the same bytes.
  for (const p of [parts.version, parts.options, parts.template]) h.update(`${Buffer.byteLength(p)}:`).update(p)
  h.update(`${parts.source.byteLength}:`).update(parts.source)
  return h.digest('hex')
}

/** Hash of a note's §6 stage results: what a verdict is computed from. */
export const resultDigest = (stages: unknown): string => createHash('sha256').update(JSON.stringify(stages)).digest('hex')

/** SHA-256 and size of an output's contents, as recorded. */
export function recordOf(path: string, data: Uint8Array | string): OutputRecord {
  const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data
  return {path, size: bytes.byteLength, sha256: createHash('sha256').update(bytes).digest('hex')}
}

const inside = (dir: string, p: string): boolean => {
  const rel = relative(dir, p)
  return rel !== '' && !rel.startsWith('..' + sep) && rel !== '..' && !isAbsolute(rel) && !rel.includes(sep)
}

const isEntry = (e: unknown): e is CacheEntry => {
  if (typeof e !== 'object' || e === null) return false
  const x = e as Record<string, unknown>
  const isRecord = (o: unknown): boolean => typeof o === 'object' && o !== null &&
    typeof (o as OutputRecord).path === 'string' && Number.isInteger((o as OutputRecord).size) && typeof (o as OutputRecord).sha256 === 'string'
  const isImage = (o: unknown): boolean => typeof o === 'object' && o !== null &&
    typeof (o as ImageInput).url === 'string' && typeof (o as ImageInput).digest === 'string'
  return typeof x['key'] === 'string' && typeof x['result'] === 'string' &&
    Array.isArray(x['outputs']) && x['outputs'].every(isRecord) && Array.isArray(x['images']) && x['images'].every(isImage) &&
    Array.isArray(x['owned']) && x['owned'].every((o) => typeof o === 'string')
}

/** Whether a recorded output is still exactly what the build wrote, inside `dir`. */
async function outputIntact(dir: string, o: OutputRecord): Promise<boolean> {
  const path = resolve(dir, o.path)
  if (path !== o.path || !inside(dir, path)) return false
  const s = await lstat(path).catch(() => null)
  if (s === null || !s.isFile() || s.size !== o.size) return false
  const bytes = await readFile(path).catch(() => null)
  return bytes !== null && createHash('sha256').update(bytes).digest('hex') === o.sha256
}

export class BuildCache {
  private entries: Record<string, CacheEntry> = {}
  private writing: Promise<void> = Promise.resolve()
  private constructor(readonly dir: string) {}

  static async open(dir: string): Promise<BuildCache> {
    const cache = new BuildCache(dir)
    try {
      const parsed = JSON.parse(await readFile(join(dir, CACHE_FILE), 'utf8')) as Partial<CacheFile>
      if (parsed.version === CACHE_VERSION && parsed.entries && typeof parsed.entries === 'object') {
        for (const [k, e] of Object.entries(parsed.entries)) if (isEntry(e) && isAbsolute(k)) cache.entries[k] = e
      }
    } catch {
      // Missing or corrupt: start empty; the next write replaces it.
    }
    return cache
  }

  /**
   * The entry for a note if its key matches and every recorded output is intact (inside
   * this folder, same size and hash). Images and the verdict are for the caller to check.
   */
  async hit(note: string, key: string): Promise<CacheEntry | null> {
    const e = Object.hasOwn(this.entries, note) ? this.entries[note] : undefined
    if (!e || e.key !== key || e.outputs.length === 0) return null
    for (const o of e.outputs) if (!(await outputIntact(this.dir, o))) return null
    return e
  }

  /** The note whose recorded outputs include `path` (absolute), if any. */
  ownerOf(path: string): string | null {
    for (const [note, e] of Object.entries(this.entries)) if (e.owned.includes(path) || e.outputs.some((o) => o.path === path)) return note
    return null
  }

  /** The entry recorded for a note, whatever its key. */
  entry(note: string): CacheEntry | null {
    return Object.hasOwn(this.entries, note) ? this.entries[note]! : null
  }

  /** Record a note's entry (or drop it with null) and write the file atomically. */
  set(note: string, entry: CacheEntry | null): Promise<void> {
    // Dropping an entry that was never there changes nothing: write no file for it (a failed
    // build in a folder without a cache leaves the folder as it was).
    if (entry === null && !Object.hasOwn(this.entries, note)) return this.writing
    if (entry === null) delete this.entries[note]
    else this.entries[note] = entry
    const body = `${JSON.stringify({version: CACHE_VERSION, entries: this.entries} satisfies CacheFile, null, 1)}\n`
    this.writing = this.writing.then(() => writeAtomic(join(this.dir, CACHE_FILE), body)).catch(() => undefined)
    return this.writing
  }
}
