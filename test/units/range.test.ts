import {describe, expect, it} from 'vitest'
import {parseRange, parseResistor, parseSupply} from '../../src/units/index.js'

describe('parseRange()', () => {
  it.each([
    ['-40 .. 85 °C', 'temperature', [-40, 85]],
    ['-40 °C .. 85 °C', 'temperature', [-40, 85]],
    ['233.15 K .. 85 °C', 'temperature', [-40, 85]],
    ['0.1 .. 1k Hz', 'frequency', [0.1, 1000]],
    ['0.1 Hz .. 10 kHz', 'frequency', [0.1, 10e3]],
    ['-10m .. 10m V', 'voltage', [-0.01, 0.01]],
    ['-10 mV .. 10 mV', 'voltage', [-0.01, 0.01]],
    // An end without a unit borrows the other end's unit symbol, not its prefix.
    ['-10 mV .. 10', 'voltage', [-0.01, 10]],
    ['0 .. 1 uA', 'current', [0, 1e-6]],
    ['−40 … 85 °C', 'temperature', [-40, 85]],
    ['2 .. 2 V', 'voltage', [2, 2]]
  ] as const)('reads %s', (text, dim, expected) => {
    const r = parseRange(text, dim)
    expect(r.ok).toBe(true)
    if (!r.ok) return
    expect(r.value[0]).toBeCloseTo(expected[0], 12)
    expect(r.value[1]).toBeCloseTo(expected[1], 12)
  })

  it('reads a single value as 0 .. x by default', () => {
    expect(parseRange('10 mV', 'voltage')).toEqual({ok: true, value: [0, 0.01], single: true})
  })

  it('reads a single negative value as x .. 0', () => {
    expect(parseRange('-5 V', 'voltage')).toEqual({ok: true, value: [-5, 0], single: true})
  })

  it('reads a single value as x .. x with the point rule (temperature)', () => {
    expect(parseRange('60 °C', 'temperature', {single: 'point'})).toEqual({ok: true, value: [60, 60], single: true})
  })

  it.each([
    ['1..2', 1, /without spaces.*`1 \.\. 2`/],
    ['1 ..2 V', 2, /without spaces/],
    ['85 .. -40 V', 0, /reversed range `85 \.\. -40 V`.*`-40 V \.\. 85`/],
    ['1 .. 2 .. 3', 6, /second `\.\.`/],
    ['1 .. 2 mA', 7, /\(a current\)/],
    ['1 x .. 2 V', 2, /unit `x`/]
  ] as const)('refuses %j at offset %d', (text, offset, message) => {
    const r = parseRange(text, 'voltage')
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.offset).toBe(offset)
    expect(r.message).toMatch(message)
  })
})

describe('parseSupply()', () => {
  it.each([
    ['±15 V', [-15, 15]],
    ['+-15 V', [-15, 15]],
    ['± 12', [-12, 12]],
    ['0 .. 5 V', [0, 5]],
    ['-5 .. 12 V', [-5, 12]],
    ['5 V', [0, 5]],
    ['3.3', [0, 3.3]]
  ] as const)('reads %s as [neg, pos]', (text, expected) => {
    expect(parseSupply(text)).toEqual({ok: true, value: expected})
  })

  it.each([
    ['±', 0, /lone `±`/],
    ['±0 V', 1, /positive magnitude/],
    ['±15 mA', 4, /\(a current\)/],
    ['0 V', 0, /empty supply/],
    ['12 .. 5 V', 0, /reversed/]
  ] as const)('refuses %j at offset %d', (text, offset, message) => {
    const r = parseSupply(text)
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.offset).toBe(offset)
    expect(r.message).toMatch(message)
  })
})

describe('parseResistor()', () => {
  it.each([
    ['49.9k 0.1% 25ppm/K', {value: 49.9e3, tolerance: 1e-3, tempco: 25e-6}, []],
    ['49.9k 25ppm/K 0.1%', {value: 49.9e3, tolerance: 1e-3, tempco: 25e-6}, []],
    ['4.7 kΩ 25 ppm/°C ±1 %', {value: 4.7e3, tolerance: 0.01, tempco: 25e-6}, []],
    ['1.00k 0.1%', {value: 1e3, tolerance: 1e-3, tempco: 0}, ['tempco']],
    ['350', {value: 350, tolerance: 0, tempco: 0}, ['tolerance', 'tempco']],
    ['4k7 50ppm/K', {value: 4700, tolerance: 0, tempco: 50e-6}, ['tolerance']]
  ] as const)('reads %s', (text, expected, defaulted) => {
    const r = parseResistor(text)
    expect(r.ok).toBe(true)
    if (!r.ok) return
    expect(r.value.value).toBeCloseTo(expected.value, 9)
    expect(r.value.tolerance).toBeCloseTo(expected.tolerance, 15)
    expect(r.value.tempco).toBeCloseTo(expected.tempco, 15)
    expect(r.defaulted).toEqual(defaulted)
  })

  it.each([
    ['10k 5', 4, /after the resistor value/],
    ['10k 1% 2%', 7, /second tolerance/],
    ['10k -25ppm/K', 4, /negative tempco/],
    ['10 mV 1%', 3, /a voltage/],
    ['10k 1 %/V', 6, /unit `%\/V`/]
  ] as const)('refuses %j at offset %d', (text, offset, message) => {
    const r = parseResistor(text)
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.offset).toBe(offset)
    expect(r.message).toMatch(message)
  })
})

describe('parseRange() prefix on one end only', () => {
  it('warns when the right end writes its prefix on the unit (`10 .. 100 kHz` is 10 Hz .. 100 kHz)', () => {
    const r = parseRange('10 .. 100 kHz', 'frequency')
    expect(r.ok && r.value).toEqual([10, 100e3])
    expect(r.ok && r.warning?.message).toContain('write `10 kHz .. 100 kHz`')
  })

  it.each(['0.1 .. 1k Hz', '-40 .. 85 °C', '10 kHz .. 100 kHz', '0 .. 10 mV'])('does not warn on `%s`', (text) => {
    const r = parseRange(text, text.includes('°C') ? 'temperature' : text.includes('V') ? 'voltage' : 'frequency')
    expect(r.ok).toBe(true)
    expect(r.ok && r.warning).toBeUndefined()
  })
})
