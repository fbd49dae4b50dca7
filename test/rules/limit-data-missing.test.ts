import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/limit-data-missing.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/limit-data-missing', () => {
  it('names the keys of a skipped limit, as an info note', () => {
    const notes = rule.check(ruleContext(stageInput(), stageResult({requirements: [
      {key: 'output-current', kind: 'limit', value: 1e-3, limit: null, met: null, missing: ['iout-max']},
      {key: 'input-common-mode', kind: 'limit', value: [0, 1], limit: null, met: null, missing: ['cm-headroom', 'cm-headroom-neg', 'cm-headroom-pos']}
    ]})))
    expect(notes.map((n) => n.severity)).toEqual(['info', 'info'])
    expect(notes[0]!.text).toContain('enter iout-max')
    expect(notes[1]!.text).toContain('cm-headroom (or cm-headroom-neg and cm-headroom-pos)')
  })
  it('says when only one rail is checked, and is silent when every limit has its data', () => {
    const one = rule.check(ruleContext(stageInput(), stageResult({requirements: [
      {key: 'input-common-mode', kind: 'limit', value: [0, 1], limit: [-0.1, null], met: true, missing: ['cm-headroom-pos (or cm-headroom)']}
    ]})))
    expect(one[0]!.text).toContain('one rail only')
    expect(rule.check(ruleContext(stageInput(), stageResult({requirements: [
      {key: 'output-current', kind: 'limit', value: 1e-3, limit: 10e-3, met: true, missing: []}
    ]})))).toEqual([])
  })
})
