import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/follower-feedback-resistor.js'
import {formatQuantity} from '../../src/units/format.js'
import {opamp, resistor, ruleContext, stageInput, stageResult} from './helpers.js'

// Invented op-amp: 3 pF + 4 pF at the input, 2 pF stray → 9 pF at the − pin.
const amp = opamp({cinDiff: 3e-12, cinCm: 4e-12})
const follower = (rf: number, cf = 0) =>
  stageInput({topology: 'follower', opamp: amp, rf: resistor(rf), rg: null, rs: resistor(rf), cf, cstray: 2e-12})

describe('rules/follower-feedback-resistor', () => {
  it('cautions for 100 kΩ (pole 177 kHz) under a 1 MHz crossover and quotes both', () => {
    const input = follower(100e3)
    const notes = rule.check(ruleContext(input, stageResult({gain: 1, stability: {crossover: 1e6, phaseMargin: 48}}, input)))
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain(formatQuantity(1 / (2 * Math.PI * 100e3 * 9e-12), 'Hz'))
    expect(notes[0]!.text).toContain('1 MHz')
    expect(notes[0]!.text).toContain('margin of 48°')
    // atan(1 MHz / 176.8 kHz) ≈ 80°.
    expect(notes[0]!.text).toContain('about 80°')
  })

  it.each([
    ['1 kΩ (pole 17.7 MHz, above ten times the crossover)', follower(1e3)],
    ['100 kΩ bridged by 10 pF', follower(100e3, 10e-12)],
    ['no rf', stageInput({topology: 'follower', rf: null, rg: null})],
    ['a noninverting stage', stageInput()]
  ])('stays silent with %s', (_name, input) => {
    expect(rule.check(ruleContext(input, stageResult({gain: 1, stability: {crossover: 1e6}}, input)))).toEqual([])
  })
})
