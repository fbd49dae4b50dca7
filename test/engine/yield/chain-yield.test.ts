/**
 * The Monte Carlo of a chain (DESIGN §8.6, §8.7) against outside references:
 * - the chain's worst-case DC cascade Σ ek·Πj>k|Gj| + converter terms (§8.6) as a bound of
 *   every trial (property, fast-check);
 * - one dominant truncated-normal term: the yield at a limit against the erf form
 *   erf(y/(σ√2))/erf(3/√2) (mathjs erf), widened by the small terms' largest shift;
 * - the chain trial's signed error rebuilt here as Σ stage errors × the later stages' signed
 *   gains (each stage's gain from its own nodal solve) + the converter's terms written out,
 *   from per-stage draws made here from the generator at the stage's variable offset.
 */
import fc from 'fast-check'
import {erf} from 'mathjs'
import {describe, expect, it} from 'vitest'
import {evaluateChain, evaluateStage, INA_ARCHETYPES, stageSpectrum, type AdcParams, type ChainInput, type ChainStage, type StageInput} from '../../../src/engine/index.js'
import type {Calibration, YieldOptions} from '../../../src/engine/types.js'
import {chainTrialBlock, chainTrialErrors, chainYieldModel, drawChainTrial, runChainYield, STAGE_STRIDE} from '../../../src/engine/yield/chain.js'
import {DrawKind, SLOT_COUNT, yieldModel} from '../../../src/engine/yield/model.js'
import {scratchOf, trialErrors} from '../../../src/engine/yield/run.js'
import {seedKey, trialKey, uniformAt} from '../../../src/engine/yield/counter-rng.js'
import {truncatedNormal} from '../../../src/engine/yield/normal.js'
import {lsbOf} from '../../../src/engine/chain/types.js'
import {solveStageDc} from '../../../src/engine/dc/solve.js'
import {nominalResistors} from '../../../src/engine/topology/index.js'
import {res, stageFrom, testOpamp} from '../../support/stage-input.js'
import {CLOSED_FORM_STAGES} from './closed-form.test.js'

const silentOpamp = (over: Parameters<typeof testOpamp>[0] = {}) =>
  testOpamp({vos: 0, vosDrift: 0, ib: 0, ios: 0, cmrr: Infinity, psrr: Infinity, aol: Infinity, ...over})

/** An invented converter with every DC term. */
const testAdc = (over: Partial<AdcParams> = {}): AdcParams => ({
  name: 'test-adc', archetype: false, bits: 16, input: [-10, 10], noise: 0, offset: 2e-3, offsetDrift: 5e-6, gainError: 0.002,
  gainDrift: 4e-6, inl: 3, sampleRate: null, ...over
})

/**
 * The chain as the evaluate phase builds it: each later stage on the previous output span,
 * every stage under the chain's calibration, the cascade from the stages' own results.
 */
function buildChain(inputs: StageInput[], adc: AdcParams | null, over: Partial<ChainInput> = {}) {
  const calibration = over.calibration ?? 'none'
  const stages: {input: StageInput; gain: number}[] = []
  const views: ChainStage[] = []
  let span: readonly [number, number] | null = null
  inputs.forEach((base, k) => {
    const input: StageInput = {...base, id: `s${k}`, calibration, ...(span === null ? {} : {input: [span[0], span[1]] as [number, number]})}
    const r = evaluateStage(input)
    span = r.swing.outputSpan
    stages.push({input, gain: r.gain})
    views.push({
      id: input.id, gain: r.gain, contributors: r.dc.contributors, calibrated: r.dc.calibrated?.contributors ?? null,
      outputSpan: r.swing.outputSpan, inputSpan: input.input, bandwidth: r.stability.bandwidth, spectrum: stageSpectrum(input)
    })
  })
  const chain: ChainInput = {
    id: 'c', title: 'c', stages: stages.map((s) => s.input.id), adc, temperature: inputs[0]!.temperature, band: [0.1, 10], calibration,
    require: {}, ...over
  }
  const cascade = evaluateChain(chain, views)
  return {chain, stages, dc: cascade.dc, cascade}
}

const opts = (over: Partial<YieldOptions> = {}): YieldOptions => ({trials: 20_000, seed: 1, distribution: 'uniform', ...over})

