/**
 * Test helpers for `src/note`: run only as far as reading the note.
 */
import {VFile} from 'vfile'
import {parseNote} from '../../src/note/index.js'
import type {OpampBlockNode, ParsedNote, StageBlockNode} from '../../src/note/index.js'
import type {StageInput} from '../../src/engine/types.js'

export interface Read {
  note: ParsedNote
  file: VFile
  /** Every message as `LINE:COLUMN: SEVERITY: MESSAGE`, in the order raised. */
  diagnostics: string[]
}

const severity = (fatal: boolean | null | undefined): string => (fatal === true ? 'error' : fatal === false ? 'warning' : 'info')

/** Parse `md` (a string, or bytes) as a note. */
export function noteOf(md: string | Uint8Array): Read {
  const file = new VFile({path: 'note.md', value: md})
  const note = parseNote(file)
  const diagnostics = file.messages.map((m) => `${m.line ?? 0}:${m.column ?? 0}: ${severity(m.fatal)}: ${m.reason}`)
  return {note, file, diagnostics}
}

/** The block nodes of `md` and its diagnostics. */
export function blocksOf(md: string): {stages: StageBlockNode[]; opamps: OpampBlockNode[]; diagnostics: string[]} {
  const {note, diagnostics} = noteOf(md)
  return {stages: note.stages, opamps: note.opamps, diagnostics}
}

/** The `StageInput` of the stage `id` (default: the first), failing with the diagnostics when it is null. */
export function inputOf(md: string, id?: string): StageInput {
  const {stages, diagnostics} = blocksOf(md)
  const stage = id === undefined ? stages[0] : stages.find((s) => s.id === id)
  if (stage?.input == null) throw new Error(`no input for stage ${id ?? '(first)'}:\n${diagnostics.join('\n')}`)
  return stage.input
}

/** Only the error lines of `diagnostics`. */
export const errorsOf = (diagnostics: readonly string[]): string[] => diagnostics.filter((d) => d.includes(': error: '))

/** A fenced block as Markdown. */
export const fence = (info: string, body: string): string => `\`\`\`${info}\n${body}\n\`\`\`\n`
