import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/low-value-resistor.js'
import {resistor, ruleContext, stageInput, stageResult} from './helpers.js'

describe('rules/low-value-resistor', () => {
  it('cautions for rg = 2 Ω, quoting 10 mΩ as 0.5 % and the network current', () => {
    // Invented: gain 101 with 200 Ω / 2 Ω, 5 V at full scale → 5 V / 202 Ω ≈ 24.8 mA.
    const input = stageInput({rf: resistor(200), rg: resistor(2)})
    const notes = rule.check(ruleContext(input, stageResult({gain: 101, fullScaleOutput: 5}, input)))
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain('rg = 2 Ω (10 mΩ of copper is 0.5 % of it)')
    expect(notes[0]!.text).toContain('24.8 mA')
  })

  it('stays silent for 10 kΩ / 1 kΩ', () => {
    expect(rule.check(ruleContext(stageInput(), stageResult()))).toEqual([])
  })
})
