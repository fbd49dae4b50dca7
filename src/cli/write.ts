/**
 * Atomic file writes: temporary files in the targets' folders, then renames, so that a
 * failed build never leaves a partial file and never replaces an earlier good one. A set
 * of files is written all or nothing: every temporary file is complete before the first
 * rename.
 */
import {randomBytes} from 'node:crypto'
import {mkdir, readdir, rename, rm, writeFile} from 'node:fs/promises'
import {basename, dirname, join} from 'node:path'

const tmpName = (target: string): string =>
  join(dirname(target), `.${basename(target)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`)

/** Write every file, or none of them (temporary files are removed on failure). */
export async function writeAllAtomic(files: readonly (readonly [string, Uint8Array | string])[]): Promise<void> {
  const staged: [string, string][] = []
  try {
    for (const [target, data] of files) {
      await mkdir(dirname(target), {recursive: true})
      const tmp = tmpName(target)
      staged.push([tmp, target])
      await writeFile(tmp, data)
    }
    for (const [tmp, target] of staged) await rename(tmp, target)
  } catch (error) {
    await Promise.all(staged.map(([tmp]) => rm(tmp, {force: true})))
    throw error
  }
}

export const writeAtomic = (target: string, data: Uint8Array | string): Promise<void> => writeAllAtomic([[target, data]])

/** Our temporary files: `.<target>.<pid>.<8 hex>.tmp`. */
const TMP_NAME = /^\..+\.(\d+)\.[0-9a-f]{8}\.tmp$/

const running = (pid: number): boolean => {
  if (pid === process.pid) return true
  try {
    process.kill(pid, 0)
    return true
  } catch (error) {
    // EPERM: the process exists but is someone else's.
    return (error as NodeJS.ErrnoException).code === 'EPERM'
  }
}

/**
 * Removes the temporary files a killed run left in `dir` (ours by name, from a process
 * that is no longer running); other files, and those of a run still going, stay.
 */
export async function removeStaleTemporaries(dir: string): Promise<void> {
  const names = await readdir(dir).catch(() => [] as string[])
  await Promise.all(names.map(async (name) => {
    const m = TMP_NAME.exec(name)
    if (m && !running(Number(m[1]))) await rm(join(dir, name), {force: true}).catch(() => undefined)
  }))
}
