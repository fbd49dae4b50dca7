/**
 * Images of a note: every image the parsed tree shows (`![alt](url)` and reference images
 * through their definitions), each read by `loadImage`, the one way an image file is ever
 * read — for the PDF and for the build cache alike. Only regular PNG and JPEG files inside
 * the note's own folder, at most MAX_IMAGE_BYTES, whose headers agree with their data, are
 * read; anything else is refused with a positioned warning (the PDF shows a framed
 * placeholder instead), never read past the cap and never waited on.
 */
import {createHash} from 'node:crypto'
import {open, realpath, stat} from 'node:fs/promises'
import {dirname, isAbsolute, relative, resolve, sep} from 'node:path'
import type {Definition, Image, ImageReference, Root, RootContent} from 'mdast'
import type {VFile} from 'vfile'
import {checkImage} from '../render/pdf/image-check.js'

/** Largest image file read, bytes (README, Limits). */
export const MAX_IMAGE_BYTES = 20 * 2 ** 20

/** One image the note shows, as the cache records it: its URL and a digest of what reading it gave. */
export interface ImageInput {
  url: string
  /** `sha256:<hex>` of the bytes read, or `refused:<why>`. */
  digest: string
}

export interface NoteImages {
  /** Bytes of each image that may be embedded, by URL. */
  images: Map<string, Uint8Array>
  /** Every image URL the note shows, sorted, with its digest. */
  inputs: ImageInput[]
}

/** The image nodes of the tree, each with the URL the renderer looks it up by. Iterative: trees may be deep. */
export function imageRefs(tree: Root): {url: string; node: Image | ImageReference}[] {
  const definitions = new Map<string, Definition>()
  const refs: (Image | ImageReference)[] = []
  const stack: RootContent[] = [...tree.children]
  while (stack.length > 0) {
    const n = stack.pop()!
    if (n.type === 'definition' && !definitions.has(n.identifier.toLowerCase())) definitions.set(n.identifier.toLowerCase(), n)
    if (n.type === 'image' || n.type === 'imageReference') refs.push(n)
    if ('children' in n && Array.isArray(n.children)) stack.push(...(n.children as RootContent[]))
  }
  return refs
    .map((node) => ({node, url: node.type === 'image' ? node.url : definitions.get(node.identifier.toLowerCase())?.url ?? node.identifier}))
    .sort((a, b) => (a.node.position?.start.offset ?? 0) - (b.node.position?.start.offset ?? 0))
}

const inside = (dir: string, p: string): boolean => {
  const rel = relative(dir, p)
  return rel !== '' && !rel.startsWith('..' + sep) && rel !== '..' && !isAbsolute(rel)
}

export type LoadedImage = {ok: true; bytes: Uint8Array} | {ok: false; why: string}

/** Reads at most `cap + 1` bytes of a regular file (it may grow between stat and read). */
async function readCapped(path: string, cap: number): Promise<Uint8Array> {
  const fh = await open(path, 'r')
  try {
    const buf = Buffer.alloc(cap + 1)
    let n = 0
    for (;;) {
      const {bytesRead} = await fh.read(buf, n, buf.length - n, n)
      if (bytesRead === 0) break
      n += bytesRead
      if (n >= buf.length) break
    }
    return new Uint8Array(buf.buffer, buf.byteOffset, n)
  } finally {
    await fh.close()
  }
}

const mib = (n: number): string => `${(n / 2 ** 20).toFixed(1)} MiB`

/** One image by its URL, relative to `dir` (the note's folder, already a real path): bytes, or why not. */
export async function loadImage(dir: string, url: string): Promise<LoadedImage> {
  const no = (why: string): LoadedImage => ({ok: false, why})
  if (/^[a-z][a-z0-9+.-]*:/i.test(url)) return no('URLs are never fetched; put the image beside the note and give a relative path')
  if (isAbsolute(url)) return no('absolute paths are refused; give a path relative to the note')
  let decoded: string
  try {
    decoded = decodeURIComponent(url)
  } catch {
    return no('the path is not valid (a stray `%`)')
  }
  const lexical = resolve(dir, decoded)
  if (!inside(dir, lexical)) return no('it lies outside the note’s folder')
  let target: string
  try {
    target = await realpath(lexical)
  } catch {
    return no('file not found next to the note')
  }
  const s = await stat(target).catch(() => null)
  if (s === null) return no('file not found next to the note')
  if (!s.isFile()) return no('it is not a regular file')
  if (!inside(dir, target)) return no('it lies outside the note’s folder')
  if (s.size > MAX_IMAGE_BYTES) return no(`it is ${mib(s.size)}, larger than the ${MAX_IMAGE_BYTES / 2 ** 20} MiB an image may be`)
  let bytes: Uint8Array
  try {
    bytes = await readCapped(target, MAX_IMAGE_BYTES)
  } catch {
    return no('it could not be read')
  }
  if (bytes.length > MAX_IMAGE_BYTES) return no(`it is larger than the ${MAX_IMAGE_BYTES / 2 ** 20} MiB an image may be`)
  const check = checkImage(bytes)
  return check.ok ? {ok: true, bytes} : no(check.why)
}

/** What the cache records of one read: the bytes' hash, or the refusal. */
export const imageDigest = (r: LoadedImage): string =>
  r.ok ? `sha256:${createHash('sha256').update(r.bytes).digest('hex')}` : `refused:${r.why}`

/** The real path of a note's folder. */
export const noteFolder = (notePath: string): Promise<string> => realpath(dirname(resolve(notePath)))

export async function readImages(tree: Root, notePath: string, file: VFile): Promise<NoteImages> {
  const images = new Map<string, Uint8Array>()
  const digests = new Map<string, string>()
  const refs = imageRefs(tree)
  if (refs.length === 0) return {images, inputs: []}
  const dir = await noteFolder(notePath)
  for (const {url, node} of refs) {
    if (digests.has(url)) continue
    const r = await loadImage(dir, url)
    digests.set(url, imageDigest(r))
    if (r.ok) images.set(url, r.bytes)
    else file.message(`Image \`${url}\` not included: ${r.why}`, {place: node.position, ruleId: 'image-refused', source: 'ampreview'})
  }
  return {images, inputs: [...digests].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)).map(([url, digest]) => ({url, digest}))}
}

/** Whether every recorded image still reads as it did (the same checks, the same bytes). */
export async function imagesUnchanged(notePath: string, inputs: readonly ImageInput[]): Promise<boolean> {
  if (inputs.length === 0) return true
  const dir = await noteFolder(notePath).catch(() => null)
  if (dir === null) return false
  for (const i of inputs) if (imageDigest(await loadImage(dir, i.url)) !== i.digest) return false
  return true
}
