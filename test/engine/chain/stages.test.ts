/**
 * Chains through every topology (DESIGN §8.6): an instrumentation stage (no netlist: the
 * block model of §8.2), a difference stage and the two low-pass filters, each cascade checked
 * against formulas written here from the stages' own results and their own models:
 *   DC: Σ ek·Πj>k|Gj| (and the RSS likewise in quadrature);
 *   noise: a numerical integral (trapezoid in ln f) of Σ Sk(f)·Πj>k|Hj(f)|², Sk and Hj built
 *   here — for an op-amp stage from its own per-frequency transfers (noiseTransfers,
 *   closedLoopGain), for the instrumentation stage from the density formula of §8.2 written
 *   out below;
 *   a filter's |H| against its analytic second-order response.
 */
import {describe, expect, it} from 'vitest'
import {
  BOLTZMANN, closedLoopGain, createWorkspace, evaluateChain, INA_ARCHETYPES, inaAsOpamp, noiseSources, noiseTransfers, stageNetlist, stageSpectrum,
  type ChainStage, type InaParams, type StageInput, type StageResult
} from '../../../src/engine/index.js'
import {res, stageInput, testOpamp} from '../helpers.js'
import {chainInput, idealAdc, realStage} from './helpers.js'

/** Output density of an op-amp stage at f (V²/Hz), from its own noise transfers and sources. */
function opampPsd(input: StageInput, f: number): number {
  const ws = createWorkspace(stageNetlist(input))
  const sources = noiseSources(input, ws.net)
  return noiseTransfers(input, f).reduce((s, t, i) =>
    s + t.parts.reduce((sp, p, j) => sp + (p.re ** 2 + p.im ** 2) * sources[i]!.parts[j]!.white, 0) * (1 + sources[i]!.corner / f), 0)
}

/** |H(f)|² of an op-amp stage from its own closed-loop solve. */
const opampH2 = (input: StageInput, f: number): number => {
  const h = closedLoopGain(input, f)
  return h.re ** 2 + h.im ** 2
}

/**
 * DESIGN §8.2, written out: output density of an instrumentation stage,
 * e² = en-in²(1 + fce/f) + en-out²(1 + fce/f)/G² + 2·in²(1 + fci/f)·Rs² + 2·4kT·Rs + 4kT·rg·((G − 1)/G)²,
 * times |H|² = G²/(1 + (f/(gbw/G))²).
 */
function inaPsd(input: StageInput, f: number): number {
  const ina = input.ina!
  const rg = input.rg!.value
  const g = 1 + ina.gainConstant / rg
  const rs = input.rs?.value ?? 0
  const kT4 = 4 * BOLTZMANN * (input.noiseTemperature + 273.15)
  const e2 = ina.enIn ** 2 * (1 + ina.enCorner / f) + (ina.enOut ** 2 * (1 + ina.enCorner / f)) / g ** 2 +
    2 * ina.in ** 2 * (1 + ina.inCorner / f) * rs ** 2 + 2 * kT4 * rs + kT4 * rg * ((g - 1) / g) ** 2
  return e2 * inaH2(input, f)
}
const inaH2 = (input: StageInput, f: number): number => {
  const g = 1 + input.ina!.gainConstant / input.rg!.value
  return g ** 2 / (1 + (f / (input.ina!.gbw / g)) ** 2)
}

/** Trapezoid in ln f of Σk Sk(f)·Πj>k|Hj(f)|² over [fL, fH], n intervals; total and each stage's part. */
function cascadeIntegral(psd: ((f: number) => number)[], h2: ((f: number) => number)[], fL: number, fH: number, n = 4000): {total: number; parts: number[]} {
  const uL = Math.log(fL), h = (Math.log(fH) - uL) / n
  const parts = psd.map(() => 0)
  for (let i = 0; i <= n; i++) {
    const f = Math.exp(uL + i * h)
    const w = (i === 0 || i === n ? 0.5 : 1) * f * h
    let later = 1
    for (let k = psd.length - 1; k >= 0; k--) {
      parts[k] += w * psd[k]!(f) * later
      later *= h2[k]!(f)
    }
  }
  return {total: parts.reduce((a, b) => a + b, 0), parts}
}

