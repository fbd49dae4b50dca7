/**
 * `integrateBand()` on integrands with closed-form integrals (calculus), DESIGN §4.3.
 */
import {describe, expect, it} from 'vitest'
import {integrateBand} from '../../src/engine/index.js'

describe('integrateBand()', () => {
  // ∫ 1/(1 + (f/fc)²) df = fc·atan(f/fc) (calculus). Tolerance 1e-5 relative (asked: 0.1 % on rms).
  it('integrates a one-pole density to fc·[atan(fH/fc) − atan(fL/fc)]', () => {
    const fc = 1234
    const r = integrateBand(0.1, 1e6, 1, (f, out, o) => {
      out[o] = 1 / (1 + (f / fc) ** 2)
    })
    expect(Math.abs(r.integral[0] / (fc * (Math.atan(1e6 / fc) - Math.atan(0.1 / fc))) - 1)).toBeLessThan(1e-5)
  })
  // A resonance of quality factor Q: ∫ of |1/(1 − x² + jx/Q)|² over all x is πQ/2 (calculus,
  // residues); the band covers it with a tail error < 1e-6. Tolerance 1e-4.
  it.each([5, 30, 100])('integrates a resonance with Q = %d (πQ/2 · f0)', (q) => {
    const f0 = 1e4
    const r = integrateBand(1e-2, 1e10, 1, (f, out, o) => {
      const x = f / f0
      out[o] = 1 / ((1 - x * x) ** 2 + (x / q) ** 2)
    })
    expect(Math.abs(r.integral[0] / ((Math.PI * q * f0) / 2) - 1)).toBeLessThan(1e-4)
  })
  it('adds contributor integrals to the cumulative total exactly', () => {
    const r = integrateBand(1, 1e4, 3, (f, out, o) => {
      out[o] = 1
      out[o + 1] = 10 / f
      out[o + 2] = 1 / (1 + (f / 300) ** 4)
    })
    const sum = r.integral.reduce((a, b) => a + b, 0)
    expect(Math.abs((r.cumulative.at(-1) as number) / sum - 1)).toBeLessThan(1e-12)
    expect(Math.abs(r.integral[0] / (1e4 - 1) - 1)).toBeLessThan(1e-5) // ∫1 df, to the 1e-5 integration tolerance
    expect(Math.abs(r.integral[1] / (10 * Math.log(1e4)) - 1)).toBeLessThan(1e-12) // ∫10/f df: constant in ln f, exact
  })
  it('returns zeros for a zero density', () => {
    const r = integrateBand(1, 10, 2, (_, out, o) => {
      out[o] = 0
      out[o + 1] = 0
    })
    expect(Array.from(r.integral)).toEqual([0, 0])
  })
})
