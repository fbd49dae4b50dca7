/**
 * Atomic file writes: a temporary file in the target's folder, then a rename, so that a
 * failed build never leaves a partial file and never replaces an earlier good one.
 */
import {randomBytes} from 'node:crypto'
import {mkdir, rename, rm, writeFile} from 'node:fs/promises'
import {basename, dirname, join} from 'node:path'

export async function writeAtomic(target: string, data: Uint8Array | string): Promise<void> {
  const dir = dirname(target)
  await mkdir(dir, {recursive: true})
  const tmp = join(dir, `.${basename(target)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`)
  try {
    await writeFile(tmp, data)
    await rename(tmp, target)
  } catch (error) {
    await rm(tmp, {force: true})
    throw error
  }
}
