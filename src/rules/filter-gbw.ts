/**
 * filter-gbw: the op-amp is too slow for the active filter (DESIGN §8.4).
 *
 * What it checks: the op-amp's gain-bandwidth product against 100 × f0 × Q of a low-pass
 * stage (f0 and Q as solved; common practice for low-distortion active filters: below that
 * the amplifier's own roll-off shifts f0 and Q and the response departs from the design).
 *
 * When it fires: gbw < 100 · f0 · Q. Severity caution.
 *
 * What it recommends: a faster amplifier (it quotes the GBW that meets the rule), or a lower
 * Q or f0 per section.
 */
import {formatNumber, formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const FACTOR = 100

function check({input, result}: RuleContext): RuleFinding[] {
  const f = result.filter
  if (f === null || f.f0 === null || f.q === null) return []
  const need = FACTOR * f.f0 * f.q
  if (input.opamp.gbw >= need) return []
  return [{
    severity: 'caution',
    text:
      `The op-amp's GBW of ${formatQuantity(input.opamp.gbw, 'Hz')} is under 100 × f0 × Q = ${formatQuantity(need, 'Hz')} ` +
      `(f0 ${formatQuantity(f.f0, 'Hz')}, Q ${formatNumber(f.q)}): the amplifier's own roll-off moves f0 and Q, so the response will deviate from the ` +
      `design values (the figures here include that deviation). Consider an amplifier with at least ${formatQuantity(need, 'Hz')} GBW, or a lower Q per section.`
  }]
}

const rule: Rule<'filter-gbw'> = {id: 'filter-gbw', check}
export default rule
