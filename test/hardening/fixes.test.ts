/**
 * One test per bug found by the hardening work in src/units and src/note (fuzzing and the
 * bad-input corpus), so that each fix stays fixed. Parts and values are invented.
 */
import {describe, expect, it} from 'vitest'
import {parseQuantity, parseRange, parseResistor, unitsMessages} from '../../src/units/index.js'
import {noteMessages} from '../../src/note/index.js'
import {ARCHETYPE_NAMES} from '../../src/engine/archetypes.js'
import {errorsOf, fence, noteOf} from '../note/helpers.js'

const OPAMP_LINES = [
  'input-type: bipolar', 'vos: 50 uV', 'ib: 2 nA', 'ios: 1 nA', 'en: 8 nV/√Hz', 'in: 0.2 pA/√Hz',
  'gbw: 2 MHz', 'aol: 120 dB', 'pm-unity: 60 deg', 'cmrr: 110 dB', 'psrr: 110 dB'
]
const STAGE_LINES = ['topology: noninverting', 'opamp: amp-a', 'rf: 10k', 'rg: 1k', 'input: 0 .. 1 V', 'supply: ±5 V']
const withLine = (lines: readonly string[], key: string, line: string): string =>
  lines.map((l) => (l.startsWith(`${key}:`) ? line : l)).join('\n')
const note = (opamp: string, stage: string): string => `${fence('opamp amp-a', opamp)}\n${fence('stage s-1', stage)}`

describe('parseQuantity(): values that leave the double range', () => {
  it.each([
    ['1 constructor Ω', 'resistance'],
    ['1 toString Hz', 'frequency'],
    ['1 __proto__ V', 'voltage']
  ] as const)('refuses %j instead of reading a prototype member as a prefix (was NaN)', (text, dim) => {
    const r = parseQuantity(text, dim)
    expect(r.ok).toBe(false)
    expect(r.ok ? '' : r.message).toMatch(/Unexpected unit/)
  })

  it.each([
    ['1e308 T', 'resistance'],
    ['7000 dB', 'ratio-db'],
    ['1e300 TV/us', 'slew']
  ] as const)('refuses %j, which overflows once its prefix or dB is applied (was ∞)', (text, dim) => {
    const r = parseQuantity(text, dim, {key: 'k'})
    expect(r.ok ? '' : r.message).toBe(unitsMessages.outOfRange(text, dim, ' for `k`', 'overflow'))
  })

  it.each([
    ['1e-400', 'capacitance', '1e-400'],
    ['1e-320 f', 'capacitance', '1e-320 f'],
    ['-7000 dB', 'ratio-db', '-7000 dB']
  ] as const)('refuses %j, which underflows to 0 although written non-zero (was 0)', (text, dim, found) => {
    const r = parseQuantity(text, dim, {key: 'k'})
    expect(r.ok ? '' : r.message).toBe(unitsMessages.outOfRange(found, dim, ' for `k`', 'underflow'))
  })

  it('still reads a written zero and an honest small value', () => {
    expect(parseQuantity('0', 'capacitance')).toEqual({ok: true, value: 0})
    expect(parseQuantity('0.0 pF', 'capacitance')).toEqual({ok: true, value: 0})
    expect(parseQuantity('1 fF', 'capacitance')).toEqual({ok: true, value: 1e-15})
  })

  it('says how to write an RKM value that was given a second prefix', () => {
    const r = parseQuantity('4k7 kΩ', 'resistance', {key: 'rs'})
    expect(r.ok ? '' : r.message).toBe(unitsMessages.rkmWithPrefix('4k7', 'kΩ', ' for `rs`'))
  })

  it('says which keys take a range when a single-value key gets one', () => {
    const single = parseQuantity('1..2 pF', 'capacitance', {key: 'cstray'})
    expect(single.ok ? '' : single.message).toBe(unitsMessages.rangeInSingle(' for `cstray`', 'capacitance'))
  })
})