describe('chain yield: the worst-case cascade bounds every trial (property)', () => {
  const firsts = Object.keys(CLOSED_FORM_STAGES)
  // Later stages take a voltage and are not difference stages (DESIGN §8.6).
  const laters = ['noninverting', 'noninverting-loaded', 'inverting', 'follower', 'lowpass-sallen-key', 'lowpass-mfb']
  const CALS: Calibration[] = ['none', 'offset', 'offset-and-gain']
  const slack = 1 + 1e-9

  const check = (inputs: StageInput[], adc: AdcParams | null, calibration: Calibration, temperature: [number, number], distribution: 'uniform' | 'normal'): void => {
    const {chain, stages, dc} = buildChain(inputs, adc, {calibration, temperature})
    const calWorst = dc.calibrated?.worstCaseOutput ?? dc.worstCaseOutput
    const y = runChainYield({...chain, require: {'output-error': dc.worstCaseOutput * slack, 'output-error-calibrated': calWorst * slack}}, stages, dc,
      opts({trials: 1500, seed: 9, distribution}))
    expect(y.unavailable).toBeNull()
    expect(y.results.map((r) => r.key)).toEqual(['output-error', 'output-error-calibrated'])
    for (const r of y.results) expect(r.yield).toBe(1)
    expect(y.maxError).toBeLessThanOrEqual(y.worstCase * slack)
    expect(y.errorPercentiles!.p999).toBeLessThanOrEqual(y.worstCase * slack)
    expect(y.maxError).toBeGreaterThan(0)
  }

  it('two or three stages of every closed-form topology, tolerances, tempcos, op-amps, converter maxima, temperatures, calibrations', () => {
    const move = (tol: number, tc: number) => (r: StageInput['rf']) => (r === null ? null : res(r.value, tol, tc))
    const moved = (base: StageInput, tol: number, tc: number, silent: boolean, t: [number, number]): StageInput => {
      const m = move(tol, tc)
      return {
        ...base, rf: m(base.rf), rg: m(base.rg), rs: m(base.rs), rcomp: m(base.rcomp), rp: m(base.rp), rref: m(base.rref),
        r1: m(base.r1), r2: m(base.r2), r3: m(base.r3), riso: m(base.riso), temperature: t, ...(silent ? {opamp: silentOpamp()} : {})
      }
    }
    fc.assert(
      fc.property(
        fc.constantFrom(...firsts),
        fc.array(fc.constantFrom(...laters), {minLength: 1, maxLength: 2}),
        fc.constantFrom(...CALS),
        fc.constantFrom<'uniform' | 'normal'>('uniform', 'normal'),
        fc.double({min: 0, max: 0.03, noNaN: true}),
        fc.double({min: 0, max: 200e-6, noNaN: true}),
        fc.boolean(),
        // Stage ranges may differ from the chain's: the clamp keeps each stage inside its own.
        fc.array(fc.tuple(fc.integer({min: -40, max: 25}), fc.integer({min: 25, max: 105})), {minLength: 4, maxLength: 4}),
        fc.option(fc.record({
          offset: fc.double({min: 0, max: 5e-3, noNaN: true}), offsetDrift: fc.double({min: 0, max: 20e-6, noNaN: true}),
          gainError: fc.double({min: 0, max: 0.01, noNaN: true}), gainDrift: fc.double({min: 0, max: 20e-6, noNaN: true}),
          inl: fc.double({min: 0, max: 20, noNaN: true})
        }), {nil: null}),
        (first, rest, calibration, distribution, tol, tc, silent, temps, adcTerms) => {
          const inputs = [first, ...rest].map((name, k) => moved(CLOSED_FORM_STAGES[name]!(), tol, tc, silent && k === 0, temps[k]! as [number, number]))
          check(inputs, adcTerms === null ? null : testAdc({...adcTerms, input: [-50, 50]}), calibration, temps[3]! as [number, number], distribution)
        }
      ),
      {numRuns: 40, seed: 20261202}
    )
  })

  it('the earlier stage failure case in a chain: offset-and-gain, 1.5 % resistors, 100 ppm/K, −40 … 85 °C', () => {
    const m = (r: StageInput['rf']) => (r === null ? null : res(r.value, 0.015, 100e-6))
    const a = CLOSED_FORM_STAGES['difference']!()
    const b = CLOSED_FORM_STAGES['lowpass-mfb']!()
    const fix = (s: StageInput): StageInput => ({...s, rf: m(s.rf), rg: m(s.rg), rs: m(s.rs), rcomp: m(s.rcomp), rp: m(s.rp), rref: m(s.rref), r1: m(s.r1), r2: m(s.r2), r3: m(s.r3), temperature: [-40, 85]})
    check([fix(a), fix(b)], testAdc({input: [-20, 20]}), 'offset-and-gain', [-40, 85], 'uniform')
  })
})