/** Σ ek·Πj>k|Gj| and √Σ(ci·Πj>k|Gj|)² from the stages' own results. */
function dcCascade(results: readonly StageResult[]): {worst: number; rss: number} {
  let worst = 0, squares = 0
  results.forEach((r, k) => {
    const later = results.slice(k + 1).reduce((g, s) => g * Math.abs(s.gain), 1)
    worst += r.dc.worstCaseOutput * later
    for (const c of r.dc.contributors) squares += (c.output * later) ** 2
  })
  return {worst, rss: Math.sqrt(squares)}
}

/** The next stage of a chain takes the previous stage's output span as its input (DESIGN §8.6). */
const after = (prev: StageResult, input: StageInput): StageInput => ({...input, input: [prev.swing.outputSpan[0], prev.swing.outputSpan[1]]})

const ina = (over: Partial<InaParams> = {}): InaParams => ({...INA_ARCHETYPES['precision-ina'], archetype: false, name: 'test-ina', ...over})
const inaStage = (over: Partial<StageInput> = {}): StageInput => {
  const part = ina()
  return stageInput({
    id: 'ina', topology: 'instrumentation', ina: part, opamp: inaAsOpamp(part), rf: null, rg: res(494, 0.001, 10e-6), rs: res(175, 0.001, 5e-6), rcomp: null,
    input: [-0.01, 0.01], inputCm: [2.5, 2.5], temperature: [0, 50], band: [0.1, 10], ...over
  })
}

describe('a chain from an instrumentation stage into an op-amp stage', () => {
  const a = inaStage()
  const ra = realStage(a)
  // An inverting stage of gain −2 with a pole at 1/(2π·20k·10n) ≈ 796 Hz.
  const b = after(ra.result, stageInput({id: 'b', topology: 'inverting', rf: res(20e3, 0.001, 25e-6), rg: res(10e3, 0.001, 25e-6), rs: null, cf: 10e-9, temperature: [0, 50]}))
  const rb = realStage(b)
  const adc = {...idealAdc(24, [-2.5, 2.5]), offset: 50e-6, gainError: 1e-4, inl: 3}

  it('gives the instrumentation stage’s transfer G/(1 + jf/(gbw/G)) and its own output density', () => {
    const view = stageSpectrum(a)
    const g = ra.result.gain
    const fb = a.ina!.gbw / g
    const out = new Float64Array(4)
    for (const f of [0.3, 7, 150, 14e3, 90e3]) {
      view.at(f, out, 0)
      const d = 1 + (f / fb) ** 2
      expect(out[2]! / (g / d)).toBeCloseTo(1, 12)
      expect(out[3]! / ((-g * f) / fb / d)).toBeCloseTo(1, 12)
      expect(out[0]! / inaPsd(a, f)).toBeCloseTo(1, 10)
    }
    expect(view.dcGain).toBeCloseTo(1 + 49.4e3 / 494, 12)
  })

  it('carries the instrumentation stage’s DC contributors through the later gain: Σ ek·Π|Gj|', () => {
    const r = evaluateChain(chainInput(['ina', 'b'], adc, [0.1, 10], {temperature: [0, 50]}), [ra.view, rb.view])
    const {worst, rss} = dcCascade([ra.result, rb.result])
    const vmax = Math.max(...rb.result.swing.outputSpan.map(Math.abs))
    const converter = [50e-6, 0, 1e-4 * vmax, 0, 3 * (5 / 2 ** 24)]
    expect(r.dc.worstCaseOutput / (worst + converter.reduce((x, y) => x + y, 0))).toBeCloseTo(1, 12)
    expect(r.dc.rssOutput / Math.hypot(rss, ...converter)).toBeCloseTo(1, 12)
    expect(r.dc.worstCaseInput / (r.dc.worstCaseOutput / Math.abs(ra.result.gain * rb.result.gain))).toBeCloseTo(1, 12)
    // Every term of the block model keeps its key, with the stage id as its source.
    const fromIna = r.dc.contributors.filter((c) => c.source === 'ina')
    expect(fromIna.map((c) => c.key)).toEqual(['vos', 'vos-drift', 'ib', 'ios', 'cmrr', 'psrr', 'gain-error', 'resistor-tolerance', 'resistor-tempco', 'nonlinearity'])
    const gainError = ra.result.dc.contributors.find((c) => c.key === 'gain-error')!.output
    expect(gainError).toBeGreaterThan(0)
    expect(fromIna.find((c) => c.key === 'gain-error')!.output / (gainError * 2)).toBeCloseTo(1, 12)
  })

  it('equals the numerical integral of Σ Sk·Π|Hj|² over a band that reaches both poles (tolerance 0.05 %)', () => {
    const [fL, fH] = [0.1, 30e3]
    const r = evaluateChain(chainInput(['ina', 'b'], null, [fL, fH]), [ra.view, rb.view])
    const ref = cascadeIntegral([(f) => inaPsd(a, f), (f) => opampPsd(b, f)], [(f) => inaH2(a, f), (f) => opampH2(b, f)], fL, fH)
    expect(Math.abs(r.noise.outputRms / Math.sqrt(ref.total) - 1)).toBeLessThan(5e-4)
    expect(Math.abs(r.stageNoise[0]!.outputRms / Math.sqrt(ref.parts[0]!) - 1)).toBeLessThan(5e-4)
    expect(Math.abs(r.stageNoise[1]!.outputRms / Math.sqrt(ref.parts[1]!) - 1)).toBeLessThan(5e-4)
    // The instrumentation stage dominates after its gain of 100.
    expect(ref.parts[0]!).toBeGreaterThan(10 * ref.parts[1]!)
  })

  it('over the stage’s own band, the instrumentation part is its own noise budget times |G2| (flat second stage there, 0.1 %)', () => {
    const r = evaluateChain(chainInput(['ina', 'b'], null, [0.1, 10]), [ra.view, rb.view])
    expect(Math.abs(r.stageNoise[0]!.outputRms / (ra.result.noise.outputRms * Math.abs(rb.result.gain)) - 1)).toBeLessThan(1e-3)
  })
})