describe('parseRange(): a prefix on the right end only', () => {
  it('explains that `1 .. 2 pF` is 1 F .. 2 pF and suggests `1 pF .. 2 pF` (suggested `2 pF .. 1`, i.e. 2 pF .. 1 F)', () => {
    const r = parseRange('1 .. 2 pF', 'capacitance', {key: 'x'})
    expect(r.ok ? '' : r.message).toBe(unitsMessages.rangePrefixNotShared('1 .. 2 pF', 'p', 'F', '1 pF .. 2 pF', ' for `x`'))
    expect(parseRange('1 pF .. 2 pF', 'capacitance')).toEqual({ok: true, value: [1e-12, 2e-12], single: false})
  })

  it('keeps the plain swap for a range that is reversed as written', () => {
    const r = parseRange('10m .. -10m V', 'voltage', {key: 'input'})
    expect(r.ok ? '' : r.message).toBe(unitsMessages.rangeReversed('10m .. -10m V', '-10m V .. 10m', ' for `input`'))
  })
})

describe('parseResistor(): impossible tolerances', () => {
  it.each(['10k 100%', '10k 150 %', '10k ±1e6 ppm'])('refuses %j, a tolerance of 100 %% or more (was accepted)', (text) => {
    const r = parseResistor(text)
    expect(r.ok ? '' : r.message).toMatch(/expected under 100 %/)
  })

  it('still reads 99 %', () => {
    const r = parseResistor('10k 99%')
    expect(r.ok && r.value.tolerance).toBeCloseTo(0.99, 12)
  })
})

describe('opamp blocks: ratios in dB', () => {
  it.each(['aol: -20 dB', 'aol: 0 dB', 'cmrr: -3 dB', 'psrr: 0.5 V/V'])('refuses %j, a ratio of 0 dB or less (was accepted)', (line) => {
    const key = line.split(':')[0] ?? ''
    const {diagnostics} = noteOf(note(withLine(OPAMP_LINES, key, line), STAGE_LINES.join('\n')))
    expect(errorsOf(diagnostics).join('\n')).toContain(noteMessages.notAboveZeroDb(key, line.slice(key.length + 1).trim()))
  })
})

describe('stage blocks: messages', () => {
  it('writes "an inverting stage" in a missing-key message', () => {
    const stage = ['topology: inverting', 'opamp: amp-a', 'rf: 10k', 'input: 0 .. 1 V', 'supply: ±5 V'].join('\n')
    const {diagnostics} = noteOf(note(OPAMP_LINES.join('\n'), stage))
    expect(errorsOf(diagnostics).join('\n')).toContain('expected it for an inverting stage')
  })

  it('writes "an inverting stage" for a key the topology does not take', () => {
    expect(noteMessages.keyNotForTopology('rshunt', 'inverting', 'stage `s-1`')).toContain('only keys an inverting stage takes')
  })

  it('lists the archetypes when an unknown opamp has no near match', () => {
    const {diagnostics} = noteOf(note(OPAMP_LINES.join('\n'), withLine(STAGE_LINES, 'opamp', 'opamp: qqqqqqqq')))
    expect(errorsOf(diagnostics).join('\n')).toContain(noteMessages.unknownOpamp('qqqqqqqq', 'stage `s-1`', null, ARCHETYPE_NAMES))
    expect(noteMessages.unknownOpamp('qqqqqqqq', 'stage `s-1`', null, ARCHETYPE_NAMES)).toContain('`precision-jfet`')
  })
})