describe('chain yield: one dominant normal term against the erf form (truncated normal, mathjs erf)', () => {
  it('follower with vos 300 µV (σ = 100 µV) into a ×10 stage: yield at 2σ·10 = erf(2/√2)/erf(3/√2) within 4 binomial σ and the small terms\' shift', () => {
    const first = stageFrom('engine', {topology: 'follower', rg: null, rf: null, rs: null, opamp: silentOpamp({vos: 300e-6}), temperature: [25, 25], supplyTolerance: 0,
      input: [-0.1, 0.1]})
    // The second stage's own small term: vos 2 µV at noise gain 10.
    const second = stageFrom('engine', {rf: res(9e3), rg: res(1e3), rs: null, opamp: silentOpamp({vos: 2e-6}), temperature: [25, 25], supplyTolerance: 0})
    const {chain, stages, dc, cascade} = buildChain([first, second], null)
    const g2 = stages[1]!.gain
    expect(g2).toBeCloseTo(10, 9)
    expect(cascade.gain).toBeCloseTo(10, 9)
    const sigma = 100e-6 * g2
    const limit = 2 * sigma
    const delta = 2e-6 * 10 // the largest shift the small term can make
    const n = 200_000
    const y = runChainYield({...chain, require: {'output-error': limit}}, stages, dc, opts({trials: n, seed: 3}))
    const F = (v: number): number => erf(v / (sigma * Math.SQRT2)) / erf(3 / Math.SQRT2)
    const p = F(limit)
    const s = Math.sqrt((p * (1 - p)) / n)
    const got = y.results[0]!.yield
    expect(got).toBeGreaterThanOrEqual(F(limit - delta) - 4 * s)
    expect(got).toBeLessThanOrEqual(F(limit + delta) + 4 * s)
    // The variance is the first stage's vos, named with its stage id.
    expect(y.variance[0]!.variable).toBe('s0/vos')
    expect(y.variance[0]!.share).toBeGreaterThan(0.99)
  })

  it('a dominant converter offset (σ = 1 mV) behind two quiet stages: yield at 1.5σ against the erf form', () => {
    const quiet = (): StageInput => stageFrom('engine', {rf: res(9e3), rg: res(1e3), rs: null, opamp: silentOpamp(), temperature: [25, 25], supplyTolerance: 0, input: [-0.01, 0.01]})
    const adc = testAdc({offset: 3e-3, offsetDrift: 0, gainError: 0, gainDrift: 0, inl: 0})
    const {chain, stages, dc} = buildChain([quiet(), quiet()], adc, {temperature: [25, 25]})
    const n = 200_000
    const limit = 1.5e-3
    const y = runChainYield({...chain, require: {'output-error': limit, 'error-lsb': limit / lsbOf(adc)}}, stages, dc, opts({trials: n, seed: 4}))
    const p = erf(1.5 / Math.SQRT2) / erf(3 / Math.SQRT2)
    const s = Math.sqrt((p * (1 - p)) / n)
    expect(Math.abs(y.results[0]!.yield - p)).toBeLessThan(4 * s)
    // error-lsb is the same limit in LSB: the same trials pass.
    expect(y.results[1]!.key).toBe('error-lsb')
    expect(Math.abs(y.results[1]!.passed - y.results[0]!.passed)).toBeLessThanOrEqual(0)
    expect(y.variance).toEqual([{variable: 'test-adc/offset', share: 1}])
  })
})

