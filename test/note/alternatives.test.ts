/**
 * The stage key `alternatives` (DESIGN §8.8): `true` or `false`, anything else an error at
 * the value, and the flag carried on the stage's block node.
 */
import {describe, expect, it} from 'vitest'
import {blocksOf} from './helpers.js'

/** A valid follower stage; `line` is added as its last line (line 8 of the note). */
const note = (line: string): string =>
  '```stage buf\ntopology: follower\nopamp: precision-jfet\ninput: 0 .. 1 V\nsupply: ±5 V\n' +
  `band: 0.1 .. 10 Hz\ntemperature: 25 °C\n${line}\n\`\`\`\n`

describe('stage key `alternatives`', () => {
  it('marks the block when `true`', () => {
    const {stages, diagnostics} = blocksOf(note('alternatives: true'))
    expect(diagnostics).toEqual([])
    expect(stages[0]!.alternatives).toBe(true)
    expect(stages[0]!.input).not.toBeNull()
  })

  it('leaves the block unmarked when `false` or not given', () => {
    expect(blocksOf(note('alternatives: false')).stages[0]!.alternatives).toBeUndefined()
    expect(blocksOf(note('title: Buffer')).stages[0]!.alternatives).toBeUndefined()
  })

  it.each([
    ['alternatives: yes', '8:15: error: Unexpected `yes` for `alternatives`, expected one of `true`, `false`'],
    ['alternatives: ture', '8:15: error: Unexpected `ture` for `alternatives`, expected one of `true`, `false`; did you mean `true`?'],
    ['alternatives: 1', '8:15: error: Unexpected `1` for `alternatives`, expected one of `true`, `false`'],
    ['alternatives:   on', '8:17: error: Unexpected `on` for `alternatives`, expected one of `true`, `false`']
  ])('refuses `%s` at its value', (line, expected) => {
    const {stages, diagnostics} = blocksOf(note(line))
    expect(diagnostics).toEqual([expected])
    expect(stages[0]!.input).toBeNull()
  })

  it('refuses a list, at the value', () => {
    const {diagnostics} = blocksOf(note('alternatives: [true]'))
    expect(diagnostics).toEqual(['8:15: error: Unexpected list for `alternatives`, expected a single value'])
  })

  it('suggests the key for a misspelling', () => {
    const {diagnostics} = blocksOf(note('alternative: true'))
    expect(diagnostics).toEqual(['8:1: error: Unexpected key `alternative` in stage `buf`, expected a stage key; did you mean `alternatives`?'])
  })
})
