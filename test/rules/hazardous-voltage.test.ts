import {describe, expect, it} from 'vitest'
import type {HazardContext} from '../../src/note/types.js'
import rule from '../../src/rules/hazardous-voltage.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

const DEFERRAL = 'follow the local codes and the safety standards'

describe('rules/hazardous-voltage', () => {
  it.each([
    ['a ±40 V supply (80 V span)', stageInput({supply: [-40, 40]}), [], '80 V'],
    ['mains-connected', stageInput(), ['mains-connected'], 'creepage and clearance'],
    ['high-voltage', stageInput(), ['high-voltage'], 'stored in capacitors']
  ] as const)('raises a safety note for %s, with the deferral', (_name, input, context, quoted) => {
    const notes = rule.check(ruleContext(input, stageResult({}, input), context as readonly HazardContext[]))
    expect(notes.map((n) => n.severity)).toEqual(['safety'])
    expect(notes[0]!.text).toContain(quoted)
    expect(notes[0]!.text).toContain(DEFERRAL)
    expect(notes[0]!.text).toContain('licensed professional practice')
  })

  it.each([
    ['±15 V and no context', stageInput(), []],
    ['exactly 60 V (0 .. 60 V)', stageInput({supply: [0, 60]}), []],
    ['only a battery context', stageInput(), ['battery']],
    ['only a patient-connected context (its own rule)', stageInput(), ['patient-connected']]
  ] as const)('stays silent with %s', (_name, input, context) => {
    expect(rule.check(ruleContext(input, stageResult({}, input), context as readonly HazardContext[]))).toEqual([])
  })
})
