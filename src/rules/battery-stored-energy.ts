/**
 * battery-stored-energy: a battery-powered or battery-connected design.
 *
 * What it checks: the note's `battery` hazard context.
 *
 * When it fires: that context is given. Severity info (the energy is low-voltage but not small).
 *
 * What it recommends: fusing or current limiting near the cell, short-circuit and
 * reverse-connection protection, and that stored energy stays when the unit is off; defers to
 * the cell maker's guidance and the applicable battery-safety standards.
 */
import {formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

function check({input, context}: RuleContext): RuleFinding[] {
  if (!context.includes('battery')) return []
  const span = input.supply[1] - input.supply[0]
  return [{
    severity: 'info',
    text:
      `Battery context (supply span ${formatQuantity(span, 'V')}): a cell can deliver a large short-circuit current and keeps its ` +
      'energy when the unit is switched off. Consider a fuse or current limit close to the cell, traces and connectors sized for ' +
      'the fault current, protection against reverse connection, and the amplifier inputs staying within the rails while the ' +
      'supply comes up. Follow the cell maker’s guidance and the applicable battery-safety standards.'
  }]
}

const rule: Rule<'battery-stored-energy'> = {id: 'battery-stored-energy', check}
export default rule
