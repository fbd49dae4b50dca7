import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/resistor-noise-dominant.js'
import {resistor, ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/resistor-noise-dominant', () => {
  it('quotes an 83.3 % share (rf 2 µV, rg 1 µV, en 1 µV) and advises lower impedances', () => {
    const input = stageInput()
    const notes = rule.check(ruleContext(input, stageResult({noise: {'r:rf': 2e-6, 'r:rg': 1e-6, en: 1e-6}}, input)))
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('83.3 %')
    expect(notes[0]!.text).toContain('largest is rf')
    expect(notes[0]!.text).toContain('lower impedances')
  })

  it('tells a transimpedance stage that a larger rf helps', () => {
    const tia = stageInput({topology: 'transimpedance', rf: resistor(1e6), rg: null})
    const notes = rule.check(ruleContext(tia, stageResult({noise: {'r:rf': 2e-6, en: 1e-6}}, tia)))
    expect(notes[0]!.text).toContain('√(4kT/Rf) falls as rf rises')
  })

  it('says the source resistance noise is the source’s own', () => {
    const input = stageInput({rs: resistor(100e3)})
    const notes = rule.check(ruleContext(input, stageResult({noise: {'r:rs': 3e-6, en: 1e-6}}, input)))
    expect(notes[0]!.text).toContain('source’s own thermal noise')
  })

  it('cautions when the noise requirement fails', () => {
    const input = stageInput()
    const result = stageResult({
      noise: {'r:rf': 2e-6, en: 1e-6},
      requirements: [{key: 'noise-rms', kind: 'require', limit: 1e-6, value: 2.2e-6, met: false}]
    }, input)
    expect(rule.check(ruleContext(input, result))[0]!.severity).toBe('caution')
  })

  it('stays silent at a 40 % share', () => {
    const input = stageInput()
    // rf² = 0.4, en² = 0.6 of the power.
    const notes = rule.check(ruleContext(input, stageResult({noise: {'r:rf': Math.sqrt(0.4) * 1e-6, en: Math.sqrt(0.6) * 1e-6}}, input)))
    expect(notes).toEqual([])
  })
})
