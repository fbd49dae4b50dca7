import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/filter-gbw.js'
import {opamp, ruleContext, stageInput, stageResult} from './helpers.js'

const filter = (gbw: number) => {
  const input = stageInput({topology: 'lowpass-sallen-key', opamp: opamp({gbw}), rf: null, rg: null})
  return ruleContext(input, {...stageResult({}, input), filter: {f0: 10e3, q: 2, passbandGain: 1}})
}

describe('rules/filter-gbw', () => {
  it('cautions when GBW < 100 × f0 × Q (2 MHz here) and quotes the figures', () => {
    const notes = rule.check(filter(1e6))
    expect(notes).toHaveLength(1)
    expect(notes[0]!.severity).toBe('caution')
    expect(notes[0]!.text).toContain('100 × f0 × Q = 2 MHz')
    expect(notes[0]!.text).toContain('Q 2')
  })
  it('stays silent at 100 × f0 × Q and for stages without filter figures', () => {
    expect(rule.check(filter(2e6))).toEqual([])
    expect(rule.check(ruleContext(stageInput(), stageResult()))).toEqual([])
  })
})
