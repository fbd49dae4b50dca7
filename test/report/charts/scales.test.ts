import {describe, expect, it} from 'vitest'
import {decadeDomain, extent, logTicks, plottablePoints} from '../../../src/report/charts/scales.js'

describe('plottablePoints()', () => {
  it('keeps zero and negative y on a linear y axis', () => {
    expect(plottablePoints([1, 2, 3], [0, -1, 2], false)).toEqual([{x: 1, y: 0}, {x: 2, y: -1}, {x: 3, y: 2}])
  })

  it('drops zero and negative y on a log y axis', () => {
    expect(plottablePoints([1, 2, 3], [0, -1, 2], true)).toEqual([{x: 3, y: 2}])
  })

  it('drops x ≤ 0 and non-finite values', () => {
    expect(plottablePoints([0, -1, NaN, 4, 5], [1, 1, 1, Infinity, 1], false)).toEqual([{x: 5, y: 1}])
  })
})

describe('extent()', () => {
  it('throws on an empty list', () => {
    expect(() => extent([], 'curve')).toThrow(/Unexpected empty curve/)
  })
})

describe('decadeDomain()', () => {
  it.each([
    [[3e-9, 4.5e-7], [1e-9, 1e-6]],
    [[1e-8, 1e-7], [1e-8, 1e-7]],
    [[2e-8, 3e-8], [1e-8, 1e-7]],
    [[5, 5], [1, 10]]
  ] as const)('widens %j to %j', (range, expected) => {
    const [lo, hi] = decadeDomain([range[0], range[1]])
    expect(lo).toBeCloseTo(expected[0], 20)
    expect(hi / expected[1]).toBeCloseTo(1, 12)
  })

  it.each([[[0, 1]], [[-1, 1]], [[NaN, 1]], [[2, 1]]] as const)('refuses %j', (range) => {
    expect(() => decadeDomain([range[0], range[1]])).toThrow(RangeError)
  })
})

describe('logTicks()', () => {
  it('gives the decades inside the range', () => {
    expect(logTicks([0.1, 10e3])).toEqual([0.1, 1, 10, 100, 1000, 10000])
  })

  it('gives 1-2-5 steps when fewer than two decades fall inside', () => {
    expect(logTicks([15, 120])).toEqual([20, 50, 100])
  })

  it('prints exact values for tiny decades', () => {
    expect(logTicks([1e-9, 1e-6])).toEqual([1e-9, 1e-8, 1e-7, 1e-6])
  })
})
