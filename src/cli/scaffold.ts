/**
 * `ampreview new FILE [--topology T]`: a starting note from the template's `new-note/`
 * folder, every key present or commented, ready to edit. Never overwrites a file: the note
 * is written to a temporary file and hard-linked into place, which fails if FILE exists
 * (even when it appears between the check and the write, or is a dangling link).
 */
import {randomBytes} from 'node:crypto'
import {constants} from 'node:fs'
import {copyFile, link, lstat, mkdir, readFile, rm, writeFile} from 'node:fs/promises'
import {basename, dirname, join} from 'node:path'
import type {Topology} from '../engine/types.js'
import {PACKAGE_ROOT} from './resources.js'

const exists = (file: string): Promise<boolean> => lstat(file).then(() => true, () => false)
const refusal = (file: string): Error => new Error(`${file} already exists; choose another name or delete it first`)

export async function scaffoldNote(file: string, topology: Topology): Promise<string> {
  if (await exists(file)) throw refusal(file)
  const dir = join(PACKAGE_ROOT, 'templates', 'standard', 'new-note')
  const [note, stage] = await Promise.all([readFile(join(dir, 'note.md'), 'utf8'), readFile(join(dir, `${topology}.yaml`), 'utf8')])
  // Replacement functions, so that a `$` in the template is copied as written.
  let text = note.replaceAll('{{topology}}', () => topology).replace('{{stage-keys}}', () => stage.trimEnd())
  // An instrumentation stage names an ina block (DESIGN §8.2) instead of an op-amp.
  if (topology === 'instrumentation') {
    const ina = await readFile(join(dir, 'ina-block.md'), 'utf8')
    text = text.replace(/```opamp my-amp\n[\s\S]*?\n```/, () => ina.trimEnd())
      .replace("delete this block and name an archetype in the stage (`opamp: precision-bipolar`)", "delete this block and name an INA archetype in the stage (`ina: precision-ina`)")
  }
  await mkdir(dirname(file), {recursive: true})
  const tmp = join(dirname(file), `.${basename(file)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`)
  try {
    await writeFile(tmp, text, {flag: 'wx'})
    // Where hard links are not supported, an exclusive copy still never overwrites.
    await link(tmp, file)
      .catch((error: unknown) => (error as NodeJS.ErrnoException).code === 'EEXIST' ? Promise.reject(error) : copyFile(tmp, file, constants.COPYFILE_EXCL))
      .catch((error: unknown) => {
        throw (error as NodeJS.ErrnoException).code === 'EEXIST' ? refusal(file) : error
      })
  } finally {
    await rm(tmp, {force: true})
  }
  return file
}