describe('the instrumentation stage’s pole in the chain’s response', () => {
  // By hand: H = G/(1 + jf/fb), fb = gbw/G, is one pole; a fast unity follower after it
  // (1 GHz op-amp) leaves it alone, so the chain's −3 dB bandwidth is fb and its alias
  // rejection 10·lg(1 + ((fs − fH)/fb)²).
  const a = inaStage()
  const ra = realStage(a)
  const f = stageInput({id: 'f', topology: 'follower', opamp: testOpamp({gbw: 1e9, aol: 1e7, cinDiff: 0, cinCm: 0}), rf: null, rg: null, rs: null, cstray: 0, input: [-1.1, 1.1]})
  const rf = realStage(f)
  const fb = a.ina!.gbw / ra.result.gain

  it('gives the chain bandwidth gbw/G (0.1 %)', () => {
    const r = evaluateChain(chainInput(['ina', 'f'], null, [0.1, 10]), [ra.view, rf.view])
    expect(Math.abs(r.bandwidth! / fb - 1)).toBeLessThan(1e-3)
  })

  it('gives the alias rejection of one pole at gbw/G (0.01 dB)', () => {
    const fs = 1e6, fH = 10
    const r = evaluateChain(chainInput(['ina', 'f'], idealAdc(24, [-2.5, 2.5], fs), [0.1, fH]), [ra.view, rf.view])
    expect(Math.abs(r.aliasRejection! - 10 * Math.log10(1 + ((fs - fH) / fb) ** 2))).toBeLessThan(0.01)
  })
})