describe('unclosed fences', () => {
  it('reports an opamp block that swallowed the stage after it once, at the swallowed fence', () => {
    const md = `\`\`\`\`opamp amp-a\n${OPAMP_LINES.join('\n')}\n\`\`\`\n\n${fence('stage s-1', STAGE_LINES.join('\n'))}`
    const {diagnostics} = noteOf(md)
    expect(errorsOf(diagnostics)).toEqual([
      `15:1: error: ${noteMessages.swallowedBlock('stage s-1', 'opamp `amp-a`')}`
    ])
  })

  it('reports prose swallowed by an unclosed stage once on its line, not again as a key', () => {
    const md = `${fence('opamp amp-a', OPAMP_LINES.join('\n'))}\n\`\`\`\`stage s-1\n${STAGE_LINES.join('\n')}\n\`\`\`\n\nSome prose after it.\n`
    const {diagnostics} = noteOf(md)
    const errors = errorsOf(diagnostics)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatch(/^22:1: error: Unexpected YAML in stage `s-1`/)
  })
})

describe('front matter without its closing line', () => {
  it('is an error at 1:1 (the title, status and reviewers were dropped without a word)', () => {
    const {diagnostics} = noteOf(`---\ntitle: A note\nstatus: for-review\n\n# Body\n\n${fence('stage s-1', STAGE_LINES.join('\n'))}`)
    expect(errorsOf(diagnostics)[0]).toBe(`1:1: error: ${noteMessages.frontMatterUnclosed()}`)
  })

  it('is not raised for a rule on line 1 followed by prose', () => {
    const {diagnostics} = noteOf('---\n\nJust prose under a rule.\n')
    expect(diagnostics).toEqual([])
  })
})

describe('values no stage can have', () => {
  it.each([
    ['-1e160', 'voltage'],
    ['2e18 Ω', 'resistance'],
    ['1000 dB', 'ratio-db']
  ] as const)('refuses %j, beyond 10^18 in SI (the engine summed its square to ∞)', (text, dim) => {
    const r = parseQuantity(text, dim, {key: 'k'})
    expect(r.ok ? '' : r.message).toBe(unitsMessages.beyondPhysical(text, dim, ' for `k`'))
  })

  it.each([
    ['1e-160', 'resistance'],
    ['1e-300 f', 'capacitance'],
    ['-600 dB', 'ratio-db']
  ] as const)('refuses %j, non-zero below 10^-24 in SI (a 1e-160 Ω rf hung the noise integration)', (text, dim) => {
    const r = parseQuantity(text, dim, {key: 'k'})
    expect(r.ok ? '' : r.message).toBe(unitsMessages.belowPhysical(text, dim, ' for `k`'))
  })

  it('still reads 10^-24 itself and a femtoamp', () => {
    expect(parseQuantity('1e-24', 'current')).toEqual({ok: true, value: 1e-24})
    expect(parseQuantity('1 fA', 'current')).toEqual({ok: true, value: 1e-15})
  })

  it('still reads 10^18 itself and a 1 TΩ shunt', () => {
    expect(parseQuantity('1e18', 'resistance')).toEqual({ok: true, value: 1e18})
    expect(parseQuantity('1 TΩ', 'resistance')).toEqual({ok: true, value: 1e12})
  })

  it('refuses a vref outside the supply rails, at the value (gave ∞ in the RSS for a huge vref)', () => {
    const stage = ['topology: inverting', 'opamp: amp-a', 'rf: 10k', 'rg: 1k', 'vref: 7 V', 'input: 0 .. 1 V', 'supply: 0 .. 5 V'].join('\n')
    const {diagnostics} = noteOf(note(OPAMP_LINES.join('\n'), stage))
    expect(errorsOf(diagnostics)).toEqual([`20:7: error: ${noteMessages.vrefOutsideSupply('7 V', '0 … 5 V')}`])
  })

  it('accepts a vref on a rail', () => {
    const stage = ['topology: inverting', 'opamp: amp-a', 'rf: 10k', 'rg: 1k', 'vref: 0 V', 'input: 0 .. 1 V', 'supply: 0 .. 5 V'].join('\n')
    expect(errorsOf(noteOf(note(OPAMP_LINES.join('\n'), stage)).diagnostics)).toEqual([])
  })
})
