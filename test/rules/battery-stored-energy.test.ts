import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/battery-stored-energy.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/battery-stored-energy', () => {
  it('adds an info note on short-circuit current and stored energy in a battery context', () => {
    const input = stageInput({supply: [0, 3.6]})
    const notes = rule.check(ruleContext(input, stageResult({}, input), ['battery']))
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('3.6 V')
    expect(notes[0]!.text).toContain('short-circuit current')
  })

  it('stays silent without the battery context', () => {
    expect(rule.check(ruleContext(stageInput(), stageResult(), ['mains-connected']))).toEqual([])
  })
})
