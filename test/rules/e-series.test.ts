import {describe, expect, it} from 'vitest'
import {E24, E3, E96, isOnSeries, nearestOnSeries, roundUpToSeries} from '../../src/rules/e-series.js'

describe('rules/e-series', () => {
  // Source: IEC 60063 — E96 is 10^(i/96) rounded to three figures with no exceptions (from memory).
  it('lists 96 E96 mantissas, each 10^(i/96) to three figures', () => {
    expect(E96.map((m, i) => Math.abs(m - Math.round(10 ** (i / 96) * 100) / 100) < 1e-9)).toEqual(E96.map(() => true))
    expect(E96).toHaveLength(96)
  })

  // Source: IEC 60063 — E24 keeps its historical values 2.7 … 4.7 and 8.2 (from memory).
  it('lists 24 E24 mantissas with the historical 2.7 … 4.7 and 8.2', () => {
    expect(E24).toHaveLength(24)
    expect(E24.slice(10, 17)).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7])
    expect(E24[22]).toBe(8.2)
  })

  it('lists E3 as 1, 2.2, 4.7', () => {
    expect(E3).toEqual([1, 2.2, 4.7])
  })

  // From memory: 4.99 and 49.9 are E96, 4.7 and 47 k are E24 but not E96, 4.93 is neither.
  it.each([
    [4.99, 'E96', true],
    [49.9, 'E96', true],
    [49.9e3, 'E96', true],
    [1.02e6, 'E96', true],
    [4.7, 'E24', true],
    [47e3, 'E24', true],
    [4.7, 'E96', false],
    [4.93, 'E96', false],
    [4.93, 'E24', false],
    [0.1, 'E24', true]
  ] as const)('isOnSeries(%s, %s) is %s', (value, series, expected) => {
    expect(isOnSeries(value, series)).toBe(expected)
  })

  it.each([
    [47.3e3, 'E96', 47.5e3],
    [47.3e3, 'E24', 47e3],
    [9.9e3, 'E24', 10e3],
    [1.005, 'E96', 1.0],
    [10.1, 'E96', 10.2]
  ] as const)('nearestOnSeries(%s, %s) is %s', (value, series, expected) => {
    expect(nearestOnSeries(value, series)).toBe(expected)
  })

  it.each([
    [1.6e-6, 2.2e-6],
    [2.2e-6, 2.2e-6],
    [5e-9, 1e-8],
    [1e-12, 1e-12]
  ])('roundUpToSeries(%s, E3) is %s', (value, expected) => {
    expect(roundUpToSeries(value, 'E3')).toBe(expected)
  })
})