describe('chain yield: reproducible', () => {
  const make = () => buildChain([CLOSED_FORM_STAGES['noninverting']!(), CLOSED_FORM_STAGES['inverting']!()], testAdc(), {require: {'output-error': 0.01}})
  it('same seed → identical JSON bytes, different seed → different', () => {
    const a = make()
    const b = make()
    const ya = JSON.stringify(runChainYield(a.chain, a.stages, a.dc, opts({trials: 5000, seed: 11})))
    const yb = JSON.stringify(runChainYield(b.chain, b.stages, b.dc, opts({trials: 5000, seed: 11})))
    const yc = JSON.stringify(runChainYield(a.chain, a.stages, a.dc, opts({trials: 5000, seed: 12})))
    expect(ya).toBe(yb)
    expect(yc).not.toBe(ya)
  })
  it('any split of the trials into blocks gives the same errors', () => {
    const {chain, stages} = make()
    const m = chainYieldModel(chain, stages, opts())
    if (typeof m === 'string') throw new Error(m)
    const n = 3000
    const whole = new Float64Array(n)
    const wholeCal = new Float64Array(n)
    chainTrialBlock(m, 7, 0, n, whole, wholeCal)
    const parts = new Float64Array(n)
    for (const [from, to] of [[0, 1000], [1000, 1001], [1001, 3000]] as const) {
      const e = new Float64Array(to - from)
      chainTrialBlock(m, 7, from, to, e, new Float64Array(to - from))
      parts.set(e, from)
    }
    expect(Array.from(parts)).toEqual(Array.from(whole))
  })
})

describe('chain yield: a trial is Σ stage errors × later signed gains + the converter terms', () => {
  it('inverting (it swaps the ends for the next stage) → noninverting into a converter, offset calibration, five trials', () => {
    const a = {...CLOSED_FORM_STAGES['inverting']!(), temperature: [-20, 70] as [number, number]}
    const b = stageFrom('engine', {temperature: [-20, 70], rcomp: res(950, 0.01, 50e-6)})
    const adc = testAdc({input: [-20, 20]})
    const {chain, stages} = buildChain([a, b], adc, {calibration: 'offset', temperature: [-20, 70]})
    const seed = 21
    const cm = chainYieldModel(chain, stages, opts({seed}))
    if (typeof cm === 'string') throw new Error(cm)
    const temps = [-20, 25, 70]
    expect(cm.temperatures).toEqual(temps)
    expect(stages[0]!.gain).toBeLessThan(0)
    const g1 = stages[1]!.gain
    const lsb = lsbOf(adc)
    // Each stage's own model and evaluator, fed draws made here.
    const own = stages.map((s) => yieldModel(s.input, 'uniform')!)
    const scale = (kind: number, scaleV: number, u: number): number =>
      kind === DrawKind.Symmetric ? scaleV * (2 * u - 1) : kind === DrawKind.Normal ? truncatedNormal(u, scaleV) : scaleV * u
    const out = new Float64Array(cm.points.length * temps.length)
    const outCal = new Float64Array(out.length)
    for (let i = 0; i < 5; i++) {
      const stageErr = own.map((m, k) => {
        const vals = new Float64Array(SLOT_COUNT)
        for (const v of m.variables) vals[v.slot] = scale(v.kind, v.scale, uniformAt(seed, i, k * STAGE_STRIDE + v.slot))
        const e = new Float64Array(m.points.length * temps.length)
        const ec = new Float64Array(e.length)
        trialErrors(m, vals, scratchOf(m), e, ec, temps)
        return {e, ec, P: m.points.length}
      })
      const conv = [adc.offset, adc.offsetDrift, adc.gainError, adc.gainDrift, adc.inl * lsb]
        .map((sc, j) => truncatedNormal(uniformAt(seed, i, 2 * STAGE_STRIDE + j), sc))
      drawChainTrial(cm, trialKey(seedKey(seed), i))
      const [max, maxCal] = chainTrialErrors(cm, out, outCal)
      let wantMax = 0
      let wantMaxCal = 0
      temps.forEach((t, ti) => {
        for (let p = 0; p < 2; p++) {
          // Chain input end p is stage 0's end p; stage 0 inverts, so stage 1 receives it at its other end.
          const e0 = stageErr[0]!.e[ti * 2 + p]!
          const e1 = stageErr[1]!.e[ti * 2 + (1 - p)]!
          const c0 = stageErr[0]!.ec[ti * 2 + p]!
          const c1 = stageErr[1]!.ec[ti * 2 + (1 - p)]!
          // The nominal converter input through both stages' own nodal DC solves.
          const v1 = solveStageDc(stages[0]!.input, nominalResistors(stages[0]!.input), {input: a.input[p]!}).vout
          const vadc = solveStageDc(stages[1]!.input, nominalResistors(stages[1]!.input), {input: v1}).vout
          const dt = t - 25
          const full = e0 * g1 + e1 + conv[0]! + conv[1]! * dt + (conv[2]! + conv[3]! * dt) * vadc + conv[4]!
          const cal = c0 * g1 + c1 + conv[1]! * dt + (conv[2]! + conv[3]! * dt) * vadc + conv[4]!
          expect(Math.abs(out[ti * 2 + p]! - full)).toBeLessThanOrEqual(1e-9 * Math.abs(full) + 1e-15)
          expect(Math.abs(outCal[ti * 2 + p]! - cal)).toBeLessThanOrEqual(1e-9 * Math.abs(cal) + 1e-15)
          wantMax = Math.max(wantMax, Math.abs(full))
          wantMaxCal = Math.max(wantMaxCal, Math.abs(cal))
        }
      })
      expect(max).toBeCloseTo(wantMax, 15)
      expect(maxCal).toBeCloseTo(wantMaxCal, 15)
    }
  })
})

