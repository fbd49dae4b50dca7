import {describe, expect, it} from 'vitest'
import type {HazardContext} from '../../src/note/types.js'
import rule from '../../src/rules/patient-connected.js'
import {runRules} from '../../src/rules/index.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

const notesFor = (context: readonly HazardContext[]) => rule.check(ruleContext(stageInput(), stageResult({}, stageInput()), context))

describe('rules/patient-connected', () => {
  it('raises a safety note for a patient-connected context, with the deferral', () => {
    const notes = notesFor(['patient-connected'])
    expect(notes.map((n) => n.severity)).toEqual(['safety'])
    expect(notes[0]!.text).toContain('patient leakage')
    expect(notes[0]!.text).toContain('licensed professional practice')
  })

  it('carries its own rule id, apart from the high-voltage note', () => {
    const input = stageInput()
    const ids = runRules(ruleContext(input, stageResult({}, input), ['patient-connected', 'high-voltage'])).filter((n) => n.severity === 'safety').map((n) => n.rule)
    expect(ids).toEqual(['hazardous-voltage', 'patient-connected'])
    const patientOnly = runRules(ruleContext(input, stageResult({}, input), ['patient-connected'])).filter((n) => n.severity === 'safety')
    expect(patientOnly.map((n) => n.rule)).toEqual(['patient-connected'])
  })

  it.each([[[]], [['mains-connected']], [['battery']]] as const)('stays silent with context %j', (context) => {
    expect(notesFor(context as readonly HazardContext[])).toEqual([])
  })
})
