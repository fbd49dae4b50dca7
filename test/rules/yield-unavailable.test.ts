import {describe, expect, it} from 'vitest'
import {evaluateStage} from '../../src/engine/evaluate.js'
import rule from '../../src/rules/yield-unavailable.js'
import {stageFrom} from '../support/stage-input.js'
import {ruleContext} from './helpers.js'

describe('rules/yield-unavailable', () => {
  it('says so (info) when a Monte Carlo is asked of an instrumentation stage, and its yield requirement is not met', async () => {
    const {INA_ARCHETYPES} = await import('../../src/engine/ina-archetypes.js')
    const ina = Object.values(INA_ARCHETYPES)[0]!
    const input = stageFrom('engine', {
      topology: 'instrumentation', ina, rf: null, rs: null, rg: {value: 1e3, tolerance: 0.001, tempco: 25e-6}, input: [-0.01, 0.01],
      yield: {trials: 1000, seed: 1, distribution: 'uniform'}, require: {'output-error': 1e-2, yield: 0.99}
    })
    const result = evaluateStage(input)
    expect(result.yield?.unavailable).toMatch(/no closed-form DC solution/)
    expect(result.requirements.find((r) => r.key === 'yield')).toMatchObject({value: null, met: false})
    const notes = rule.check(ruleContext(input, result))
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('No Monte Carlo yield for this stage')
  })
  it('is silent with a yield computed, and with none asked for', () => {
    const input = stageFrom('engine', {yield: {trials: 1000, seed: 1, distribution: 'uniform'}})
    expect(rule.check(ruleContext(input, evaluateStage(input)))).toEqual([])
    const off = stageFrom('engine')
    expect(rule.check(ruleContext(off, evaluateStage(off)))).toEqual([])
  })
})