/** Sallen–Key, gain K = 1 + rf/rg = 2, f0 ≈ 1.57 kHz, Q ≈ 2 (fixture values of test/engine/helpers.ts). */
const sallenKey = (over: Partial<StageInput> = {}): StageInput => stageInput({
  id: 'sk', topology: 'lowpass-sallen-key', opamp: testOpamp({gbw: 1e9, aol: 1e7, cinDiff: 0, cinCm: 0}), cstray: 0, r1: res(10e3, 0.001, 25e-6), r2: res(22e3, 0.001, 25e-6),
  c1: {value: 10e-9, tolerance: 0.05}, c2: {value: 4.7e-9, tolerance: 0.05}, rf: res(10e3, 0.001, 25e-6), rg: res(10e3, 0.001, 25e-6), rs: null, input: [-1, 1], ...over
})
/** Multiple feedback, H0 = −r2/r1 = −2, f0 ≈ 1.2 kHz. */
const mfb = (over: Partial<StageInput> = {}): StageInput => stageInput({
  id: 'mfb', topology: 'lowpass-mfb', opamp: testOpamp({gbw: 1e9, aol: 1e7, cinDiff: 0, cinCm: 0}), cstray: 0, rf: null, rg: null, rs: null, r1: res(10e3, 0.001, 25e-6), r2: res(20e3, 0.001, 25e-6),
  r3: res(8.2e3, 0.001, 25e-6), c1: {value: 1e-9, tolerance: 0.02}, c2: {value: 22e-9, tolerance: 0.02}, rcomp: res(6.8e3), ccomp: 100e-9, input: [-1, 1], ...over
})

/**
 * Sallen–Key low-pass with gain K (R. P. Sallen and E. L. Key, "A practical method of designing
 * RC active filters", IRE Trans. Circuit Theory 2(1), 1955; the usual textbook form, from memory):
 * H(s) = K / (s²·R1R2C1C2 + s·(R1C2 + R2C2 + R1C1(1 − K)) + 1), C1 the capacitor to the output.
 */
function sallenKeyH(i: StageInput, f: number): {re: number; im: number} {
  const [r1, r2, c1, c2] = [i.r1!.value, i.r2!.value, i.c1!.value, i.c2!.value]
  const k = 1 + i.rf!.value / i.rg!.value
  const w = 2 * Math.PI * f
  const dRe = 1 - w * w * r1 * r2 * c1 * c2
  const dIm = w * (r1 * c2 + r2 * c2 + r1 * c1 * (1 - k))
  const d2 = dRe * dRe + dIm * dIm
  return {re: (k * dRe) / d2, im: (-k * dIm) / d2}
}

/**
 * Multiple-feedback low-pass (the usual textbook form, from memory; nodal analysis of the
 * circuit of DESIGN §8.4 gives the same): H(s) = −(1/(R1R3C1C2)) / (s² + s·(1/R1 + 1/R2 + 1/R3)/C2 + 1/(R2R3C1C2)),
 * C1 from the − pin to the output, C2 from the middle node to ground.
 */
function mfbH(i: StageInput, f: number): {re: number; im: number} {
  const [r1, r2, r3, c1, c2] = [i.r1!.value, i.r2!.value, i.r3!.value, i.c1!.value, i.c2!.value]
  const w = 2 * Math.PI * f
  const dRe = 1 / (r2 * r3 * c1 * c2) - w * w
  const dIm = (w * (1 / r1 + 1 / r2 + 1 / r3)) / c2
  const d2 = dRe * dRe + dIm * dIm
  const n = -1 / (r1 * r3 * c1 * c2)
  return {re: (n * dRe) / d2, im: (-n * dIm) / d2}
}

