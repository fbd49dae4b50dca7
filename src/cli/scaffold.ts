/**
 * `ampreview new FILE [--topology T]`: a starting note from the template's `new-note/`
 * folder, every key present or commented, ready to edit. Never overwrites a file.
 */
import {readFile, stat} from 'node:fs/promises'
import {join} from 'node:path'
import type {Topology} from '../engine/types.js'
import {PACKAGE_ROOT} from './resources.js'
import {writeAtomic} from './write.js'

export async function scaffoldNote(file: string, topology: Topology): Promise<string> {
  if (await stat(file).then(() => true, () => false)) throw new Error(`${file} already exists; choose another name or delete it first`)
  const dir = join(PACKAGE_ROOT, 'templates', 'standard', 'new-note')
  const [note, stage] = await Promise.all([readFile(join(dir, 'note.md'), 'utf8'), readFile(join(dir, `${topology}.yaml`), 'utf8')])
  const text = note.replaceAll('{{topology}}', topology).replace('{{stage-keys}}', stage.trimEnd())
  await writeAtomic(file, text)
  return file
}
