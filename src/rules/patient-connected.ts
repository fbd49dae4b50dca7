/**
 * patient-connected: the note's context says the equipment connects to a patient.
 *
 * What it checks: the front matter's hazard context `patient-connected`.
 *
 * When it fires: that context is given. Severity safety, with its own id so that a reviewer
 * sees (and an author can only accept) the patient hazard by name, apart from high voltage
 * and mains.
 *
 * What it recommends: the usual cautions for an applied part (patient leakage and auxiliary
 * currents in normal and single-fault conditions, isolation from mains and earth,
 * defibrillation protection where it applies, a safe input if the amplifier fails), and the
 * deferral to local codes, the applicable safety standards and licensed practice.
 */
import {DEFERRAL} from './hazardous-voltage.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

function check({context}: RuleContext): RuleFinding[] {
  if (!context.includes('patient-connected')) return []
  return [{
    severity: 'safety',
    text:
      'Patient-connected: check patient leakage and auxiliary currents in normal and single-fault conditions, the isolation of the ' +
      'applied part from mains and from earth, protection against defibrillation where it applies, and that the input stays safe ' +
      `if the amplifier fails. ${DEFERRAL}`
  }]
}

const rule: Rule<'patient-connected'> = {id: 'patient-connected', check}
export default rule
