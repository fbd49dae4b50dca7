/**
 * The notes a command works on: files as given; a folder stands for every *.md file
 * inside it (recursively, sorted); an operand with glob characters is expanded with
 * tinyglobby (sorted). Duplicates are dropped, first place kept. An operand that matches
 * nothing is kept as given, so the pipeline reports it as not found; a folder without any
 * note is an error of the command.
 */
import {stat} from 'node:fs/promises'
import {glob} from 'tinyglobby'

const GLOB_CHARS = /[*?[\]{}]/

export async function expandNotes(operands: string[]): Promise<string[]> {
  const out: string[] = []
  const seen = new Set<string>()
  const add = (p: string): void => {
    if (!seen.has(p)) { seen.add(p); out.push(p) }
  }
  for (const op of operands) {
    const s = await stat(op).catch(() => null)
    if (s?.isDirectory()) {
      const found = await glob('**/*.md', {cwd: op, onlyFiles: true, ignore: ['**/node_modules/**']})
      if (found.length === 0) throw new Error(`No notes (*.md files) in the folder ${op}`)
      for (const f of found.sort()) add(`${op.replace(/\/+$/, '')}/${f}`)
    } else if (!s && GLOB_CHARS.test(op)) {
      const found = await glob(op, {onlyFiles: true, ignore: ['**/node_modules/**']})
      if (found.length === 0) add(op)
      for (const f of found.sort()) add(f)
    } else {
      add(op)
    }
  }
  return out
}
