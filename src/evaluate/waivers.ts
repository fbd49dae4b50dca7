/**
 * A stage's role and its waivers, read from the block's entries: `role: baseline` marks a
 * stage kept for comparison (shown, not counted); `accept: {rule-id: "reason"}` turns that
 * rule's notes on the stage into notes "accepted by the author", with the reason. An id that
 * is not a rule is an error at its key, with the nearest id as a hint; an accepted rule that
 * raised nothing on the stage is an info message, so that stale waivers are seen. A chain
 * block's `accept` works the same way over the chain rules (`chainWaiversOf`).
 */
import type {VFile} from 'vfile'
import {didYouMean} from '../note/did-you-mean.js'
import type {StageBlockNode, StageRole} from '../note/types.js'
import type {ChainBlockNode} from '../note/chain-types.js'
import {CHAIN_RULE_IDS, isRuleId, RULE_IDS, type ChainRuleId, type RuleId} from '../rules/index.js'
import type {RuleNote} from '../rules/types.js'

const SOURCE = 'ampreview'

export const evaluateMessages = {
  unknownRule: (id: string, suggestion: string | null, ids: readonly string[] = RULE_IDS, what = 'a rule id') =>
    `Unexpected rule \`${id}\` in \`accept\`, expected ${what}${suggestion === null ? ` (one of ${ids.map((r) => `\`${r}\``).join(', ')})` : `; did you mean \`${suggestion}\`?`}`,
  unusedWaiver: (id: string, stage: string, kind: 'stage' | 'chain' = 'stage') =>
    `Rule \`${id}\` is accepted in ${kind} \`${stage}\` but raised no note there: remove the entry if it is no longer needed`
} as const

/** The stage's role (`design` when not written; the note has checked the value). */
export function roleOf(block: StageBlockNode): StageRole {
  return block.entries.find((e) => e.key === 'role')?.raw.trim() === 'baseline' ? 'baseline' : 'design'
}

/** The stage's waivers, rule id → reason; unknown ids are reported on `file` and left out. */
export function waiversOf(block: StageBlockNode, file: VFile): Map<RuleId, string> {
  return waiversAmong(block, file, RULE_IDS, isRuleId, 'a rule id')
}

const isChainRuleId = (s: string): s is ChainRuleId => (CHAIN_RULE_IDS as readonly string[]).includes(s)

/** The chain's waivers over the chain rules, rule id → reason; unknown ids are reported on `file` and left out. */
export function chainWaiversOf(block: ChainBlockNode, file: VFile): Map<ChainRuleId, string> {
  return waiversAmong(block, file, CHAIN_RULE_IDS, isChainRuleId, 'a chain rule id')
}

function waiversAmong<Id extends string>(block: StageBlockNode | ChainBlockNode, file: VFile, ids: readonly Id[], isId: (s: string) => s is Id, what: string): Map<Id, string> {
  const out = new Map<Id, string>()
  for (const e of block.entries) {
    if (!e.key.startsWith('accept.')) continue
    const id = e.key.slice('accept.'.length)
    if (isId(id)) {
      out.set(id, e.raw.trim())
      continue
    }
    const m = file.message(evaluateMessages.unknownRule(id, didYouMean(id, ids), ids, what), {place: {line: e.line, column: e.column}, ruleId: 'unknown-rule', source: SOURCE})
    m.fatal = true
    m.actual = id
  }
  return out
}

/** The notes with each accepted rule's notes marked; an unused waiver is an info message at its key. */
export function applyWaivers(block: StageBlockNode | ChainBlockNode, notes: readonly RuleNote[], waivers: ReadonlyMap<string, string>, file: VFile): RuleNote[] {
  const kind = block.type === 'chainBlock' ? 'chain' : 'stage'
  for (const id of waivers.keys()) {
    if (notes.some((n) => n.rule === id)) continue
    const e = block.entries.find((x) => x.key === `accept.${id}`)
    file.info(evaluateMessages.unusedWaiver(id, block.id, kind), {place: e ? {line: e.line, column: e.column} : block.position?.start, ruleId: 'unused-waiver', source: SOURCE})
  }
  return notes.map((n) => {
    const reason = waivers.get(n.rule)
    return reason === undefined ? n : {...n, accepted: reason}
  })
}
