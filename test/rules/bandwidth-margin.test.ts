import {describe, expect, it} from 'vitest'
import rule from '../../src/rules/bandwidth-margin.js'
import {ruleContext, stageInput, stageResult} from './helpers.js'

const input = stageInput({band: [0.1, 100]})
const withBandwidth = (bandwidth: number | null) => stageResult({stability: {bandwidth}}, input)

describe('rules/bandwidth-margin', () => {
  it.each([
    ['500 Hz (5 × a 100 Hz band top) as a caution', 500, 'caution', 'is only 5 ×'],
    ['50 Hz (inside the band) as a warning', 50, 'warning', '(0.5 ×']
  ] as const)('flags %s', (_name, bw, severity, quoted) => {
    const notes = rule.check(ruleContext(input, withBandwidth(bw)))
    expect(notes.map((n) => n.severity)).toEqual([severity])
    expect(notes[0]!.text).toContain(quoted)
  })

  it.each([
    ['2 kHz, 20 × the band top', 2000],
    ['exactly 10 ×', 1000],
    ['no bandwidth in the analysed span', null]
  ])('stays silent with %s', (_name, bw) => {
    expect(rule.check(ruleContext(input, withBandwidth(bw)))).toEqual([])
  })
})
