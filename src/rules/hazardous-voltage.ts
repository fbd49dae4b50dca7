/**
 * hazardous-voltage: the stage works at, or is connected to, a hazard.
 *
 * What it checks: a supply span above 60 V DC (commonly taken as the upper limit of extra-low
 * voltage for DC, common practice), and the note's hazard contexts `mains-connected` and
 * `high-voltage` (`patient-connected` has a rule of its own, `patient-connected.ts`).
 *
 * When it fires: any of these holds. Severity safety.
 *
 * What it recommends: the usual cautions for each hazard found (isolation, creepage and
 * clearance, touch and leakage current, stored energy, protective earthing), and an explicit
 * deferral to local codes, the applicable safety standards and licensed professional practice.
 * It is a reminder, not a safety assessment; the note says so.
 */
import type {HazardContext} from '../note/types.js'
import {formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const SPAN_LIMIT = 60

/** The deferral every safety note ends with. */
export const DEFERRAL = 'These are reminders, not a safety assessment: follow the local codes and the safety standards that ' +
  'apply to the product, and have the design assessed and signed off under licensed professional practice.'

const CAUTION: Record<Exclude<HazardContext, 'battery' | 'patient-connected'>, string> = {
  'mains-connected':
    'Mains-connected: check the isolation barrier (basic, double or reinforced insulation as the parts that can be touched require), ' +
    'creepage and clearance for the working voltage, overvoltage category and pollution degree, protective earthing and fusing, ' +
    'and touch current.',
  'high-voltage':
    'High voltage: check clearance and creepage across the board and along high-value input resistors (split them in series so ' +
    'each carries its share of the voltage), the energy stored in capacitors (bleed resistors, discharge before handling), ' +
    'and protection of the amplifier inputs against flashover and transients.'
}

function check({input, context}: RuleContext): RuleFinding[] {
  const span = input.supply[1] - input.supply[0]
  const parts: string[] = []
  if (span > SPAN_LIMIT) {
    parts.push(
      `The supply spans ${formatQuantity(span, 'V')}, above ${SPAN_LIMIT} V DC: treat the supply rails, the output and anything ` +
      'they can reach as hazardous live parts (insulation, spacing, guarding, stored energy in the supply capacitors).'
    )
  }
  for (const hazard of ['mains-connected', 'high-voltage'] as const) {
    if (context.includes(hazard)) parts.push(CAUTION[hazard])
  }
  if (parts.length === 0) return []
  return [{
    severity: 'safety',
    text:
      `${parts.join(' ')} ${DEFERRAL}`
  }]
}

const rule: Rule<'hazardous-voltage'> = {id: 'hazardous-voltage', check}
export default rule