/** An instrumentation block with no error term of its own. */
const QUIET_INA = {...INA_ARCHETYPES['precision-ina'], vosIn: 0, vosOut: 0, vosInDrift: 0, vosOutDrift: 0, ib: 0, ios: 0, ibMax: 0, iosMax: 0,
  cmrr: Infinity, psrr: Infinity, gainError: 0, gainDrift: 0, nonlinearity: 0}

describe('chain yield: an instrumentation first stage (its block model, DESIGN §8.2)', () => {
  const inaStage = (over: Partial<StageInput> = {}): StageInput => stageFrom('engine', {
    topology: 'instrumentation', ina: {...INA_ARCHETYPES['precision-ina']}, rg: res(494, 0.001, 10e-6), rs: res(175, 0.001, 25e-6), rcomp: null, rf: null,
    input: [-0.01, 0.01], inputCm: [2, 3], supply: [-15, 15], temperature: [-20, 70], ...over
  })
  const slack = 1 + 1e-9

  it('the chain worst case bounds every trial, for every calibration and both distributions (property)', () => {
    fc.assert(fc.property(
      fc.constantFrom<Calibration>('none', 'offset', 'offset-and-gain'),
      fc.constantFrom<'uniform' | 'normal'>('uniform', 'normal'),
      fc.double({min: 0, max: 0.02, noNaN: true}), fc.double({min: 0, max: 200e-6, noNaN: true}),
      fc.constantFrom('noninverting', 'inverting', 'lowpass-sallen-key'),
      // Half the cases with a silent block, op-amp and no converter: the resistor terms alone, where a trial comes closest to the bound.
      fc.boolean(),
      (calibration, distribution, tol, tc, next, silent) => {
        const first = inaStage({rg: res(494, tol, tc), rs: res(175, tol, tc), ...(silent ? {ina: {...QUIET_INA}} : {})})
        const later = {...CLOSED_FORM_STAGES[next]!(), temperature: [-20, 70] as [number, number], ...(silent ? {opamp: silentOpamp()} : {})}
        const {chain, stages, dc} = buildChain([first, later], silent ? null : testAdc({input: [-20, 20]}), {calibration, temperature: [-20, 70]})
        const calWorst = dc.calibrated?.worstCaseOutput ?? dc.worstCaseOutput
        const y = runChainYield({...chain, require: {'output-error': dc.worstCaseOutput * slack, 'output-error-calibrated': calWorst * slack}}, stages, dc,
          opts({trials: 1500, seed: 2, distribution}))
        expect(y.unavailable).toBeNull()
        for (const r of y.results) expect(r.yield).toBe(1)
        expect(y.maxError).toBeLessThanOrEqual(y.worstCase * slack)
        expect(y.maxError).toBeGreaterThan(0)
      }), {numRuns: 30, seed: 7})
  })

  it('a dominant vos-in (σ = max/3) through G and a ×10 stage: yield at 2σ·G·10 against the erf form', () => {
    const quietIna = {...QUIET_INA, vosIn: 90e-6}
    const first = inaStage({ina: quietIna, rg: res(494), rs: null, temperature: [25, 25], supplyTolerance: 0})
    const second = stageFrom('engine', {rf: res(9e3), rg: res(1e3), rs: null, opamp: silentOpamp(), temperature: [25, 25], supplyTolerance: 0})
    const {chain, stages, dc} = buildChain([first, second], null, {temperature: [25, 25]})
    const g = stages[0]!.gain * stages[1]!.gain
    const sigma = 30e-6 * g
    const n = 200_000
    const y = runChainYield({...chain, require: {'output-error': 2 * sigma, 'input-error': 2 * 30e-6}}, stages, dc, opts({trials: n, seed: 5}))
    const p = erf(2 / Math.SQRT2) / erf(3 / Math.SQRT2)
    const s = Math.sqrt((p * (1 - p)) / n)
    expect(Math.abs(y.results[0]!.yield - p)).toBeLessThan(4 * s)
    // input-error × |ΠG| is the same limit: the same count.
    expect(y.results[1]!.passed).toBe(y.results[0]!.passed)
    expect(y.variance).toEqual([{variable: 's0/vos-in', share: 1}])
  })
})

