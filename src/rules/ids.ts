/**
 * The ids of the practice and safety rules, in run order, as a closed set: `RuleNote.rule`,
 * the `accept:` map of a stage and `--strict` all use this type.
 */

/** Rule ids, in run order: safety first, then stability, swing, DC, noise, parts. */
export const RULE_IDS = [
  'hazardous-voltage',
  'patient-connected',
  'battery-stored-energy',
  'phase-margin-low',
  'capacitive-load',
  'transimpedance-feedback-cap',
  'follower-feedback-resistor',
  'output-swing',
  'limit-data-missing',
  'bandwidth-margin',
  'filter-gbw',
  'bias-compensation-resistor',
  'matched-dc-resistance',
  'lower-bias-input-type',
  'fet-bias-hot-end',
  'bias-over-temperature-missing',
  'temperature-not-entered',
  'yield-unavailable',
  'resistor-noise-dominant',
  'low-value-resistor',
  'e-series-values'
] as const
export type RuleId = (typeof RULE_IDS)[number]
export const isRuleId = (s: string): s is RuleId => (RULE_IDS as readonly string[]).includes(s)

/** Ids of the chain rules (DESIGN §8.6), run on a chain rather than a stage. */
export const CHAIN_RULE_IDS = ['chain-aliasing', 'chain-range-underused', 'chain-later-stage-noise', 'chain-converter-noise', 'chain-riso-divider'] as const
export type ChainRuleId = (typeof CHAIN_RULE_IDS)[number]

/** The id a note carries: a stage rule's or a chain rule's. */
export type NoteRuleId = RuleId | ChainRuleId
export const isNoteRuleId = (s: string): s is NoteRuleId => isRuleId(s) || (CHAIN_RULE_IDS as readonly string[]).includes(s)
