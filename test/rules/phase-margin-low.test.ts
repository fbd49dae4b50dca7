import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/phase-margin-low.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/phase-margin-low', () => {
  it('warns at 38° and quotes the margin and the crossover', () => {
    const notes = rule.check(ruleContext(stageInput(), stageResult({stability: {phaseMargin: 38, crossover: 120e3, peaking: 3.2}})))
    expect(notes).toHaveLength(1)
    expect(notes[0]!.severity).toBe('warning')
    expect(notes[0]!.text).toContain('is 38°')
    expect(notes[0]!.text).toContain('120 kHz')
    expect(notes[0]!.text).toContain('3.2 dB')
  })

  it.each([
    ['50°', 50],
    ['exactly 45°', 45],
    ['no crossover (null)', null]
  ])('stays silent with %s', (_name, phaseMargin) => {
    expect(rule.check(ruleContext(stageInput(), stageResult({stability: {phaseMargin}})))).toEqual([])
  })
})
