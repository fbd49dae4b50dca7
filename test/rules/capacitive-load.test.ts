import {describe, expect, it} from 'vitest'
import {evaluateStage} from '../../src/engine/index.js'
import rule from '../../src/rules/capacitive-load.js'
import {opamp, resistor, ruleContext, stageInput} from './helpers.js'

// A follower, rout 50 Ω (invented), driving 10 nF: the case of DESIGN §8.3.
const loaded = stageInput({topology: 'follower', rf: null, rg: null, opamp: opamp({rout: 50}), cload: 10e-9})

describe('rules/capacitive-load', () => {
  it('quotes the margin lost and the riso that gives it back, with the bandwidth left', () => {
    const notes = rule.check(ruleContext(loaded, evaluateStage(loaded)))
    expect(notes).toHaveLength(1)
    expect(notes[0]!.severity).toBe('warning')
    expect(notes[0]!.text).toMatch(/costs \d+(\.\d)?° of phase margin/)
    expect(notes[0]!.text).toMatch(/riso = [\d.]+ Ω .* back to 60°, leaving a closed-loop bandwidth of [\d.]+ [kM]?Hz/)
  })
  it('stays silent when the load costs little (riso already in place)', () => {
    const fixed = {...loaded, riso: resistor(100)}
    expect(rule.check(ruleContext(fixed, evaluateStage(fixed)))).toEqual([])
  })
  it('stays silent without cload', () => {
    const none = {...loaded, cload: 0}
    expect(rule.check(ruleContext(none, evaluateStage(none)))).toEqual([])
  })
})

describe('rules/capacitive-load without rout', () => {
  it('cautions that the loop cannot see the load', () => {
    const s = stageInput({topology: 'follower', rf: null, rg: null, opamp: opamp({rout: null}), cload: 10e-9})
    const notes = rule.check(ruleContext(s, evaluateStage(s)))
    expect(notes).toHaveLength(1)
    expect(notes[0]!.severity).toBe('caution')
    expect(notes[0]!.text).toContain('rout')
  })
})
