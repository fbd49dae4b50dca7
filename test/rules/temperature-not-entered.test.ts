import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/temperature-not-entered.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/temperature-not-entered', () => {
  it('cautions when drift and tempco are zero only because no range was entered', () => {
    const input = stageInput({temperatureEntered: false})
    const notes = rule.check(ruleContext(input, stageResult({}, input)))
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain('vos-drift and the tempco of rf, rg contribute nothing')
  })
  it('is silent when the range was entered (even 25 °C), or when nothing drifts', () => {
    const entered = stageInput({temperatureEntered: true})
    expect(rule.check(ruleContext(entered, stageResult({}, entered)))).toEqual([])
    const still = stageInput({temperatureEntered: false, rf: {value: 10e3, tolerance: 0, tempco: 0}, rg: {value: 1e3, tolerance: 0, tempco: 0}})
    const op = {...still, opamp: {...still.opamp, vosDrift: 0}}
    expect(rule.check(ruleContext(op, stageResult({}, op)))).toEqual([])
  })
})
