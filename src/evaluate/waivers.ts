/**
 * A stage's role and its waivers, read from the block's entries: `role: baseline` marks a
 * stage kept for comparison (shown, not counted); `accept: {rule-id: "reason"}` turns that
 * rule's notes on the stage into notes "accepted by the author", with the reason. An id that
 * is not a rule is an error at its key, with the nearest id as a hint; an accepted rule that
 * raised nothing on the stage is an info message, so that stale waivers are seen.
 */
import type {VFile} from 'vfile'
import {didYouMean} from '../note/did-you-mean.js'
import type {StageBlockNode, StageRole} from '../note/types.js'
import {isRuleId, RULE_IDS, type RuleId} from '../rules/index.js'
import type {RuleNote} from '../rules/types.js'

const SOURCE = 'ampreview'

export const evaluateMessages = {
  unknownRule: (id: string, suggestion: string | null) =>
    `Unexpected rule \`${id}\` in \`accept\`, expected a rule id${suggestion === null ? ` (one of ${RULE_IDS.map((r) => `\`${r}\``).join(', ')})` : `; did you mean \`${suggestion}\`?`}`,
  unusedWaiver: (id: string, stage: string) =>
    `Rule \`${id}\` is accepted in stage \`${stage}\` but raised no note there: remove the entry if it is no longer needed`
} as const

/** The stage's role (`design` when not written; the note has checked the value). */
export function roleOf(block: StageBlockNode): StageRole {
  return block.entries.find((e) => e.key === 'role')?.raw.trim() === 'baseline' ? 'baseline' : 'design'
}

/** The stage's waivers, rule id → reason; unknown ids are reported on `file` and left out. */
export function waiversOf(block: StageBlockNode, file: VFile): Map<RuleId, string> {
  const out = new Map<RuleId, string>()
  for (const e of block.entries) {
    if (!e.key.startsWith('accept.')) continue
    const id = e.key.slice('accept.'.length)
    if (isRuleId(id)) {
      out.set(id, e.raw.trim())
      continue
    }
    const m = file.message(evaluateMessages.unknownRule(id, didYouMean(id, RULE_IDS)), {place: {line: e.line, column: e.column}, ruleId: 'unknown-rule', source: SOURCE})
    m.fatal = true
    m.actual = id
  }
  return out
}

/** The notes with each accepted rule's notes marked; an unused waiver is an info message at its key. */
export function applyWaivers(block: StageBlockNode, notes: readonly RuleNote[], waivers: ReadonlyMap<RuleId, string>, file: VFile): RuleNote[] {
  for (const id of waivers.keys()) {
    if (notes.some((n) => n.rule === id)) continue
    const e = block.entries.find((x) => x.key === `accept.${id}`)
    file.info(evaluateMessages.unusedWaiver(id, block.id), {place: e ? {line: e.line, column: e.column} : block.position?.start, ruleId: 'unused-waiver', source: SOURCE})
  }
  return notes.map((n) => {
    const reason = isRuleId(n.rule) ? waivers.get(n.rule) : undefined
    return reason === undefined ? n : {...n, accepted: reason}
  })
}
