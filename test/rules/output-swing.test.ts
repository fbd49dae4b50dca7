import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/output-swing.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/output-swing', () => {
  it('warns when the span overshoots the upper limit by 1.2 V', () => {
    const result = stageResult({swing: {outputSpan: [-15, 15], allowed: [-13.8, 13.8], excess: [1.2, 1.2], fits: false}})
    const notes = rule.check(ruleContext(stageInput(), result))
    expect(notes.map((n) => n.severity)).toEqual(['warning'])
    expect(notes[0]!.text).toContain('1.2 V below the lower limit and 1.2 V above the upper limit')
    expect(notes[0]!.text).toContain('13.8 V')
  })

  it('names only the end that overshoots', () => {
    const result = stageResult({swing: {outputSpan: [0, 5], allowed: [0.05, 4.95], excess: [0.05, 0.05], fits: false}})
    expect(rule.check(ruleContext(stageInput(), result))[0]!.text).toContain('50 mV below')
  })

  it('stays silent when the span fits', () => {
    expect(rule.check(ruleContext(stageInput(), stageResult()))).toEqual([])
  })
})

describe('rules/output-swing without headroom data (DESIGN §4.6)', () => {
  it('raises a caution that the check is skipped, never a silent 0 V', () => {
    const notes = rule.check(ruleContext(stageInput(), stageResult({requirements: [
      {key: 'output-swing', kind: 'limit', value: [-1.1, 1.1], limit: null, met: null, missing: ['swing-headroom']}
    ]})))
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain('output-swing limit is skipped')
  })
})
