import {describe, expect, it} from 'vitest'
import {didYouMean, editDistance} from '../../src/note/did-you-mean.js'

describe('editDistance()', () => {
  it.each([
    ['rf', 'rf', 0],
    ['rff', 'rf', 1],
    ['cstary', 'cstray', 1],
    ['kitten', 'sitting', 3]
  ])('%s → %s is %d', (a, b, d) => {
    expect(editDistance(a, b)).toBe(d)
  })
})

describe('didYouMean()', () => {
  it('suggests the nearest candidate', () => {
    expect(didYouMean('supply-tolerence', ['supply', 'supply-tolerance', 'temperature'])).toBe('supply-tolerance')
  })
  it('suggests nothing for a word far from all candidates', () => {
    expect(didYouMean('colour', ['rf', 'rg', 'band'])).toBeNull()
  })
  it('suggests the right case for a word that differs only in case', () => {
    expect(didYouMean('Title', ['title'])).toBe('title')
  })
})
