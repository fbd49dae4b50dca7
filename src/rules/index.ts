/**
 * The practice and safety rules (DESIGN §4.5), in the order their notes are listed.
 *
 * Each rule lives in its own file with a header saying what it checks, when it fires and what
 * it recommends, and returns plain findings. This module keeps them in a typed table keyed by
 * rule id (so a listed id without a rule, or a rule under the wrong id, fails to type-check),
 * runs them on one evaluated stage and stamps each finding with its rule id.
 */
import batteryStoredEnergy from './battery-stored-energy.js'
import bandwidthMargin from './bandwidth-margin.js'
import biasCompensationResistor from './bias-compensation-resistor.js'
import biasOverTemperatureMissing from './bias-over-temperature-missing.js'
import capacitiveLoad from './capacitive-load.js'
import eSeriesValues from './e-series-values.js'
import fetBiasHotEnd from './fet-bias-hot-end.js'
import filterGbw from './filter-gbw.js'
import followerFeedbackResistor from './follower-feedback-resistor.js'
import hazardousVoltage from './hazardous-voltage.js'
import limitDataMissing from './limit-data-missing.js'
import lowValueResistor from './low-value-resistor.js'
import lowerBiasInputType from './lower-bias-input-type.js'
import matchedDcResistance from './matched-dc-resistance.js'
import outputSwing from './output-swing.js'
import patientConnected from './patient-connected.js'
import phaseMarginLow from './phase-margin-low.js'
import resistorNoiseDominant from './resistor-noise-dominant.js'
import temperatureNotEntered from './temperature-not-entered.js'
import transimpedanceFeedbackCap from './transimpedance-feedback-cap.js'
import yieldUnavailable from './yield-unavailable.js'
import {RULE_IDS, type RuleId} from './ids.js'
import type {Rule, RuleContext} from './rule.js'
import type {RuleNote} from './types.js'

export type {Rule, RuleContext, RuleFinding} from './rule.js'

export {CHAIN_RULE_IDS, RULE_IDS, isNoteRuleId, isRuleId, type ChainRuleId, type NoteRuleId, type RuleId} from './ids.js'

/** Every rule under its own id. */
export const RULES: {readonly [Id in RuleId]: Rule<Id>} = {
  'hazardous-voltage': hazardousVoltage,
  'patient-connected': patientConnected,
  'battery-stored-energy': batteryStoredEnergy,
  'phase-margin-low': phaseMarginLow,
  'capacitive-load': capacitiveLoad,
  'filter-gbw': filterGbw,
  'transimpedance-feedback-cap': transimpedanceFeedbackCap,
  'follower-feedback-resistor': followerFeedbackResistor,
  'output-swing': outputSwing,
  'limit-data-missing': limitDataMissing,
  'bandwidth-margin': bandwidthMargin,
  'bias-compensation-resistor': biasCompensationResistor,
  'matched-dc-resistance': matchedDcResistance,
  'lower-bias-input-type': lowerBiasInputType,
  'fet-bias-hot-end': fetBiasHotEnd,
  'bias-over-temperature-missing': biasOverTemperatureMissing,
  'temperature-not-entered': temperatureNotEntered,
  'yield-unavailable': yieldUnavailable,
  'resistor-noise-dominant': resistorNoiseDominant,
  'low-value-resistor': lowValueResistor,
  'e-series-values': eSeriesValues
}

/**
 * Run every rule on one stage, in `RULE_IDS` order, and stamp each note with its rule id.
 */
export function runRules(ctx: RuleContext): RuleNote[] {
  const notes: RuleNote[] = []
  for (const id of RULE_IDS) {
    for (const finding of RULES[id].check(ctx)) notes.push({rule: id, ...finding})
  }
  return notes
}
