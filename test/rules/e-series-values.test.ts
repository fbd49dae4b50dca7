import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/e-series-values.js'
import {resistor, ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/e-series-values', () => {
  it('lists rf = 47.3 kΩ with its nearest E96 (47.5 kΩ) and E24 (47 kΩ) values', () => {
    const input = stageInput({rf: resistor(47.3e3), rg: resistor(4.99e3)})
    const notes = rule.check(ruleContext(input, stageResult({}, input)))
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('rf = 47.3 kΩ (nearest E96 47.5 kΩ, nearest E24 47 kΩ)')
    expect(notes[0]!.text).not.toContain('rg =')
  })

  it('checks rcomp too', () => {
    const input = stageInput({rcomp: resistor(923)})
    expect(rule.check(ruleContext(input, stageResult({}, input)))[0]!.text).toContain('rcomp = 923 Ω')
  })

  it.each([
    ['E96 and E24 values (49.9 kΩ, 4.7 kΩ)', stageInput({rf: resistor(49.9e3), rg: resistor(4.7e3)})],
    ['an off-series source resistance', stageInput({rs: resistor(1234)})]
  ])('stays silent with %s', (_name, input) => {
    expect(rule.check(ruleContext(input, stageResult({}, input)))).toEqual([])
  })
})
