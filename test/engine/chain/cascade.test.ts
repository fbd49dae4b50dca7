/**
 * The chain cascade (DESIGN §8.6) against outside references, each named beside its check.
 */
import {describe, expect, it} from 'vitest'
import {evaluateChain, lsbOf, noiseFreeBitsOf, effectiveBitsOf, ADC_ARCHETYPES, closedLoopGain, noiseTransfers, noiseSources, createWorkspace, stageNetlist} from '../../../src/engine/index.js'
import {res, stageInput} from '../helpers.js'
import {chainInput, idealAdc, realStage, syntheticStage} from './helpers.js'

describe('converter resolution', () => {
  // Source: standard converter texts (from memory): LSB = span / 2^bits.
  it('gives LSB = span / 2^bits: 62.5 µV for 16 bits over 4.096 V', () => {
    expect(lsbOf({bits: 16, input: [0, 4.096]})).toBeCloseTo(62.5e-6, 15)
    expect(lsbOf(ADC_ARCHETYPES['delta-sigma-24'])).toBeCloseTo(5 / 2 ** 24, 18)
  })

  // Source: quantisation noise of a busy input is LSB/√12 (standard converter texts, from memory);
  // noise-free bits log2(span/(6.6σ)) (common practice), so an ideal converter shows bits − log2(6.6/√12) ≈ bits − 0.93.
  it('shows LSB/√12 and bits − 0.93 noise-free bits for an ideal converter behind a noiseless stage', () => {
    const adc = idealAdc(16, [-2.5, 2.5])
    const r = evaluateChain(chainInput(['a'], adc), [syntheticStage('a', 1, 0)])
    const lsb = 5 / 65536
    expect(r.noise.converterRms).toBeCloseTo(lsb / Math.sqrt(12), 15)
    expect(r.noise.noiseFreeBits).toBeCloseTo(16 - Math.log2(6.6 / Math.sqrt(12)), 10)
    expect(16 - Math.log2(6.6 / Math.sqrt(12))).toBeCloseTo(15.07, 2)
  })

  // Source: effective resolution log2(span/σ) (common practice), capped at the converter's bits.
  it('caps effective resolution log2(span/σ) at the converter bits', () => {
    expect(effectiveBitsOf(5, 5 / 2 ** 20, 24)).toBeCloseTo(20, 12)
    expect(effectiveBitsOf(5, 1e-12, 24)).toBe(24)
    expect(noiseFreeBitsOf(5, 5 / (6.6 * 2 ** 18), 24)).toBeCloseTo(18, 12)
  })

  it('adds the converter noise in power to the chain noise and LSB²/12', () => {
    const adc = {...idealAdc(24, [-2.5, 2.5]), noise: 1e-6}
    const r = evaluateChain(chainInput(['a'], adc, [1, 101]), [syntheticStage('a', 1, 1e-7)])
    const chain = 1e-7 * Math.sqrt(100)
    expect(r.noise.converterRms! / Math.sqrt(chain ** 2 + 1e-12 + (5 / 2 ** 24) ** 2 / 12)).toBeCloseTo(1, 5)
  })
})

