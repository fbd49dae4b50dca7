/**
 * Raising diagnostics on the note's `VFile`: errors (`fatal = true`), warnings
 * (`fatal = false`) and infos (`fatal` undefined), each stamped with our `source` and a rule
 * id from `NOTE_RULES`. The reporter counts errors, so a block builder can tell whether
 * anything in its block was wrong (then its node's value is null).
 */
import type {Point} from 'unist'
import type {VFile} from 'vfile'
import {VFileMessage} from 'vfile-message'

/** Rule ids stamped on `src/note` diagnostics. */
export const NOTE_RULES = [
  'binary-file', 'front-matter-position', 'front-matter', 'yaml-syntax', 'duplicate-key', 'unknown-key',
  'key-not-for-topology', 'missing-key', 'bad-value', 'missing-id', 'bad-id', 'duplicate-id',
  'chain-unsupported', 'unclosed-fence', 'swallowed-block', 'unknown-opamp', 'opamp-defined-later', 'opamp-has-errors',
  'archetype-shadowed', 'suspicious-milliohm', 'suspicious-value', 'inconsistent-keys', 'too-deep', 'too-many-blocks',
  'unknown-stage', 'stage-defined-later', 'stage-repeated', 'stage-in-two-chains', 'stage-only-first', 'stage-has-errors',
  'unknown-adc', 'adc-defined-later', 'adc-has-errors', 'input-from-chain'
] as const
export type NoteRule = (typeof NOTE_RULES)[number]

export const SOURCE = 'ampreview'

export interface MessageExtra {
  /** A second place, e.g. the first definition of a duplicate. (optional) */
  cause?: {reason: string; place: Point}
  /** What was found. (optional) */
  actual?: string
  /** What would have been accepted. (optional) */
  expected?: string[]
}

export interface Reporter {
  error(reason: string, place: Point, ruleId: NoteRule, extra?: MessageExtra): VFileMessage
  warn(reason: string, place: Point, ruleId: NoteRule, extra?: MessageExtra): VFileMessage
  info(reason: string, place: Point, ruleId: NoteRule): VFileMessage
  /** Errors raised through this reporter so far. */
  readonly errors: number
}

/** A reporter that records on `file`. */
export function reporterFor(file: VFile): Reporter {
  let errors = 0
  const raise = (reason: string, place: Point, ruleId: NoteRule, extra: MessageExtra = {}): VFileMessage => {
    const cause = extra.cause
      ? new VFileMessage(extra.cause.reason, {place: extra.cause.place, ruleId, source: SOURCE})
      : undefined
    const m = file.message(reason, {place, ruleId, source: SOURCE, ...(cause ? {cause} : {})})
    if (extra.actual !== undefined) m.actual = extra.actual
    if (extra.expected !== undefined) m.expected = extra.expected
    return m
  }
  return {
    error(reason, place, ruleId, extra) {
      errors += 1
      const m = raise(reason, place, ruleId, extra)
      m.fatal = true
      return m
    },
    warn(reason, place, ruleId, extra) {
      const m = raise(reason, place, ruleId, extra)
      m.fatal = false
      return m
    },
    info(reason, place, ruleId) {
      return file.info(reason, {place, ruleId, source: SOURCE})
    },
    get errors() {
      return errors
    }
  }
}
