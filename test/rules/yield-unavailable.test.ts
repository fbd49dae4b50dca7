import {describe, expect, it} from 'vitest'
import {evaluateStage} from '../../src/engine/evaluate.js'
import rule from '../../src/rules/yield-unavailable.js'
import {stageFrom} from '../support/stage-input.js'
import {ruleContext} from './helpers.js'

describe('rules/yield-unavailable', () => {
  it('says so (info) when a stage’s Monte Carlo is marked unavailable, naming the worst case to judge it on', () => {
    // Every topology has a model today (instrumentation on its block model), so the
    // unavailable result is made by hand from a computed one: the rule reads only that mark.
    const input = stageFrom('engine', {yield: {trials: 1000, seed: 1, distribution: 'uniform'}})
    const result = evaluateStage(input)
    const marked = {...result, yield: {...result.yield!, unavailable: 'the stage has no model for the Monte Carlo'}}
    const notes = rule.check(ruleContext(input, marked))
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('No Monte Carlo yield for this stage: the stage has no model for the Monte Carlo')
  })
  it('is silent with a yield computed (an instrumentation stage too), and with none asked for', async () => {
    const input = stageFrom('engine', {yield: {trials: 1000, seed: 1, distribution: 'uniform'}})
    expect(rule.check(ruleContext(input, evaluateStage(input)))).toEqual([])
    const {INA_ARCHETYPES} = await import('../../src/engine/ina-archetypes.js')
    const ina = Object.values(INA_ARCHETYPES)[0]!
    const inaStage = stageFrom('engine', {
      topology: 'instrumentation', ina, rf: null, rs: null, rg: {value: 1e3, tolerance: 0.001, tempco: 25e-6}, input: [-0.01, 0.01],
      yield: {trials: 1000, seed: 1, distribution: 'uniform'}, require: {'output-error': 1e-2}
    })
    const r = evaluateStage(inaStage)
    expect(r.yield?.unavailable).toBeNull()
    expect(rule.check(ruleContext(inaStage, r))).toEqual([])
    const off = stageFrom('engine')
    expect(rule.check(ruleContext(off, evaluateStage(off)))).toEqual([])
  })
})
