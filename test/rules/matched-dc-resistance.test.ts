import {describe, expect, it} from 'vitest'
import {ARCHETYPES} from '../../src/engine/archetypes.js'
import {evaluateStage, withoutMonteCarlo} from '../../src/engine/index.js'
import type {StageInput} from '../../src/engine/types.js'
import rule from '../../src/rules/matched-dc-resistance.js'
import {formatQuantity} from '../../src/units/format.js'
import {resistor, ruleContext, stageInput} from './helpers.js'

const checkWithEngine = (input: StageInput) => rule.check(ruleContext(input, evaluateStage(input)))

// Invented: inverting ×10 with 1 MΩ / 100 kΩ and IB 250 nA: IB·Rn·NG ≈ 250 mV against vos·NG ≈ 22 mV.
const inverting = (over: Partial<StageInput> = {}): StageInput =>
  stageInput({topology: 'inverting', opamp: ARCHETYPES['general-bipolar'], rf: resistor(1e6), rg: resistor(100e3), input: [-1, 1], ...over})

describe('rules/matched-dc-resistance', () => {
  it('suggests rcomp = Rn (90.9 kΩ) and quotes the engine’s matched worst case', () => {
    const input = inverting()
    const notes = checkWithEngine(input)
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('rcomp = 90.9 kΩ')
    const matched = evaluateStage({...input, rcomp: resistor(1e6 / 11)})
    expect(notes[0]!.text).toContain(formatQuantity(matched.dc.worstCaseOutput, 'V'))
    expect(notes[0]!.text).toContain('there is no noise requirement')
  })

  it('cautions when matching would bring a failing output error within its limit', () => {
    const input = inverting({require: {'output-error': 0.12}})
    expect(checkWithEngine(input).map((n) => n.severity)).toEqual(['caution'])
  })

  it('suggests an rf equal to the source resistance on a follower', () => {
    const input = stageInput({topology: 'follower', opamp: ARCHETYPES['general-bipolar'], rf: null, rg: null, rs: resistor(100e3)})
    expect(checkWithEngine(input)[0]!.text).toContain('rf = 100 kΩ')
  })

  it.each([
    ['a noise requirement the added resistor would break', inverting({require: {'noise-rms': 1e-9}})],
    ['resistances already matched', inverting({rcomp: resistor(1e6 / 11)})],
    ['a stage whose ib term is not the largest (10 kΩ / 1 kΩ, precision bipolar)', stageInput()]
  ])('stays silent with %s', (_name, input) => {
    expect(checkWithEngine(input)).toEqual([])
  })
})

describe('rules that evaluate variants of the stage, with a Monte Carlo on it', () => {
  it('give the same notes with a Monte Carlo on the stage as without (the variants, now run without it, are read for DC and noise only)', () => {
    const plain = inverting({require: {'output-error': 0.12}})
    const withRun = {...plain, yield: {trials: 3000, seed: 2, distribution: 'uniform' as const}, require: {...plain.require, yield: 0.9}}
    expect(evaluateStage(withRun).yield?.trials).toBe(3000)
    expect(checkWithEngine(withRun)).toEqual(checkWithEngine(plain))
  })
  it('withoutMonteCarlo drops the yield map and the yield requirement, nothing else', () => {
    const withRun = inverting({yield: {trials: 3000, seed: 2, distribution: 'uniform'}, require: {'output-error': 0.12, yield: 0.9}})
    const off = withoutMonteCarlo(withRun)
    expect(off.yield).toBeNull()
    expect(off.require).toEqual({'output-error': 0.12})
    expect(evaluateStage(off).yield).toBeNull()
    expect({...off, yield: withRun.yield, require: withRun.require}).toEqual(withRun)
    expect(evaluateStage(off).dc).toEqual(evaluateStage(withRun).dc)
  })
})
