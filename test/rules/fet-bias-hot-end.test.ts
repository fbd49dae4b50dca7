import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/fet-bias-hot-end.js'
import {opamp, ruleContext, stageInput, stageResult} from './helpers.js'

// Invented JFET input: 5 pA at 25 °C, doubling every 10 K → 2^6 = 64 × at 85 °C.
const jfet = opamp({inputType: 'jfet', ib: 5e-12, ios: 2e-12})
const hot = stageInput({opamp: jfet, temperature: [-40, 85]})
const bias = {ibMax: 320e-12, iosMax: 128e-12, ibSource: 'doubling', iosSource: 'doubling'} as const

describe('rules/fet-bias-hot-end', () => {
  it('cautions when ib + ios (600 µV) pass half a 1 mV output-error limit', () => {
    const input = {...hot, require: {'output-error': 1e-3}}
    const notes = rule.check(ruleContext(input, stageResult({dc: {ib: 4e-4, ios: 2e-4, vos: 3e-3}, bias}, input)))
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain('85 °C')
    expect(notes[0]!.text).toContain('64 ×')
    expect(notes[0]!.text).toContain('60 %')
  })

  it('without a requirement, cautions when ib + ios exceed the vos terms', () => {
    const notes = rule.check(ruleContext(hot, stageResult({dc: {ib: 4e-4, ios: 2e-4, vos: 3e-4, 'vos-drift': 2e-4}, bias}, hot)))
    expect(notes[0]!.text).toContain('more than the 500 µV from vos')
  })

  it.each([
    ['a 25 °C range', {...hot, temperature: [25, 25]}],
    ['a bipolar input', stageInput({temperature: [-40, 85]})],
    ['ib + ios under half the limit', {...hot, require: {'output-error': 2e-3}}]
  ] as const)('stays silent with %s', (_name, input) => {
    expect(rule.check(ruleContext(input, stageResult({dc: {ib: 4e-4, ios: 2e-4, vos: 3e-3}, bias}, input)))).toEqual([])
  })
})
