/**
 * Reading a note (DESIGN §3): `parseNote` and the types it hands on. Re-exports only.
 */
export {parseNote} from './parse-note.js'
export {decodeNote, MAX_NOTE_BYTES, type Decoded} from './decode.js'
export {STAGE_KEYS, OPAMP_KEYS, OPAMP_BLOCK_KEYS, META_KEYS} from './keys.js'
export type {StageKey, OpampKey, MetaKey} from './keys.js'
export {STAGE_DEFAULTS} from './stage-block.js'
export {NOTE_RULES, type NoteRule} from './diagnostics.js'
export {noteMessages} from './messages.js'
export * from './types.js'
