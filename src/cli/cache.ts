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
import {dirname, isAbsolute, join, resolve} from 'node:path'
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

export interface KeyParts {
  /** The note's bytes. */
  source: Uint8Array
  /** Hash of the template folder. */
  template: string
  /** The tool's version. */
  version: string
  /** The options that change the outputs, serialised. */
  options: string
  /** Hash of the other files the outputs embed (the note's images); '' when none. */
  inputs: string
}

/** The key of a build: note bytes, template files, tool version, options, embedded files. */
export function buildKey(parts: KeyParts): string {
  const h = createHash('sha256')
  // Each part is length-prefixed, so no two different sets of parts give the same bytes.
  for (const p of [parts.version, parts.options, parts.template, parts.inputs]) h.update(`${Buffer.byteLength(p)}:`).update(p)
  h.update(`${parts.source.byteLength}:`).update(parts.source)
  return h.digest('hex')
}

/** Inline image targets `![alt](target)` (alt text may hold one level of brackets) and reference definitions `[label]: target`. */
const IMAGE_TARGET = /!\[(?:[^\]\\]|\\.|\[[^\]]*\])*\]\(\s*(?:<([^>]*)>|([^)\s]+))/g
const DEFINITION_TARGET = /^ {0,3}\[[^\]]+\]:\s*(?:<([^>]*)>|(\S+))/gm

/**
 * Hash of the local files a note's images may refer to (names and bytes; a missing file
 * counts as missing), so that replacing an image rebuilds the PDF that embeds it. A cheap
 * scan of the source rather than a parse: it may include a file the report does not use,
 * which only costs a rebuild.
 */
export async function imageInputsHash(source: Uint8Array, notePath: string): Promise<string> {
  const text = Buffer.from(source.buffer, source.byteOffset, source.byteLength).toString('utf8')
  const targets = new Set<string>()
  for (const re of [IMAGE_TARGET, DEFINITION_TARGET]) {
    for (const m of text.matchAll(re)) {
      const url = m[1] ?? m[2] ?? ''
      if (url === '' || /^[a-z][a-z0-9+.-]*:/i.test(url) || isAbsolute(url)) continue
      targets.add(url)
    }
  }
  if (targets.size === 0) return ''
  const dir = dirname(resolve(notePath))
  const h = createHash('sha256')
  for (const url of [...targets].sort()) {
    let path: string
    try {
      path = resolve(dir, decodeURIComponent(url))
    } catch {
      continue
    }
    const bytes = await readFile(path).catch(() => null)
    h.update(`${url}\0`).update(bytes === null ? 'missing' : createHash('sha256').update(bytes).digest('hex')).update('\0')
  }
  return h.digest('hex')
}

const isEntry = (e: unknown): e is CacheEntry => {
  if (typeof e !== 'object' || e === null) return false
  const x = e as Record<string, unknown>
  const count = (v: unknown): boolean => Number.isInteger(v) && (v as number) >= 0
  return typeof x['key'] === 'string' && Array.isArray(x['outputs']) && x['outputs'].every((o) => typeof o === 'string') &&
    (x['exitCode'] === 0 || x['exitCode'] === 1) && count(x['stages']) && count(x['met']) && count(x['notMet'])
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