describe('chains through difference and low-pass stages', () => {
  const diff = stageInput({
    id: 'diff', topology: 'difference', rf: res(100e3, 0.001, 10e-6), rg: res(10e3, 0.001, 10e-6), rs: null, rp: res(10e3, 0.001, 10e-6), rref: res(100e3, 0.001, 10e-6),
    input: [-0.05, 0.05], inputCm: [2, 3]
  })
  const rd = realStage(diff)
  const sk = after(rd.result, sallenKey())
  const rsk = realStage(sk)
  const mf = after(rsk.result, mfb())
  const rmf = realStage(mf)

  it('gives a Sallen–Key stage’s |H| and phase as the analytic second-order response (0.1 %, 0.1°)', () => {
    const view = stageSpectrum(sk)
    const out = new Float64Array(4)
    for (const f of [1, 100, 800, 1565, 2500, 10e3, 50e3]) {
      view.at(f, out, 0)
      const h = sallenKeyH(sk, f)
      expect(Math.abs(Math.hypot(out[2]!, out[3]!) / Math.hypot(h.re, h.im) - 1)).toBeLessThan(1e-3)
      expect(Math.abs(Math.atan2(out[3]!, out[2]!) - Math.atan2(h.im, h.re)) * 180 / Math.PI).toBeLessThan(0.1)
    }
    // The peak of a Q ≈ 2 response: |H(f0)| = K·Q.
    const [r1, r2, c1, c2] = [10e3, 22e3, 10e-9, 4.7e-9]
    const q = Math.sqrt(r1 * r2 * c1 * c2) / (r1 * c2 + r2 * c2 - r1 * c1)
    view.at(1 / (2 * Math.PI * Math.sqrt(r1 * r2 * c1 * c2)), out, 0)
    expect(Math.abs(Math.hypot(out[2]!, out[3]!) / (2 * q) - 1)).toBeLessThan(1e-3)
  })

  it('gives an MFB stage’s |H| as the analytic second-order response (0.1 %)', () => {
    const view = stageSpectrum(mf)
    const out = new Float64Array(4)
    for (const f of [1, 300, 1200, 5000, 40e3]) {
      view.at(f, out, 0)
      const h = mfbH(mf, f)
      expect(Math.abs(Math.hypot(out[2]!, out[3]!) / Math.hypot(h.re, h.im) - 1)).toBeLessThan(1e-3)
    }
    expect(view.dcGain).toBeCloseTo(-2, 4)
  })

  it('carries DC through difference → Sallen–Key → MFB as Σ ek·Π|Gj| from the stages’ own results', () => {
    const stages: ChainStage[] = [rd.view, rsk.view, rmf.view]
    const adc = {...idealAdc(18, [-4.096, 4.096]), offset: 100e-6, offsetDrift: 1e-6, gainDrift: 2e-6}
    const r = evaluateChain(chainInput(['diff', 'sk', 'mfb'], adc, [0.1, 100], {temperature: [-20, 70]}), stages)
    const {worst, rss} = dcCascade([rd.result, rsk.result, rmf.result])
    const vmax = Math.max(...rmf.result.swing.outputSpan.map(Math.abs))
    const converter = [100e-6, 1e-6 * 45, 0, 2e-6 * 45 * vmax, 0]
    expect(r.dc.worstCaseOutput / (worst + converter.reduce((x, y) => x + y, 0))).toBeCloseTo(1, 12)
    expect(r.dc.rssOutput / Math.hypot(rss, ...converter)).toBeCloseTo(1, 12)
    expect(r.gain / (rd.result.gain * rsk.result.gain * rmf.result.gain)).toBeCloseTo(1, 12)
    expect(Math.abs(r.gain)).toBeCloseTo(40, 3)
    // The difference stage's resistor-tolerance term includes the common mode that mismatch lets through.
    expect(r.dc.contributors.find((c) => c.source === 'diff' && c.key === 'resistor-tolerance')!.output).toBeGreaterThan(0)
  })

  it('equals the numerical integral of Σ Sk·Π|Hj|² through both filters (tolerance 0.05 %)', () => {
    const [fL, fH] = [0.5, 20e3]
    const r = evaluateChain(chainInput(['diff', 'sk', 'mfb'], null, [fL, fH]), [rd.view, rsk.view, rmf.view])
    const ref = cascadeIntegral([(f) => opampPsd(diff, f), (f) => opampPsd(sk, f), (f) => opampPsd(mf, f)],
      [(f) => opampH2(diff, f), (f) => opampH2(sk, f), (f) => opampH2(mf, f)], fL, fH)
    expect(Math.abs(r.noise.outputRms / Math.sqrt(ref.total) - 1)).toBeLessThan(5e-4)
    ref.parts.forEach((p, k) => expect(Math.abs(r.stageNoise[k]!.outputRms / Math.sqrt(p) - 1)).toBeLessThan(5e-4))
    // Cross-check the filters' transfers in the integrand against their analytic forms at one point.
    const skH = sallenKeyH(sk, 1565), mfH = mfbH(mf, 1565)
    expect(opampH2(sk, 1565) / (skH.re ** 2 + skH.im ** 2)).toBeCloseTo(1, 2)
    expect(opampH2(mf, 1565) / (mfH.re ** 2 + mfH.im ** 2)).toBeCloseTo(1, 2)
  })
})
