/**
 * A short title per rule, for the cover's list of open notes ("Bandwidth margin"). A closed
 * map over the rule ids, so a rule added without a title fails to compile.
 */
import type {NoteRuleId} from '../rules/index.js'

export const RULE_TITLES: Record<NoteRuleId, string> = {
  'chain-aliasing': 'Chain bandwidth above half the sample rate',
  'chain-range-underused': 'Converter range under-used',
  'chain-later-stage-noise': 'A later stage dominates the chain noise',
  'chain-converter-noise': 'Converter noise dominates',
  'chain-riso-divider': 'Isolation resistor into the next stage’s input',
  'hazardous-voltage': 'Hazardous voltage or mains',
  'patient-connected': 'Patient-connected equipment',
  'battery-stored-energy': 'Battery stored energy',
  'phase-margin-low': 'Phase margin low',
  'capacitive-load': 'Capacitive load on the output',
  'transimpedance-feedback-cap': 'Transimpedance feedback capacitor',
  'follower-feedback-resistor': 'Follower feedback resistor',
  'output-swing': 'Output swing',
  'limit-data-missing': 'Limit data not entered',
  'bandwidth-margin': 'Bandwidth margin',
  'filter-gbw': 'Filter GBW against f0·Q',
  'bias-compensation-resistor': 'Bias-compensation resistor',
  'matched-dc-resistance': 'Matched DC resistance',
  'lower-bias-input-type': 'Lower-bias input type',
  'fet-bias-hot-end': 'FET bias current at the hot end',
  'bias-over-temperature-missing': 'Bias current over temperature not entered',
  'temperature-not-entered': 'Temperature range not entered',
  'yield-unavailable': 'Monte Carlo yield not available',
  'resistor-noise-dominant': 'Resistor noise dominant',
  'low-value-resistor': 'Low-value resistor',
  'e-series-values': 'Resistor values off the E series'
}
