/**
 * The chain rules (DESIGN §8.6, issue #11 item 5), in the order their notes are listed: one
 * rule per file, kept in a typed table keyed by rule id, run on one evaluated chain.
 */
import chainAliasing from './chain-aliasing.js'
import chainConverterNoise from './chain-converter-noise.js'
import chainLaterStageNoise from './chain-later-stage-noise.js'
import chainRangeUnderused from './chain-range-underused.js'
import chainRisoDivider from './chain-riso-divider.js'
import type {RuleNote} from '../types.js'
import type {ChainRule, ChainRuleContext} from './rule.js'

export type {ChainRule, ChainRuleContext} from './rule.js'

import {CHAIN_RULE_IDS, type ChainRuleId} from '../ids.js'

export {CHAIN_RULE_IDS, type ChainRuleId} from '../ids.js'

export const CHAIN_RULES: {readonly [Id in ChainRuleId]: ChainRule<Id>} = {
  'chain-aliasing': chainAliasing,
  'chain-range-underused': chainRangeUnderused,
  'chain-later-stage-noise': chainLaterStageNoise,
  'chain-converter-noise': chainConverterNoise,
  'chain-riso-divider': chainRisoDivider
}

/** Run every chain rule, in `CHAIN_RULE_IDS` order, stamping each note with its rule id. */
export function runChainRules(ctx: ChainRuleContext): RuleNote[] {
  const notes: RuleNote[] = []
  for (const id of CHAIN_RULE_IDS) for (const finding of CHAIN_RULES[id].check(ctx)) notes.push({rule: id, ...finding})
  return notes
}
