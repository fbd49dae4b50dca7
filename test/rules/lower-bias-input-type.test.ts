import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/lower-bias-input-type.js'
import {opamp, resistor, ruleContext, stageInput, stageResult} from './helpers.js'

// A bipolar stage fed from 1 MΩ: invented numbers, in output volts.
const input = stageInput({rs: resistor(1e6)})

describe('rules/lower-bias-input-type', () => {
  it('names lower-bias input types when current noise exceeds voltage noise', () => {
    const result = stageResult({noise: {en: 1e-6, 'in+': 3e-6, 'r:rs': 1e-6}, dc: {vos: 1e-3, ib: 1e-4}}, input)
    const notes = rule.check(ruleContext(input, result))
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('bias-cancelled bipolar, JFET or CMOS')
    expect(notes[0]!.text).toContain('3 µV rms')
    // en/in of the precision-bipolar archetype: 8 nV/√Hz ÷ 0.12 pA/√Hz ≈ 66.7 kΩ.
    expect(notes[0]!.text).toContain('66.7 kΩ')
  })

  it('fires when the bias-current terms are the largest DC group', () => {
    const result = stageResult({noise: {en: 2e-6}, dc: {vos: 1e-4, ib: 5e-4, ios: 1e-4}}, input)
    const notes = rule.check(ruleContext(input, result))
    expect(notes[0]!.text).toContain('600 µV of worst-case DC error against 100 µV')
  })

  it('cautions when an error requirement fails', () => {
    const result = stageResult({
      dc: {vos: 1e-4, ib: 5e-4},
      requirements: [{key: 'output-error', kind: 'require', limit: 3e-4, value: 6e-4, met: false}]
    }, input)
    const notes = rule.check(ruleContext(input, result))
    expect(notes[0]!.severity).toBe('caution')
    expect(notes[0]!.text).toContain('output-error')
  })

  it('tells a CMOS stage to lower the resistances instead', () => {
    const cmos = stageInput({opamp: opamp({inputType: 'cmos', ib: 1e-12, ios: 0.5e-12})})
    const notes = rule.check(ruleContext(cmos, stageResult({dc: {ib: 5e-4, vos: 1e-4}}, cmos)))
    expect(notes[0]!.text).toContain('lower the resistances')
  })

  it('stays silent when voltage noise and vos dominate', () => {
    const result = stageResult({noise: {en: 3e-6, 'in+': 1e-6}, dc: {vos: 1e-3, ib: 1e-4}}, input)
    expect(rule.check(ruleContext(input, result))).toEqual([])
  })
})