describe('chain yield: a stage without a closed form', () => {
  it('an instrumentation stage without its block makes the chain yield unavailable, with no number', () => {
    const {chain, stages, dc} = buildChain([CLOSED_FORM_STAGES['noninverting']!()], testAdc())
    const ina = {...stages[0]!, input: {...stages[0]!.input, topology: 'instrumentation' as const, id: 'front', ina: null}}
    const y = runChainYield({...chain, require: {'output-error': 1}}, [ina], dc, opts())
    expect(y.unavailable).toMatch(/stage front \(instrumentation\)/)
    expect(y.results).toEqual([])
    expect(y.errorPercentiles).toBeNull()
  })
})

describe('an instrumentation stage on its own: its Monte Carlo on the block model (evaluateStage)', () => {
  const inaStage = (over: Partial<StageInput> = {}): StageInput => stageFrom('engine', {
    topology: 'instrumentation', ina: {...INA_ARCHETYPES['precision-ina']}, rg: res(494, 0.001, 10e-6), rs: res(175, 0.001, 25e-6), rcomp: null, rf: null,
    input: [-0.01, 0.01], inputCm: [2, 3], supply: [-15, 15], temperature: [-20, 70], ...over
  })
  const slack = 1 + 1e-9

  it('the stage’s own worst case bounds every trial, for every calibration (property)', () => {
    fc.assert(fc.property(
      fc.constantFrom<Calibration>('none', 'offset', 'offset-and-gain'),
      fc.double({min: 0, max: 0.02, noNaN: true}), fc.double({min: 0, max: 200e-6, noNaN: true}), fc.boolean(),
      (calibration, tol, tc, silent) => {
        const base = inaStage({rg: res(494, tol, tc), rs: res(175, tol, tc), calibration, ...(silent ? {ina: {...QUIET_INA}} : {})})
        const first = evaluateStage(base)
        const worst = first.dc.calibrated?.worstCaseOutput ?? first.dc.worstCaseOutput
        const input: StageInput = {...base, yield: opts({trials: 1500, seed: 3}),
          require: {'output-error': first.dc.worstCaseOutput * slack, ...(calibration === 'none' ? {} : {'output-error-calibrated': worst * slack})}}
        const y = evaluateStage(input).yield!
        expect(y.unavailable).toBeNull()
        expect(y.results.length).toBeGreaterThan(0)
        for (const r of y.results) expect(r.yield).toBe(1)
        expect(y.maxError).toBeLessThanOrEqual(y.worstCase * slack)
        expect(y.errorPercentiles!.p999).toBeLessThanOrEqual(y.worstCase * slack)
      }), {numRuns: 20, seed: 11})
  })

  it('a dominant vos-in (σ = max/3) through G: yield at 2σ·G against the erf form, variables named without a stage prefix', () => {
    const input = inaStage({ina: {...QUIET_INA, vosIn: 90e-6}, rg: res(494), rs: null, temperature: [25, 25], supplyTolerance: 0})
    const g = evaluateStage(input).gain
    const n = 200_000
    const y = evaluateStage({...input, yield: opts({trials: n, seed: 5}), require: {'output-error': 2 * 30e-6 * g}}).yield!
    const p = erf(2 / Math.SQRT2) / erf(3 / Math.SQRT2)
    expect(Math.abs(y.results[0]!.yield - p)).toBeLessThan(4 * Math.sqrt((p * (1 - p)) / n))
    expect(y.variance).toEqual([{variable: 'vos-in', share: 1}])
  })
})
