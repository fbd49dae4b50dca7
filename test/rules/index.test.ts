import {describe, expect, it} from 'vitest'
import {RULE_IDS, RULES, isRuleId, runRules} from '../../src/rules/index.js'
import {resistor, ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/index', () => {
  it('lists unique kebab-case rule ids', () => {
    expect(new Set(RULE_IDS).size).toBe(RULE_IDS.length)
    expect(RULE_IDS.filter((id) => !/^[a-z]+(-[a-z]+)*$/.test(id))).toEqual([])
  })

  it.each(RULE_IDS.map((id) => [id]))('keeps rule %s under its own id', (id) => {
    expect(RULES[id].id).toBe(id)
  })

  it('recognises rule ids', () => {
    expect([isRuleId('output-swing'), isRuleId('no-such-rule')]).toEqual([true, false])
  })

  it('stamps rule ids and keeps RULE_IDS order', () => {
    const input = stageInput({rf: resistor(47.3e3), supply: [-40, 40]})
    const notes = runRules(ruleContext(input, stageResult({}, input), ['battery']))
    expect(notes.map((n) => [n.rule, n.severity])).toEqual([
      ['hazardous-voltage', 'safety'],
      ['battery-stored-energy', 'info'],
      ['e-series-values', 'info']
    ])
  })

  it('returns no notes for a clean stage', () => {
    expect(runRules(ruleContext(stageInput(), stageResult()))).toEqual([])
  })
})