describe('cascaded noise', () => {
  // Analytic: flat densities e1, e2 over a band B give σk = ek·√B; the second stage carries
  // the first's noise at its gain G2, so σ = √(σ1²·G2² + σ2²).
  it('equals √(σ1²·G2² + σ2²) for two flat stages (analytic, tolerance 1e-6)', () => {
    const [fL, fH] = [1, 1001]
    const e1 = 50e-9, e2 = 200e-9, g2 = 7
    const r = evaluateChain(chainInput(['a', 'b'], null, [fL, fH]), [syntheticStage('a', 10, e1), syntheticStage('b', g2, e2)])
    const s1 = e1 * Math.sqrt(fH - fL)
    const s2 = e2 * Math.sqrt(fH - fL)
    expect(r.noise.outputRms / Math.hypot(s1 * g2, s2)).toBeCloseTo(1, 6)
    expect(r.stageNoise[0]!.outputRms / (s1 * g2)).toBeCloseTo(1, 6)
  })

  // Analytic, with the stages' own results: two real stages whose responses are flat over the
  // band (10 MHz op-amps, 1 Hz … 100 Hz, no 1/f corners): σ from each stage's own noise budget.
  it('equals √(σ1²·G2² + σ2²) from two real stages’ own noise budgets (tolerance 0.05 %)', () => {
    const op = {en: 10e-9, enCorner: 0, in: 0.2e-12, inCorner: 0, gbw: 10e6}
    const a = realStage(stageInput({id: 'a', band: [1, 100], opamp: {...stageInput().opamp, ...op}}))
    const b = realStage(stageInput({id: 'b', topology: 'inverting', rf: res(30e3), rg: res(10e3), rs: null, band: [1, 100], opamp: {...stageInput().opamp, ...op}, input: [-1, 1]}))
    const r = evaluateChain(chainInput(['a', 'b'], null, [1, 100]), [a.view, b.view])
    const expected = Math.hypot(a.result.noise.outputRms * Math.abs(b.result.gain), b.result.noise.outputRms)
    expect(Math.abs(r.noise.outputRms / expected - 1)).toBeLessThan(5e-4)
  })

  // Numerical integral written here: composite Simpson in ln f on 20,000 intervals of
  // Sout(f) = e1²·G1²… carried through |H2(f)|² + S2(f), H2 a one-pole low-pass inside the band.
  it('equals a numerical integral of the product of the densities with a one-pole second stage (tolerance 1e-5)', () => {
    const [fL, fH] = [0.5, 5000]
    const e1 = 30e-9, e2 = 80e-9, g2 = 4, pole = 300
    const r = evaluateChain(chainInput(['a', 'b'], null, [fL, fH]), [syntheticStage('a', 20, e1), syntheticStage('b', g2, e2, pole)])
    const sOut = (f: number): number => {
      const h2 = (g2 * g2) / (1 + (f / pole) ** 2)
      return e1 * e1 * h2 + (e2 * e2) / (1 + (f / pole) ** 2)
    }
    const n = 20000
    const uL = Math.log(fL), h = (Math.log(fH) - uL) / n
    let sum = 0
    for (let i = 0; i <= n; i++) {
      const f = Math.exp(uL + i * h)
      sum += (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * f * sOut(f)
    }
    expect(r.noise.outputRms / Math.sqrt((sum * h) / 3)).toBeCloseTo(1, 5)
  })

  // The same with real stages: the second an inverting stage with cf (a pole at 1/(2π·Rf·Cf)),
  // the integrand built here from the stages' own per-frequency transfers (closedLoopGain,
  // noiseTransfers), trapezoid in ln f on 40,000 intervals.
  it('matches a numerical integral of real stages’ densities with a one-pole second stage (tolerance 0.05 %)', () => {
    const a = stageInput({id: 'a', band: [1, 2000]})
    const b = stageInput({id: 'b', topology: 'inverting', rf: res(10e3), rg: res(10e3), rs: null, cf: 100e-9, band: [1, 2000], input: [-1, 1]})
    const r = evaluateChain(chainInput(['a', 'b'], null, [1, 2000]), [realStage(a).view, realStage(b).view])
    const psd = (input: typeof a, f: number): number => {
      const ws = createWorkspace(stageNetlist(input))
      const sources = noiseSources(input, ws.net)
      return noiseTransfers(input, f).reduce((s, t, i) => s + t.parts.reduce((sp, p, j) => sp + (p.re ** 2 + p.im ** 2) * sources[i]!.parts[j]!.white, 0) * (1 + sources[i]!.corner / f), 0)
    }
    const n = 4000
    const uL = 0, h = Math.log(2000) / n
    let sum = 0
    for (let i = 0; i <= n; i++) {
      const f = Math.exp(uL + i * h)
      const hb = closedLoopGain(b, f)
      const s = psd(a, f) * (hb.re ** 2 + hb.im ** 2) + psd(b, f)
      sum += (i === 0 || i === n ? 0.5 : 1) * f * s
    }
    expect(Math.abs(r.noise.outputRms / Math.sqrt(sum * h) - 1)).toBeLessThan(5e-4)
  })
})

describe('alias rejection', () => {
  // By hand: a one-pole low-pass falls monotonically, so the largest |H/H(0)| over
  // [fs − fH, fs + fH] is at fs − fH: rejection = 10·lg(1 + ((fs − fH)/fp)²).
  it('is −20·lg|H(fs − fH)| for a one-pole chain', () => {
    const fs = 10e3, fH = 100, fp = 150
    const r = evaluateChain(chainInput(['a'], idealAdc(16, [-1, 1], fs), [1, fH]), [syntheticStage('a', 1, 1e-9, fp)])
    expect(r.aliasRejection).toBeCloseTo(10 * Math.log10(1 + ((fs - fH) / fp) ** 2), 6)
  })

  // By hand: two one-pole stages multiply, so the decibels add.
  it('is −20·lg|H1·H2(fs − fH)| for a two-pole chain', () => {
    const fs = 50e3, fH = 10, p1 = 200, p2 = 1e3
    const r = evaluateChain(chainInput(['a', 'b'], idealAdc(16, [-1, 1], fs), [0.1, fH]), [syntheticStage('a', 3, 1e-9, p1), syntheticStage('b', 2, 1e-9, p2)])
    const x = fs - fH
    expect(r.aliasRejection).toBeCloseTo(10 * Math.log10(1 + (x / p1) ** 2) + 10 * Math.log10(1 + (x / p2) ** 2), 6)
  })

  // By hand with a real stage: an inverting stage with cf has its pole at 1/(2π·Rf·Cf);
  // the op-amp's own poles (2 MHz) change |H| at 9.9 kHz by under 0.05 dB.
  it('is close to the one-pole figure for a real inverting stage with cf (tolerance 0.05 dB)', () => {
    const b = stageInput({id: 'b', topology: 'inverting', rf: res(10e3), rg: res(10e3), rs: null, cf: 100e-9, input: [-1, 1], band: [1, 100]})
    const fp = 1 / (2 * Math.PI * 10e3 * 100e-9)
    const r = evaluateChain(chainInput(['b'], idealAdc(16, [-2, 2], 10e3), [1, 100]), [realStage(b).view])
    expect(Math.abs(r.aliasRejection! - 10 * Math.log10(1 + ((10e3 - 100) / fp) ** 2))).toBeLessThan(0.05)
  })

  it('is null when fs ≤ 2·fH', () => {
    const r = evaluateChain(chainInput(['a'], idealAdc(16, [-1, 1], 150), [1, 100]), [syntheticStage('a', 1, 1e-9, 50)])
    expect(r.aliasRejection).toBeNull()
  })
})

describe('DC cascade', () => {
  // Σ ek·Π|Gj| of the later stages, computed here from the stages' own results, plus the
  // converter terms by hand: offset + offset-drift·ΔT + gain-error·max|V| + gain-drift·ΔT·max|V| + inl·LSB.
  it('carries each stage’s worst case through the later gains and adds the converter terms', () => {
    const a = realStage(stageInput({id: 'a'}))
    const b = realStage(stageInput({id: 'b', topology: 'inverting', rf: res(20e3, 0.001, 25e-6), rg: res(10e3, 0.001, 25e-6), rs: null, input: [-1.05, 1.05]}))
    const c = realStage(stageInput({id: 'c', topology: 'follower', rf: null, rg: null, rs: null, input: [-2.1, 2.1]}))
    const adc = {...idealAdc(18, [-4.096, 4.096]), offset: 100e-6, offsetDrift: 1e-6, gainError: 2e-4, gainDrift: 3e-6, inl: 2}
    const r = evaluateChain(chainInput(['a', 'b', 'c'], adc, [0.1, 1000], {temperature: [-20, 70]}), [a.view, b.view, c.view])
    const ga = Math.abs(a.result.gain), gb = Math.abs(b.result.gain), gc = Math.abs(c.result.gain)
    const stages = a.result.dc.worstCaseOutput * gb * gc + b.result.dc.worstCaseOutput * gc + c.result.dc.worstCaseOutput
    const vmax = Math.max(...c.result.swing.outputSpan.map(Math.abs))
    const dT = 45
    const converter = 100e-6 + 1e-6 * dT + 2e-4 * vmax + 3e-6 * dT * vmax + 2 * (8.192 / 2 ** 18)
    expect(r.dc.worstCaseOutput / (stages + converter)).toBeCloseTo(1, 12)
    expect(r.dc.worstCaseInput / ((stages + converter) / (ga * gb * gc))).toBeCloseTo(1, 12)
    expect(r.dc.worstCaseLsb! / ((stages + converter) / (8.192 / 2 ** 18))).toBeCloseTo(1, 12)
    const first = r.dc.contributors.find((x) => x.source === 'a' && x.key === 'vos')!
    expect(first.output / (a.result.dc.contributors.find((x) => x.key === 'vos')!.output * gb * gc)).toBeCloseTo(1, 12)
    expect(r.dc.contributors.filter((x) => x.source === 'ideal').map((x) => x.key)).toEqual(['offset', 'offset-drift', 'gain-error', 'gain-drift', 'inl'])
  })

  it('removes the converter offset with an offset calibration and its gain error with offset-and-gain', () => {
    const s = syntheticStage('a', 1, 0, Infinity, [{key: 'vos', output: 1e-3}])
    s.calibrated = [{key: 'vos', output: 0}]
    const adc = {...idealAdc(16, [-1, 1]), offset: 1e-3, gainError: 1e-3}
    const off = evaluateChain(chainInput(['a'], adc, [1, 10], {calibration: 'offset'}), [s]).dc.calibrated!
    expect(off.contributors.find((c) => c.key === 'offset')!.output).toBe(0)
    expect(off.contributors.find((c) => c.key === 'gain-error')!.output).toBeCloseTo(1e-3, 15)
    const both = evaluateChain(chainInput(['a'], adc, [1, 10], {calibration: 'offset-and-gain'}), [s]).dc.calibrated!
    expect(both.contributors.find((c) => c.key === 'gain-error')!.output).toBe(0)
  })
})

describe('converter range', () => {
  it('is met inside the range, not met outside, and reports the fraction used', () => {
    const inside = evaluateChain(chainInput(['a'], idealAdc(16, [-2, 2]), [1, 10]), [syntheticStage('a', 1, 0)])
    expect(inside.requirements.find((x) => x.key === 'converter-range')!.met).toBe(true)
    expect(inside.rangeUsed).toBeCloseTo(0.5, 12)
    const outside = evaluateChain(chainInput(['a'], idealAdc(16, [0, 2]), [1, 10]), [syntheticStage('a', 1, 0)])
    expect(outside.requirements.find((x) => x.key === 'converter-range')!.met).toBe(false)
  })
})

describe('chain bandwidth', () => {
  // Analytic: two equal one-pole stages at fp give |H|² = 1/(1 + (f/fp)²)², which falls to
  // 1/2 at f = fp·√(√2 − 1) (about 0.644·fp).
  it('is fp·√(√2 − 1) for two equal one-pole stages', () => {
    const r = evaluateChain(chainInput(['a', 'b'], null, [1, 10]), [syntheticStage('a', 2, 1e-9, 1e3), syntheticStage('b', 3, 1e-9, 1e3)])
    expect(r.bandwidth! / (1e3 * Math.sqrt(Math.SQRT2 - 1))).toBeCloseTo(1, 6)
  })

  it('is the pole of a single one-pole stage', () => {
    const r = evaluateChain(chainInput(['a'], null, [1, 10]), [syntheticStage('a', 1, 1e-9, 250)])
    expect(r.bandwidth! / 250).toBeCloseTo(1, 6)
  })
})
