/**
 * Run a note as far as the evaluate phase, chains included.
 */
import {VFile} from 'vfile'
import {parseNote} from '../../src/note/index.js'
import {evaluateNoteWithChains} from '../../src/evaluate/index.js'

export function evaluatedOf(md: string) {
  const file = new VFile({path: 'note.md', value: md})
  const parsed = parseNote(file)
  const out = evaluateNoteWithChains(parsed, file)
  const diagnostics = file.messages.map((m) => `${m.line ?? 0}:${m.column ?? 0}: ${m.fatal === true ? 'error' : m.fatal === false ? 'warning' : 'info'}: ${m.reason}`)
  return {...out, parsed, diagnostics}
}

/** A fenced block. */
export const fence = (info: string, body: string): string => `\`\`\`${info}\n${body}\n\`\`\`\n`

/** A noninverting stage of gain 1 + rf/rg on an archetype. */
export const gainStage = (id: string, rf: string, rg: string, input: string | null, extra = ''): string =>
  fence(`stage ${id}`, `topology: noninverting\nopamp: precision-bipolar\nrf: ${rf}\nrg: ${rg}\n${input === null ? '' : `input: ${input}\n`}supply: ±15 V\nband: 0.1 .. 10 Hz${extra}`)
