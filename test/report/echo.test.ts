/**
 * Echoed inputs keep the author's prefix and always carry a unit, with a space before it;
 * each stage has one parameter table (its keys, the defaults applied and the op-amp's values
 * used), with "as written" said once, not on every row. PDFs read back with pdfjs.
 */
import {describe, expect, it} from 'vitest'
import {echoValue, dimensionOfKey} from '../../src/report/echo.js'
import {readPdf} from '../render/helpers.js'
import {pdfOf, sample} from './helpers.js'

describe('echoValue()', () => {
  it.each([
    ['2.2p', 'capacitance', '2.2 pF'],
    ['1M 0.5% 50ppm/K', 'resistance', '1 MΩ 0.5 % 50 ppm/K'],
    ['10K', 'resistance', '10 kΩ'],
    ['4k7 1%', 'resistance', '4k7 1 %'],
    ['0.5 uV/K', 'drift', '0.5 µV/K'],
    ['0.5u', 'drift', '0.5 µV/K'],
    ['0V', 'voltage', '0 V'],
    ['1 MΩ', 'resistance', '1 MΩ'],
    ['-10m .. 10m V', null, '-10 mV .. 10 mV'],
    ['±15V', null, '±15 V'],
    ['60 deg', 'angle', '60 deg'],
  ] as const)('%s (%s) → %s', (raw, dim, want) => {
    expect(echoValue(raw, dim)).toBe(want)
  })

  it('knows the dimension of a stage key and an opamp key', () => {
    expect(dimensionOfKey('cf', 'stage')).toBe('capacitance')
    expect(dimensionOfKey('rshunt', 'stage')).toBe('resistance')
    expect(dimensionOfKey('vos-drift', 'opamp')).toBe('drift')
    expect(dimensionOfKey('topology', 'stage')).toBeNull()
  })

  it('knows the dimension of an ina key and an adc key, so their bare numbers get a unit', () => {
    expect(dimensionOfKey('gain-constant', 'opamp')).toBe('resistance')
    expect(echoValue('49.4k', dimensionOfKey('gain-constant', 'opamp'))).toBe('49.4 kΩ')
    expect(dimensionOfKey('noise', 'stage')).toBe('converter-voltage')
  })
})

describe('the load-cell PDF’s ina block, read back with pdfjs', async () => {
  const all = (await readPdf((await pdfOf(sample('load-cell-bridge.md'))).pdf)).pages.join('\n').normalize('NFKC')

  it('echoes gain-constant with its unit', () => {
    expect(all).toContain('gain-constant 49.4 kΩ')
    expect(all).not.toMatch(/gain-constant 49\.4k\b/)
  })
})

describe('the photodiode PDF parameters, read back with pdfjs', async () => {
  const pages = (await readPdf((await pdfOf(sample('photodiode-receiver.md'))).pdf)).pages
  const all = pages.join('\n')

  it('echoes every value with its unit, the author’s prefix kept', () => {
    for (const v of ['2.2 pF', '50 pF', '500 MΩ', '50 pA', '1.5 pF', '1 MΩ 0.5 % 50 ppm/K']) expect(all).toContain(v)
    for (const bare of [' 2.2p ', ' 50p ', ' 500M ', ' 1.5p ', ' 1M ']) expect(all).not.toContain(bare)
  })

  it('has one parameter table for the stage, op-amp values included, and “as written” said once', () => {
    expect(all.match(/Table \d+ — Parameters of stage rx-tia/g) ?? all.match(/Parameters of stage rx-tia/g)).toHaveLength(1)
    expect(all).not.toMatch(/values used/)
    expect(all).toContain('Gain-bandwidth product 5 MHz op-amp, used')
    expect((all.match(/as written/g) ?? []).length).toBeLessThanOrEqual(1)
  })
})

describe('the load-cell PDF keeps the author’s prefix', async () => {
  const all = (await readPdf((await pdfOf(sample('load-cell-bridge.md'))).pdf)).pages.join('\n')
  it('shows 0.5 µV/K as written, and the input range with units on both ends', () => {
    expect(all).toContain('0.5 µV/K'.normalize('NFKC'))
    expect(all).toContain('-10 mV .. 10 mV')
    expect(all).not.toContain('500 nV/K')
    expect(all).not.toMatch(/\b0V\b/)
  })
})
