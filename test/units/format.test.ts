import {describe, expect, it} from 'vitest'
import fc from 'fast-check'
import {
  formatAngle, formatDb, formatPercent, formatQuantity, formatRange, formatTempco,
  formatTemperatureRange, parseQuantity
} from '../../src/units/index.js'

describe('formatQuantity()', () => {
  it.each([
    [49.9e3, 'Ω', '49.9 kΩ'],
    [2.5e-3, 'V', '2.5 mV'],
    [2.5e-6, 'V', '2.5 µV'],
    [-2.5e-3, 'V', '−2.5 mV'],
    [0, 'V', '0 V'],
    [1e6, 'Hz', '1 MHz'],
    [999.6, 'Hz', '1 kHz'],
    [123456, 'Ω', '123 kΩ'],
    [8e-9, 'V/√Hz', '8 nV/√Hz'],
    [1.5, 'V', '1.5 V'],
    [1e-18, 'F', '0.001 fF'],
    [NaN, 'V', '—']
  ])('formats %d %s as %s', (value, unit, expected) => {
    expect(formatQuantity(value, unit)).toBe(expected)
  })

  it('uses U+00B5 for micro and U+2212 for minus', () => {
    const s = formatQuantity(-3e-6, 'A')
    expect(s.codePointAt(0)).toBe(0x2212)
    expect(s).toContain('\u00b5')
  })

  it('honours digits', () => {
    expect(formatQuantity(49.912e3, 'Ω', {digits: 4})).toBe('49.91 kΩ')
  })

  it('round-trips through parseQuantity within the rounding of 3 digits', () => {
    fc.assert(
      fc.property(fc.double({min: 1e-14, max: 1e13, noNaN: true}), fc.boolean(), (x, neg) => {
        const v = neg ? -x : x
        const text = formatQuantity(v, 'V')
        const back = parseQuantity(text, 'voltage')
        expect(back.ok).toBe(true)
        if (back.ok) expect(Math.abs(back.value - v)).toBeLessThanOrEqual(Math.abs(v) * 5e-3)
      })
    )
  })
})

describe('format helpers', () => {
  it.each([
    [formatPercent(0.001), '0.1 %'],
    [formatPercent(0.05), '5 %'],
    [formatDb(1e6), '120 dB'],
    [formatDb(10 ** (126 / 20)), '126 dB'],
    [formatAngle(59.84), '59.8°'],
    [formatTempco(25e-6), '25 ppm/K'],
    [formatTemperatureRange(-40, 85), '−40 … 85 °C'],
    [formatRange(-0.01, 0.01, 'V'), '−10 … 10 mV'],
    [formatRange(0, 1e4, 'Hz'), '0 … 10 kHz'],
    [formatRange(0.1, 1e4, 'Hz'), '100 mHz … 10 kHz']
  ])('gives %s', (actual, expected) => {
    expect(actual).toBe(expected)
  })
})

describe('formatRange() on narrow ranges', () => {
  it('prints enough digits to tell the ends apart: 2.499 … 2.501 V', () => {
    expect(formatRange(2.499, 2.501, 'V')).toBe('2.499 … 2.501 V')
  })
  it('keeps 3 digits when they already differ', () => {
    expect(formatRange(-0.01, 0.01, 'V')).toBe('−10 … 10 mV')
  })
  it('prints equal ends once each, without extra digits', () => {
    expect(formatRange(2.5, 2.5, 'V')).toBe('2.5 … 2.5 V')
  })
})
