/**
 * Rules must not contradict each other on one stage: a transimpedance stage whose rf noise
 * dominates and whose bandwidth margin is short gets one recommendation from both rules
 * (more gain-bandwidth), never "less gain in this stage" beside "more of the gain in rf".
 */
import {describe, expect, it} from 'vitest'
import {evaluateStage} from '../../src/engine/index.js'
import {runRules} from '../../src/rules/index.js'
import {inputOf} from '../note/helpers.js'

// A small full-scale current (2 nA): the signal's own shot noise, √(2q·2 nA)·1 MΩ ≈ 25 nV/√Hz,
// stays well under rf's 128 nV/√Hz, so the resistor noise dominates.
const tia = (band: string): string => `\`\`\`stage rx
topology: transimpedance
opamp: precision-jfet
rf: 1M
cf: 2.2p
csource: 50p
input: 0 .. 2n A
supply: ±5 V
band: ${band}
\`\`\`
`

const notesOf = (md: string) => {
  const input = inputOf(md)
  return runRules({input, result: evaluateStage(input), context: []})
}

describe('combined advice of bandwidth-margin and resistor-noise-dominant', () => {
  it('gives one recommendation, more gain-bandwidth, when both fire on a transimpedance stage', () => {
    const notes = notesOf(tia('10 .. 20k Hz'))
    const bw = notes.find((n) => n.rule === 'bandwidth-margin')
    const noise = notes.find((n) => n.rule === 'resistor-noise-dominant')
    expect(bw).toBeDefined()
    expect(noise).toBeDefined()
    const all = notes.map((n) => n.text).join(' ')
    expect(all).not.toContain('less gain in this stage.')
    expect(all).not.toContain('put more of the gain in rf')
    expect(bw!.text).toContain('Consider an amplifier with more gain-bandwidth')
    expect(noise!.text).toContain('an amplifier with more gain-bandwidth serves both')
  })

  it('keeps the plain transimpedance advice when the bandwidth margin is ample', () => {
    const notes = notesOf(tia('10 .. 2k Hz'))
    expect(notes.find((n) => n.rule === 'bandwidth-margin')).toBeUndefined()
    expect(notes.find((n) => n.rule === 'resistor-noise-dominant')?.text).toContain('put more of the gain in rf')
  })
})
