/**
 * The nodal solver's parts (DESIGN §4.3): linear solve, node merging, netlists.
 */
import {lusolve} from 'mathjs'
import {describe, expect, it} from 'vitest'
import {buildNetlist, solveInPlace, stageNetlist, transposeInPlace} from '../../src/engine/index.js'
import {res, stageInput} from './helpers.js'

describe('solveInPlace()', () => {
  // Source: mathjs lusolve (real case, independent) on a system needing a row exchange.
  it('solves a system with a zero leading pivot like mathjs lusolve', () => {
    const a = [[0, 2, 1], [1e-3, 5, -1], [4, 0, 3]]
    const b = [1, 2, 3]
    const ref = (lusolve(a, b) as number[][]).map((r) => r[0])
    const re = Float64Array.from(a.flat())
    const im = new Float64Array(9)
    const br = Float64Array.from(b)
    const bi = new Float64Array(3)
    solveInPlace(3, re, im, br, bi, new Float64Array(3))
    ref.forEach((x, i) => expect(Math.abs(br[i] - x)).toBeLessThan(1e-12 * Math.abs(x)))
    expect(Array.from(bi)).toEqual([0, 0, 0])
  })
  it('solves a complex 2×2 system (hand-checked: (1+j)x = 2j → x = 1 + j)', () => {
    const re = Float64Array.from([1, 0, 0, 1])
    const im = Float64Array.from([1, 0, 0, 0])
    const br = Float64Array.from([0, 3])
    const bi = Float64Array.from([2, 0])
    solveInPlace(2, re, im, br, bi, new Float64Array(2))
    expect([br[0], bi[0], br[1], bi[1]].map((x) => Math.round(x * 1e12) / 1e12)).toEqual([1, 1, 3, 0])
  })
  it('transposes in place', () => {
    const re = Float64Array.from([1, 2, 3, 4])
    const im = Float64Array.from([5, 6, 7, 8])
    transposeInPlace(2, re, im)
    expect(Array.from(re)).toEqual([1, 3, 2, 4])
    expect(Array.from(im)).toEqual([5, 7, 6, 8])
  })
})

describe('buildNetlist()', () => {
  it('merges the − pin into the output for a follower without rf', () => {
    const n = stageNetlist(stageInput({topology: 'follower', rf: null, rg: null}))
    expect(n.minus).toBe(n.out)
    expect(n.elements.some((e) => e.label === 'rf' || e.label === 'cf')).toBe(false)
  })
  it('merges the + pin into the source when rs and rcomp are absent', () => {
    const n = stageNetlist(stageInput({rs: null, rcomp: null}))
    expect(n.plus).toBe(n.drive.node)
  })
  it('treats a 0 Ω resistor as a wire', () => {
    const n = stageNetlist(stageInput({rs: res(0), rcomp: null}))
    expect(n.plus).toBe(n.drive.node)
    expect(n.elements.some((e) => e.label === 'rs')).toBe(false)
  })
  it('grounds the + pin of an inverting stage without rcomp', () => {
    expect(stageNetlist(stageInput({topology: 'inverting', rcomp: null})).plus).toBe(0)
  })
  it('keeps a 0 F cf across rf (for the Cf search) and drops other 0 F capacitors', () => {
    const n = stageNetlist(stageInput({cf: 0, cstray: 0}))
    expect(n.elements.filter((e) => e.label === 'cf')).toHaveLength(1)
    expect(n.elements.some((e) => e.label === 'cstray')).toBe(false)
  })
  it('drops elements shorted by a merge', () => {
    const n = buildNetlist({
      elements: [{label: 'rf', kind: 'r', a: 'm', b: 'o', value: 1e3}, {label: 'cstray', kind: 'c', a: 'm', b: 'o', value: 1e-12}],
      wires: [['m', 'o']], drive: {kind: 'voltage', node: 'src'}, opamp: {aol: 1e5, fp1: 10, fp2: 1e6}
    })
    expect(n.elements).toEqual([])
  })
})
