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
  'transimpedance-feedback-cap',
  'follower-feedback-resistor',
  'output-swing',
  'bandwidth-margin',
  'bias-compensation-resistor',
  'matched-dc-resistance',
  'lower-bias-input-type',
  'fet-bias-hot-end',
  'bias-over-temperature-missing',
  'resistor-noise-dominant',
  'low-value-resistor',
  'e-series-values'
] as const
export type RuleId = (typeof RULE_IDS)[number]
export const isRuleId = (s: string): s is RuleId => (RULE_IDS as readonly string[]).includes(s)
