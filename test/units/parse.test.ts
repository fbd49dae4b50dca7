import {describe, expect, it} from 'vitest'
import {parseQuantity, readQuantity, type Dimension} from '../../src/units/index.js'

const ok = (text: string, dim: Dimension): number => {
  const r = parseQuantity(text, dim)
  if (!r.ok) throw new Error(`${text}: ${r.message}`)
  return r.value
}

describe('parseQuantity()', () => {
  // RKM code examples of IEC 60062 — from memory: 4k7 = 4.7 kΩ, R47 = 0.47 Ω, 1M0 = 1 MΩ, 2R2 = 2.2 Ω.
  it.each([
    ['4k7', 4700],
    ['R47', 0.47],
    ['1M0', 1e6],
    ['2R2', 2.2],
    ['4K7', 4700],
    ['10K', 10e3],
    ['10 KΩ', 10e3],
    ['49.9k', 49.9e3],
    ['49.9 kΩ', 49.9e3],
    ['49.9 kohm', 49.9e3],
    ['49.9 kΩ', 49.9e3],
    ['350', 350],
    ['1G', 1e9],
    ['10R', 10],
    ['4k7 Ω', 4700],
    ['10m', 10e-3]
  ])('reads resistance %s as %d Ω', (text, expected) => {
    expect(ok(text, 'resistance')).toBeCloseTo(expected, 9)
  })

  it.each([
    ['2 pF', 2e-12],
    ['4n7', 4.7e-9],
    ['2.2u', 2.2e-6],
    ['0', 0]
  ])('reads capacitance %s as %d F', (text, expected) => {
    expect(ok(text, 'capacitance')).toBeCloseTo(expected, 20)
  })

  it.each([
    ['2.5 mV', 2.5e-3],
    ['60 uV', 60e-6],
    ['60 µV', 60e-6],
    ['60 μV', 60e-6],
    ['-10m', -10e-3],
    ['−3 V', -3],
    ['1e-6', 1e-6],
    ['1.2e3 V', 1200]
  ])('reads voltage %s as %d V', (text, expected) => {
    expect(ok(text, 'voltage')).toBeCloseTo(expected, 15)
  })

  it.each([
    ['1 MHz', 1e6],
    ['1k Hz', 1e3],
    ['1k', 1e3],
    ['100 mHz', 0.1]
  ])('reads frequency %s as %d Hz', (text, expected) => {
    expect(ok(text, 'frequency')).toBeCloseTo(expected, 9)
  })

  it.each([
    ['25 °C', 25],
    ['25 ℃', 25],
    ['25 degC', 25],
    ['25 C', 25],
    ['25', 25],
    ['300 K', 300 - 273.15],
    ['0 K', -273.15]
  ])('reads temperature %s as %d °C (K is kelvin here)', (text, expected) => {
    expect(ok(text, 'temperature')).toBeCloseTo(expected, 9)
  })

  it.each([
    ['8 nV/√Hz', 8e-9, 'voltage-density'],
    ['8 nV/rtHz', 8e-9, 'voltage-density'],
    ['8 nV/sqrt(Hz)', 8e-9, 'voltage-density'],
    ['0.2 pA/√Hz', 0.2e-12, 'current-density'],
    ['0.2 pA/rtHz', 0.2e-12, 'current-density'],
    ['0.6 uV/K', 0.6e-6, 'drift'],
    ['0.6 µV/°C', 0.6e-6, 'drift'],
    ['0.1 %', 1e-3, 'fraction'],
    ['5%', 0.05, 'fraction'],
    ['100 ppm', 1e-4, 'fraction'],
    ['0.05', 0.05, 'fraction'],
    ['25 ppm/K', 25e-6, 'tempco'],
    ['25ppm/°C', 25e-6, 'tempco'],
    ['60 deg', 60, 'angle'],
    ['60°', 60, 'angle'],
    ['0.5 V/us', 0.5e6, 'slew'],
    ['0.5 V/µs', 0.5e6, 'slew'],
    ['20 V/s', 20, 'slew'],
    ['10 K', 10, 'temperature-interval']
  ] as const)('reads %s as %d (%s)', (text, expected, dim) => {
    expect(ok(text, dim)).toBeCloseTo(expected, 15)
  })

  // dB to linear is 20·lg for a voltage ratio (common practice).
  it.each([
    ['120 dB', 1e6],
    ['126 dB', 10 ** (126 / 20)],
    ['0 dB', 1],
    ['120', 1e6],
    ['1M V/V', 1e6]
  ])('reads ratio %s as linear %d', (text, expected) => {
    expect(ok(text, 'ratio-db') / expected).toBeCloseTo(1, 12)
  })

  it('reports the prefix as written', () => {
    const r = readQuantity('10 mΩ', 'resistance')
    expect(r.ok && r.prefix).toBe('m')
  })

  it.each([
    ['', 'resistance', 0, /empty value/],
    ['   ', 'voltage', 0, /empty value/],
    ['4,7k', 'resistance', 1, /comma.*use a point \(`4\.7k`\)/],
    ['NaN', 'voltage', 0, /non-finite/],
    ['Infinity V', 'voltage', 0, /non-finite/],
    ['1e400', 'voltage', 0, /non-finite/],
    ['±', 'voltage', 0, /lone `±`/],
    ['±5 V', 'voltage', 0, /only for a supply/],
    ['10 mV', 'resistance', 3, /unit `mV` \(a voltage\).*expected a resistance/],
    ['10 xyz', 'voltage', 3, /Unexpected unit `xyz`.*expected a voltage/],
    ['10 KHz', 'frequency', 3, /prefix `K`.*expected `k`/],
    ['5 K', 'voltage', 2, /prefix `K`.*expected `k`/],
    ['10 kdB', 'ratio-db', 3, /prefix in `kdB`/],
    ['1k', 'temperature', 1, /prefix in `k`/],
    ['V', 'voltage', 0, /expected a number first/],
    ['1 .. 2 V', 'voltage', 2, /range/],
    ['-300 °C', 'temperature', 0, /absolute zero/],
    ['10 pF', 'frequency', 3, /\(a capacitance\)/],
    ['  10 mV', 'resistance', 5, /a voltage/]
  ] as const)('refuses %j on %s at offset %d', (text, dim, offset, message) => {
    const r = parseQuantity(text, dim)
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.offset).toBe(offset)
    expect(r.message).toMatch(message)
  })

  it('names the key when given', () => {
    const r = parseQuantity('10 mV', 'resistance', {key: 'rf'})
    expect(r.ok ? '' : r.message).toBe(
      'Unexpected unit `mV` (a voltage) for `rf`, expected a resistance (Ω, e.g. `4.7 kΩ`)'
    )
  })
})
