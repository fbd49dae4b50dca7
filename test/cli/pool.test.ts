import {describe, expect, it} from 'vitest'
import {freeCores} from '../../src/cli/pool.js'

describe('freeCores()', () => {
  it('is every core on an idle machine (or where no load average is reported)', () => {
    expect(freeCores(8, 0)).toBe(8)
    expect(freeCores(2, 0)).toBe(2)
  })
  it('is the cores less the load, to the nearest whole core', () => {
    expect(freeCores(4, 1.4)).toBe(3)
    expect(freeCores(4, 1.6)).toBe(2)
  })
  it('is one on a machine busier than its cores: the notes then run in this thread', () => {
    expect(freeCores(2, 15)).toBe(1)
    expect(freeCores(2, 1.6)).toBe(1)
  })
})
