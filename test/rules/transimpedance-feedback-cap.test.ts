import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/transimpedance-feedback-cap.js'
import {formatQuantity} from '../../src/units/format.js'
import {resistor, ruleContext, stageInput, stageResult} from './helpers.js'

const tia = stageInput({topology: 'transimpedance', rf: resistor(10e6), rg: null, csource: 20e-12, band: [1, 500]})

describe('rules/transimpedance-feedback-cap', () => {
  it('cautions at 41° with Cf = 0 and quotes the suggested 2.2 pF and its corner', () => {
    const notes = rule.check(ruleContext(tia, stageResult({stability: {phaseMargin: 41, suggestedCf: 2.2e-12}}, tia)))
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain(formatQuantity(2.2e-12, 'F'))
    // 1/(2π · 10 MΩ · 2.2 pF) ≈ 7.23 kHz, above 10 × 500 Hz: no bandwidth remark.
    expect(notes[0]!.text).toContain(formatQuantity(1 / (2 * Math.PI * 10e6 * 2.2e-12), 'Hz'))
    expect(notes[0]!.text).not.toContain('ten times')
  })

  it('flags a suggested Cf whose corner falls inside ten times the band top', () => {
    const notes = rule.check(ruleContext(tia, stageResult({stability: {phaseMargin: 41, suggestedCf: 10e-12}}, tia)))
    expect(notes[0]!.text).toContain('ten times')
  })

  it('cautions when no Cf up to 1 µF reaches 60°', () => {
    const notes = rule.check(ruleContext(tia, stageResult({stability: {phaseMargin: 30, suggestedCf: null}}, tia)))
    expect(notes[0]!.text).toContain('no Cf up to 1 µF')
  })

  it.each([
    ['Cf already at the suggested value', {...tia, cf: 2.2e-12}, 41],
    ['a margin of 65°', tia, 65],
    ['a noninverting stage', stageInput(), 41]
  ] as const)('stays silent with %s', (_name, input, phaseMargin) => {
    expect(rule.check(ruleContext(input, stageResult({stability: {phaseMargin, suggestedCf: 2.2e-12}}, input)))).toEqual([])
  })
})
