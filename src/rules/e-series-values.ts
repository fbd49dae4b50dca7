/**
 * e-series-values: resistors that are not preferred values.
 *
 * What it checks: rf, rg and rcomp against the E96 and E24 series of IEC 60063 (E12/E48 values
 * lie on these). rs and rshunt describe the source, not a part to buy, and are left alone.
 *
 * When it fires: a checked resistor is on neither series. Severity info.
 *
 * What it recommends: the nearest E96 and E24 values for each such resistor (nearest by ratio).
 */
import type {Resistor, StageInput} from '../engine/types.js'
import {isOnSeries, nearestOnSeries} from './e-series.js'
import {formatQuantity} from '../units/format.js'
import type {Rule, RuleContext, RuleFinding} from './rule.js'

const CHECKED = ['rf', 'rg', 'rcomp'] as const satisfies readonly (keyof StageInput)[]

function describe(name: string, r: Resistor): string | null {
  if (isOnSeries(r.value, 'E96') || isOnSeries(r.value, 'E24')) return null
  const e96 = nearestOnSeries(r.value, 'E96')
  const e24 = nearestOnSeries(r.value, 'E24')
  if (e96 === null || e24 === null) return null
  return `${name} = ${formatQuantity(r.value, 'Ω')} (nearest E96 ${formatQuantity(e96, 'Ω')}, nearest E24 ${formatQuantity(e24, 'Ω')})`
}

function check({input}: RuleContext): RuleFinding[] {
  const off: string[] = []
  for (const name of CHECKED) {
    const r = input[name]
    if (r === null || !(r.value > 0)) continue
    const line = describe(name, r)
    if (line !== null) off.push(line)
  }
  if (off.length === 0) return []
  return [{
    severity: 'info',
    text:
      `Not on the E96 or E24 series (IEC 60063): ${off.join('; ')}. Consider a standard value, ` +
      'and recheck the gain and the budget with it, or state why this value is needed.'
  }]
}

const rule: Rule<'e-series-values'> = {id: 'e-series-values', check}
export default rule
