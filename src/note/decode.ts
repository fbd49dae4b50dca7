/**
 * From bytes to the text of a note: the one place that decides whether the bytes are a
 * note at all (size, NUL bytes, UTF-8, something written). Pure; the CLI calls it on the
 * bytes it read from a file or from a git revision.
 */
import {noteMessages} from './messages.js'

/** Largest note read, bytes (time and memory stay bounded: README, Limits). */
export const MAX_NOTE_BYTES = 20 * 2 ** 20

export type Decoded = {ok: true; text: string} | {ok: false; message: string}

/** Whether the bytes hold U+FFFD written as such (EF BF BD), which is valid UTF-8. */
function hasReplacementChar(bytes: Uint8Array): boolean {
  for (let i = bytes.indexOf(0xef); i >= 0 && i + 2 < bytes.length; i = bytes.indexOf(0xef, i + 1)) {
    if (bytes[i + 1] === 0xbf && bytes[i + 2] === 0xbd) return true
  }
  return false
}

/** The text of a note, or why these bytes are not one (each reported at 1:1). */
export function decodeNote(bytes: Uint8Array): Decoded {
  if (bytes.length > MAX_NOTE_BYTES) return {ok: false, message: noteMessages.tooLarge(bytes.length, MAX_NOTE_BYTES)}
  if (bytes.includes(0)) return {ok: false, message: noteMessages.binaryFile()}
  const text = new TextDecoder('utf-8', {ignoreBOM: true}).decode(bytes)
  if (text.includes('\uFFFD') && !hasReplacementChar(bytes)) return {ok: false, message: noteMessages.notUtf8()}
  if (text.replace(/^\uFEFF/, '').trim() === '') return {ok: false, message: noteMessages.emptyNote()}
  return {ok: true, text}
}
