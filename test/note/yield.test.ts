/**
 * The stage key `yield` and the requirement `yield` (DESIGN §8.7): the map's three keys, the
 * defaults, and a positioned error for each bad value.
 */
import {describe, expect, it} from 'vitest'
import {parseTrials} from '../../src/note/yield-read.js'
import {blocksOf} from './helpers.js'

const OPAMP = [
  '```opamp amp-a', 'input-type: bipolar', 'vos: 60 uV', 'ib: 2 nA', 'ios: 1.8 nA', 'en: 9 nV/√Hz',
  'in: 0.15 pA/√Hz', 'gbw: 1.2 MHz', 'aol: 126 dB', 'pm-unity: 60 deg', 'cmrr: 120 dB', 'psrr: 118 dB', '```'
]
const BODY = ['topology: noninverting', 'opamp: amp-a', 'rf: 49.9k 0.1% 25ppm/K', 'rg: 1.00k', 'input: -10m .. 10m V', 'supply: ±15 V']
const note = (lines: string[]): string => `${OPAMP.join('\n')}\n\n\`\`\`stage gain-a\n${[...BODY, ...lines].join('\n')}\n\`\`\`\n`
// The stage's fence opens on line 15; its first body line is 16, so the seventh is 22.
const LINE = 16 + BODY.length

describe('stage key `yield`', () => {
  it('reads a flow map with trials as a quantity (100k), seed and distribution', () => {
    const r = blocksOf(note(['yield: { trials: 250k, seed: 42, distribution: normal }']))
    expect(r.diagnostics).toEqual([])
    expect(r.stages[0]?.input?.yield).toEqual({trials: 250_000, seed: 42, distribution: 'normal'})
  })
  it('takes the defaults for missing keys and for `yield: on`; absent or `off` means off', () => {
    expect(blocksOf(note(['yield:', '  seed: 3'])).stages[0]?.input?.yield).toEqual({trials: 100_000, seed: 3, distribution: 'uniform'})
    expect(blocksOf(note(['yield: on'])).stages[0]?.input?.yield).toEqual({trials: 100_000, seed: 1, distribution: 'uniform'})
    expect(blocksOf(note(['yield: off'])).stages[0]?.input?.yield).toBeUndefined()
    expect(blocksOf(note([])).stages[0]?.input?.yield).toBeUndefined()
  })
  it('gives a positioned error for bad trials, seed, distribution and unknown keys', () => {
    const trials = blocksOf(note(['yield: { trials: 12.5 }']))
    expect(trials.diagnostics[0]).toMatch(new RegExp(`^${LINE}:\\d+: error: Unexpected \`12.5\` for \`yield.trials\``))
    expect(trials.stages[0]?.input).toBeNull()
    expect(blocksOf(note(['yield: { trials: 0 }'])).diagnostics[0]).toMatch(/yield.trials/)
    expect(blocksOf(note(['yield: { trials: 20M }'])).diagnostics[0]).toMatch(/from 1 to 10,000,000/)
    expect(blocksOf(note(['yield: { seed: -1 }'])).diagnostics[0]).toMatch(/`yield.seed`, expected a whole number/)
    expect(blocksOf(note(['yield: { distribution: gauss }'])).diagnostics[0]).toMatch(/`yield.distribution`, expected one of `uniform`, `normal`/)
    expect(blocksOf(note(['yield: { trails: 1k }'])).diagnostics[0]).toMatch(/Unexpected key `trails` in `yield`, expected `trials`/)
    expect(blocksOf(note(['yield: maybe'])).diagnostics[0]).toMatch(/Unexpected `maybe` for `yield`/)
  })
  it('reads `require: yield: 99.7 %` as a fraction and refuses 0 % and more than 100 %', () => {
    const r = blocksOf(note(['require:', '  output-error: 2 mV', '  yield: 99.7 %']))
    expect(r.diagnostics).toEqual([])
    expect(r.stages[0]?.input?.require.yield).toBeCloseTo(0.997, 12)
    expect(blocksOf(note(['require:', '  output-error: 2 mV', '  yield: 120 %'])).diagnostics[0]).toMatch(/require.yield/)
    expect(blocksOf(note(['require:', '  output-error: 2 mV', '  yield: 0 %'])).diagnostics[0]).toMatch(/require.yield/)
    const alone = blocksOf(note(['require:', '  noise-rms: 30 uV', '  yield: 99 %']))
    expect(alone.diagnostics[0]).toMatch(new RegExp(`^${LINE + 2}:3: error: Unexpected \`yield\` without a DC error requirement`))
  })
  it('parseTrials: k and M multipliers, whole numbers only', () => {
    expect(parseTrials('100k')).toBe(100_000)
    expect(parseTrials('2.5k')).toBe(2500)
    expect(parseTrials('1M')).toBe(1_000_000)
    expect(parseTrials('1.5')).toBeNull()
    expect(parseTrials('ten')).toBeNull()
  })
})
