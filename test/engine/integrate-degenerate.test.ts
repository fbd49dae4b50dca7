import {describe, expect, it} from 'vitest'
import {integrateBand} from '../../src/engine/noise/integrate.js'

describe('integrateBand() on degenerate densities', () => {
  it('stops on the base grid when the density is not finite, instead of refining every panel to the depth limit', () => {
    const r = integrateBand(1, 1e4, 1, (_f, out, o) => { out[o] = Number.NaN })
    // Base grid: 4 decades × 20 points, rounded up to a multiple of 4, plus the quarter points
    // of each panel: far below the millions a depth-24 refinement of every panel would take.
    expect(r.evaluations).toBeLessThan(500)
  })

  it('still integrates a white density to its tolerance, 1e-5 relative (control)', () => {
    const r = integrateBand(1, 1e4, 1, (_f, out, o) => { out[o] = 4e-18 })
    const exact = 4e-18 * (1e4 - 1)
    expect(Math.abs(r.integral[0]! / exact - 1)).toBeLessThan(1e-5)
  })
})
