import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/bias-over-temperature-missing.js'
import {formatTemperature} from '../../src/units/format.js'
import {opamp, ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/bias-over-temperature-missing', () => {
  it.each([
    ['a bipolar input, cold end named', stageInput({temperature: [-40, 85]}), 'largest at the cold end'],
    ['a zero-drift input, switching named', stageInput({temperature: [0, 70], opamp: opamp({inputType: 'zero-drift'})}), 'switching']
  ])('cautions for %s', (_name, input, reason) => {
    const notes = rule.check(ruleContext(input, stageResult({bias: {overTemperatureMissing: true}}, input)))
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain(formatTemperature(input.temperature[0]))
    expect(notes[0]!.text).toContain(reason)
  })

  it('stays silent when the engine does not flag it', () => {
    const input = stageInput({temperature: [-40, 85]})
    expect(rule.check(ruleContext(input, stageResult({bias: {overTemperatureMissing: false}}, input)))).toEqual([])
  })
})
