/**
 * A capacitive load (DESIGN §8.3): the loop sees rout·cload as a second pole. Checked against
 * a hand two-pole estimate, and the riso search against its own claim (margin rises with riso).
 */
import {describe, expect, it} from 'vitest'
import {capacitiveLoadAdvice, evaluateStage, marginOverRiso} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../engine/helpers.js'

describe('phase margin with rout·cload vs a hand two-pole estimate', () => {
  // Follower, single-pole op-amp (pm-unity 90°: no second pole), rout into cload:
  // T(f) ≈ (gbw/jf)·1/(1 + jf/fL), fL = 1/(2π·rout·cload). |T(fc)| = 1 gives
  // fc⁴/fL² + fc² − gbw² = 0, so fc² = fL²·(√(1 + 4·gbw²/fL²) − 1)/2, and
  // PM = 90° − atan(fc/fL) (two-pole loop, any control text; the dominant pole at gbw/Aol
  // adds well under 0.01° at fc).
  const cases = [
    {rout: 50, cload: 10e-9, gbw: 1e6},
    {rout: 100, cload: 1e-9, gbw: 5e6},
    {rout: 20, cload: 100e-9, gbw: 2e6}
  ]
  it.each(cases)('rout $rout Ω, cload $cload F, gbw $gbw Hz: within 0.1°', ({rout, cload, gbw}) => {
    const s = stageInput({
      topology: 'follower', rf: null, rg: null, rs: null, cstray: 0, cload,
      opamp: testOpamp({gbw, aol: 1e6, pmUnity: 90, rout, cinCm: 0, cinDiff: 0})
    })
    const fL = 1 / (2 * Math.PI * rout * cload)
    const fc = Math.sqrt((fL ** 2 * (Math.sqrt(1 + (4 * gbw ** 2) / fL ** 2) - 1)) / 2)
    const pm = 90 - (Math.atan(fc / fL) * 180) / Math.PI
    const r = evaluateStage(s)
    expect(r.stability.crossover as number).toBeCloseTo(fc, -Math.floor(Math.log10(fc)) + 3)
    expect(Math.abs((r.stability.phaseMargin as number) - pm)).toBeLessThan(0.1)
  })
})

describe('riso restores the margin (DESIGN §8.3)', () => {
  // A precision follower with rout 50 Ω driving 10 nF (the case of §8.3), two-pole op-amp.
  const s = stageInput({topology: 'follower', rf: null, rg: null, rs: null, cload: 10e-9, opamp: testOpamp({gbw: 1e6, pmUnity: 60, rout: 50})})
  it('margin rises monotonically with riso up to its peak, and stays at or above the unloaded margin beyond it', () => {
    // Past the peak a large riso isolates the load entirely and the margin settles back to
    // the unload follower's (pm-unity, 60°) from above: the first crossing is the smallest riso.
    const {riso, margin} = marginOverRiso(s)
    const peak = margin.indexOf(Math.max(...margin))
    expect(riso[peak] as number).toBeGreaterThan(1)
    for (let i = 1; i <= peak; i++) expect(margin[i] as number).toBeGreaterThanOrEqual((margin[i - 1] as number) - 1e-9)
    const unloaded = capacitiveLoadAdvice(s)?.marginWithoutLoad as number
    for (let i = peak; i < margin.length; i++) expect(margin[i] as number).toBeGreaterThanOrEqual(unloaded - 0.01)
    expect(margin[0] as number).toBeLessThan(40)
  })
  it('the load costs margin, and the suggested riso gives the target with the bandwidth it leaves', () => {
    const a = capacitiveLoadAdvice(s)
    expect(a).not.toBeNull()
    const advice = a as NonNullable<typeof a>
    expect(advice.cost as number).toBeGreaterThan(15)
    expect(advice.target).toBe(60)
    const fixed = evaluateStage({...s, riso: res(advice.riso as number)})
    expect(Math.abs((fixed.stability.phaseMargin as number) - 60)).toBeLessThan(0.01)
    expect(fixed.stability.bandwidth).toBeCloseTo(advice.bandwidth as number, 3)
    // Smallest: 2 % less riso falls short of the target.
    const less = evaluateStage({...s, riso: res((advice.riso as number) * 0.98)})
    expect(less.stability.phaseMargin as number).toBeLessThan(60)
  })
  it('is null without cload', () => {
    expect(capacitiveLoadAdvice({...s, cload: 0})).toBeNull()
  })
})
