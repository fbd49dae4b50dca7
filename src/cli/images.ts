/**
 * Images of a note: every `image` node's URL checked and read. Only PNG and JPEG files
 * inside the note's own folder are read; URLs, absolute paths and paths that leave the
 * folder are refused with a warning (the PDF shows a framed placeholder instead).
 */
import {readFile, realpath} from 'node:fs/promises'
import {dirname, isAbsolute, relative, resolve, sep} from 'node:path'
import type {Root, RootContent} from 'mdast'
import type {VFile} from 'vfile'

function collect(nodes: RootContent[], out: Extract<RootContent, {type: 'image'}>[]): void {
  for (const n of nodes) {
    if (n.type === 'image') out.push(n)
    if ('children' in n && Array.isArray(n.children)) collect(n.children as RootContent[], out)
  }
}

const isPng = (b: Uint8Array): boolean => b.length > 8 && b[0] === 0x89 && b[1] === 0x50 && b[2] === 0x4e && b[3] === 0x47
const isJpeg = (b: Uint8Array): boolean => b.length > 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff

const inside = (dir: string, p: string): boolean => {
  const rel = relative(dir, p)
  return rel !== '' && !rel.startsWith('..' + sep) && rel !== '..' && !isAbsolute(rel)
}

export async function readImages(tree: Root, notePath: string, file: VFile): Promise<Map<string, Uint8Array>> {
  const nodes: Extract<RootContent, {type: 'image'}>[] = []
  collect(tree.children, nodes)
  const images = new Map<string, Uint8Array>()
  const dir = await realpath(dirname(resolve(notePath)))
  const refuse = (url: string, why: string, node: Extract<RootContent, {type: 'image'}>): void => {
    file.message(`Image \`${url}\` not included: ${why}`, {place: node.position, ruleId: 'image-refused', source: 'ampreview'})
  }
  for (const node of nodes) {
    const url = node.url
    if (images.has(url)) continue
    if (/^[a-z][a-z0-9+.-]*:/i.test(url)) { refuse(url, 'URLs are never fetched; put the image beside the note and give a relative path', node); continue }
    if (isAbsolute(url)) { refuse(url, 'absolute paths are refused; give a path relative to the note', node); continue }
    let target: string
    try {
      target = await realpath(resolve(dir, decodeURIComponent(url)))
    } catch {
      refuse(url, 'file not found next to the note', node); continue
    }
    if (!inside(dir, target)) { refuse(url, 'it lies outside the note’s folder', node); continue }
    const bytes = new Uint8Array(await readFile(target))
    if (!isPng(bytes) && !isJpeg(bytes)) { refuse(url, 'only PNG and JPEG images are supported', node); continue }
    images.set(url, bytes)
  }
  return images
}
