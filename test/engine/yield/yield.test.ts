/**
 * The Monte Carlo of DESIGN §8.7 against outside references: the normal distribution's erf
 * form (mathjs' erf), the triangular distribution of the difference of two uniforms, Wilson's
 * score interval (Wilson 1927), and the worst-case budget of §4.2/§4.6 as a bound of every
 * trial (property, fast-check).
 */
import fc from 'fast-check'
import {erf} from 'mathjs'
import {describe, expect, it} from 'vitest'
import {dcBudget} from '../../../src/engine/dc/budget.js'
import {signalGain} from '../../../src/engine/dc/solve.js'
import type {Calibration, StageInput, YieldOptions} from '../../../src/engine/types.js'
import {DRAW_BLOCK, drawBlock, drawTrial, runYield, scratchOf, trialBlock, trialErrors} from '../../../src/engine/yield/run.js'
import {SLOT_COUNT, yieldModel} from '../../../src/engine/yield/model.js'
import {inverseNormal, PHI_MINUS_3, TABLE_STEPS, truncatedNormal, truncatedProbability} from '../../../src/engine/yield/normal.js'
import {seedKey, trialKey, uniformAt} from '../../../src/engine/yield/counter-rng.js'
import {wilsonInterval} from '../../../src/engine/yield/stats.js'
import {res, stageFrom, testOpamp} from '../../support/stage-input.js'
import {CLOSED_FORM_STAGES} from './closed-form.test.js'

const Phi = (x: number): number => 0.5 * (1 + erf(x / Math.SQRT2))

/** An op-amp with no error terms at all, for stages dominated by one chosen term. */
const silentOpamp = (over: Parameters<typeof testOpamp>[0] = {}) =>
  testOpamp({vos: 0, vosDrift: 0, ib: 0, ios: 0, cmrr: Infinity, psrr: Infinity, aol: Infinity, ...over})

const run = (input: StageInput, options: Partial<YieldOptions> = {}) =>
  runYield(input, {trials: 20_000, seed: 1, distribution: 'uniform', ...options}, dcBudget(input), signalGain(input))

describe('inverse normal (Acklam) and the truncated normal', () => {
  it('Φ(−3) equals ½(1 + erf(−3/√2)) (mathjs erf)', () => {
    expect(Math.abs(PHI_MINUS_3 - Phi(-3))).toBeLessThan(1e-15)
  })
  it('Φ⁻¹ within Acklam\'s stated 1.15e-9 relative error, centre and both tails (mathjs erf)', () => {
    // Δx = |Φ(x̂) − p| / φ(x̂). p stays ≥ 1e-5 (1 + erf(x) loses digits further out); the
    // Monte Carlo uses Φ(−3) ≤ p ≤ Φ(3) only.
    for (const p of [1e-5, PHI_MINUS_3, 0.01, 0.02425, 0.1, 0.3, 0.5, 0.7, 0.9, 0.97575, 0.99, 1 - PHI_MINUS_3, 1 - 1e-5]) {
      const x = inverseNormal(p)
      const dx = Math.abs(Phi(x) - p) / (Math.exp((-x * x) / 2) / Math.sqrt(2 * Math.PI))
      expect(dx).toBeLessThanOrEqual(1.2e-9 * Math.max(Math.abs(x), 1e-6) + 1e-15)
    }
  })
  it('the tabulated draw (cubic Hermite between knots) is within 5e-6 σ of Φ⁻¹ itself, 1e-9 σ over the central 90 % of u', () => {
    // Every step of u at 7 points inside it, and 1 000 000 u in the two end steps, against Acklam's Φ⁻¹ directly.
    let worst = 0
    let worstCentral = 0
    const check = (u: number): void => {
      const d = Math.abs(truncatedNormal(u, 3) - Math.min(3, Math.max(-3, inverseNormal(truncatedProbability(u)))))
      worst = Math.max(worst, d)
      if (u >= 0.05 && u <= 0.95) worstCentral = Math.max(worstCentral, d)
    }
    for (let i = 0; i < TABLE_STEPS; i++) for (const f of [0.01, 0.2, 0.35, 0.5, 0.65, 0.8, 0.99]) check((i + f) / TABLE_STEPS)
    for (let k = 1; k <= 500_000; k++) {
      check(k / (500_000 * TABLE_STEPS))
      check(1 - k / (500_000 * TABLE_STEPS))
    }
    expect(worst).toBeLessThan(5e-6)
    expect(worstCentral).toBeLessThan(1e-9)
    // An interpolation, not Φ⁻¹ itself (else this test would check nothing).
    expect(worst).toBeGreaterThan(1e-7)
  })
  it('never beyond ± the limit, and reaches 0.999 of it at the ends of u', () => {
    expect(truncatedNormal(0.5 / 2 ** 32, 1)).toBeGreaterThanOrEqual(-1)
    expect(truncatedNormal(1 - 0.5 / 2 ** 32, 1)).toBeLessThanOrEqual(1)
    expect(truncatedNormal(1 - 0.5 / 2 ** 32, 1)).toBeGreaterThan(0.999)
    // u = 1 (never drawn) reads the last knot, not past the table.
    expect(truncatedNormal(1, 1)).toBeCloseTo(1, 6)
  })
})

describe('Wilson score interval (Wilson 1927)', () => {
  it('matches the roots of Wilson\'s quadratic (p̂ − p)² = z²p(1 − p)/n for a few (k, n)', () => {
    const z = 1.959964
    for (const [k, n] of [[0, 10], [5, 10], [10, 10], [81, 263], [9990, 10000], [99_700, 100_000]] as const) {
      const ph = k / n
      // (1 + z²/n)p² − (2p̂ + z²/n)p + p̂² = 0, solved by the quadratic formula
      const a = 1 + (z * z) / n
      const b = -(2 * ph + (z * z) / n)
      const c = ph * ph
      const d = Math.sqrt(b * b - 4 * a * c)
      const [lo, hi] = wilsonInterval(k, n)
      expect(lo).toBeCloseTo((-b - d) / (2 * a), 12)
      expect(hi).toBeCloseTo((-b + d) / (2 * a), 12)
    }
  })
  it('0 of 10 gives 0 … 0.2775 and 5 of 10 gives 0.2366 … 0.7634 (from memory)', () => {
    const a = wilsonInterval(0, 10)
    expect(a[0]).toBe(0)
    expect(a[1]).toBeCloseTo(0.2775, 4)
    const b = wilsonInterval(5, 10)
    expect(b[0]).toBeCloseTo(0.2366, 4)
    expect(b[1]).toBeCloseTo(0.7634, 4)
  })
})

describe('yield against analytic distributions', () => {
  it('one dominant normal term (vos of a follower): yield at 2σ = erf(2/√2)/erf(3/√2) (truncated normal, mathjs erf)', () => {
    const input = stageFrom('engine', {topology: 'follower', rg: null, rf: null, rs: null, opamp: silentOpamp({vos: 300e-6}), temperature: [25, 25], supplyTolerance: 0})
    const n = 200_000
    const limit = 200e-6 // 2σ, σ = 100 µV
    const y = run({...input, require: {'output-error': limit}}, {trials: n})
    const expected = erf(2 / Math.SQRT2) / erf(3 / Math.SQRT2)
    // Statistical tolerance: 4 binomial standard deviations √(p(1 − p)/n) ≈ 1.8e-3 at n = 200k.
    const tol = 4 * Math.sqrt((expected * (1 - expected)) / n)
    expect(Math.abs((y.results[0]?.yield ?? 0) - expected)).toBeLessThan(tol)
    expect(y.variance).toEqual([{variable: 'vos', share: 1}])
  })

  it('two uniform resistor tolerances: yield = 1 − (1 − y/2t)² of the triangular |a − b| (closed form)', () => {
    const t = 1e-4 // small, so that the ratio rf(1 + a)/(rg(1 + b)) is linear in a − b to 1e-4
    const input = stageFrom('engine', {
      opamp: silentOpamp(), rf: res(20e3, t), rg: res(1e3, t), rs: null, input: [0.1, 0.1], temperature: [25, 25], supplyTolerance: 0
    })
    const n = 200_000
    const scale = 0.1 * 20 // x·rf/rg: the output moves by scale·(a − b)
    for (const y of [0.5 * t, t, 1.5 * t]) {
      const r = run({...input, require: {'output-error': scale * y}}, {trials: n})
      const expected = 1 - (1 - y / (2 * t)) ** 2
      const tol = 4 * Math.sqrt((expected * (1 - expected)) / n) + 2e-4 // binomial 4σ + the linearisation
      expect(Math.abs((r.results[0]?.yield ?? 0) - expected)).toBeLessThan(tol)
    }
    const shares = run(input).variance
    expect(shares.map((s) => s.variable).sort()).toEqual(['rf:tolerance', 'rg:tolerance'])
    for (const s of shares) expect(Math.abs(s.share - 0.5)).toBeLessThan(0.03)
  })
})

describe('determinism', () => {
  const input = CLOSED_FORM_STAGES['inverting']!()
  it('same seed → identical results; different seed → different draws and results', () => {
    const a = run(input, {seed: 7})
    const b = run(input, {seed: 7})
    const c = run(input, {seed: 8})
    expect(JSON.stringify(a)).toBe(JSON.stringify(b))
    expect(JSON.stringify(a.errorPercentiles)).not.toBe(JSON.stringify(c.errorPercentiles))
    expect(uniformAt(7, 3, 0)).not.toBe(uniformAt(8, 3, 0))
    expect(uniformAt(7, 3, 0)).not.toBe(uniformAt(7, 4, 0))
  })
  it('trial i depends only on (seed, i): any split into blocks gives the same errors', () => {
    const m = yieldModel(input, 'uniform')!
    const whole = new Float64Array(1000)
    const wholeCal = new Float64Array(1000)
    trialBlock(m, 3, 0, 1000, whole, wholeCal)
    // 1, 2 and 4 equal parts, as 1, 2 and 4 workers would take them.
    for (const parts of [1, 2, 4]) {
      const joined = new Float64Array(1000)
      const joinedCal = new Float64Array(1000)
      for (let k = 0; k < parts; k++) {
        const from = (k * 1000) / parts
        const to = ((k + 1) * 1000) / parts
        const part = new Float64Array(to - from)
        const partCal = new Float64Array(to - from)
        trialBlock(m, 3, from, to, part, partCal)
        joined.set(part, from)
        joinedCal.set(partCal, from)
      }
      expect(Buffer.from(joined.buffer).equals(Buffer.from(whole.buffer))).toBe(true)
      expect(Buffer.from(joinedCal.buffer).equals(Buffer.from(wholeCal.buffer))).toBe(true)
    }
    for (const cut of [1, 333, 512, 999]) {
      const a = new Float64Array(cut)
      const b = new Float64Array(1000 - cut)
      trialBlock(m, 3, 0, cut, a, new Float64Array(cut))
      trialBlock(m, 3, cut, 1000, b, new Float64Array(1000 - cut))
      expect([...a, ...b]).toEqual([...whole])
    }
  })
  // The stage's loop draws a block of trials one variable at a time and evaluates them from
  // the columns; a chain draws and evaluates one trial at a time. Both must give equal bytes.
  for (const [name, make] of Object.entries(CLOSED_FORM_STAGES)) {
    for (const distribution of ['uniform', 'normal'] as const) {
      it(`${name} (${distribution}): the block draw and evaluation equal the one-trial draw and trialErrors, byte for byte, across block boundaries`, () => {
        const stage = {...make(), calibration: 'offset' as Calibration}
        const m = yieldModel(stage, distribution)!
        // A partial block's draws against the one-trial draw.
        const cols = new Float64Array(SLOT_COUNT * DRAW_BLOCK)
        drawBlock(m, seedKey(11), 40, DRAW_BLOCK - 3, cols, new Int32Array(DRAW_BLOCK), DRAW_BLOCK)
        const vals = new Float64Array(SLOT_COUNT)
        for (let j = 0; j < DRAW_BLOCK - 3; j++) {
          vals.fill(0)
          drawTrial(m, trialKey(seedKey(11), 40 + j), vals)
          for (let slot = 0; slot < SLOT_COUNT; slot++) expect(Object.is(cols[j + slot * DRAW_BLOCK], vals[slot])).toBe(true)
        }
        // Three blocks and a bit, from trial 40 (so no block starts at 0), with the point sums
        // over the first 300 of them, against one trial after another.
        const count = 3 * DRAW_BLOCK + 5
        const P = m.points.length * m.temperatures.length
        const rows = 300
        const sums = {rows: 40 + rows, calibrated: true, sum: new Float64Array(P), sum2: new Float64Array(P)}
        const err = new Float64Array(count)
        const errCal = new Float64Array(count)
        trialBlock(m, 11, 40, 40 + count, err, errCal, sums)
        const s = scratchOf(m)
        const out = new Float64Array(P)
        const outCal = new Float64Array(P)
        const sum = new Float64Array(P)
        const sum2 = new Float64Array(P)
        for (let j = 0; j < count; j++) {
          vals.fill(0)
          drawTrial(m, trialKey(seedKey(11), 40 + j), vals)
          trialErrors(m, vals, s, out, outCal)
          expect(Object.is(err[j], Math.max(...out.map(Math.abs)))).toBe(true)
          expect(Object.is(errCal[j], Math.max(...outCal.map(Math.abs)))).toBe(true)
          if (j < rows) for (let k = 0; k < P; k++) { sum[k] += outCal[k]; sum2[k] += outCal[k] * outCal[k] }
        }
        expect(Buffer.from(sums.sum.buffer).equals(Buffer.from(sum.buffer))).toBe(true)
        expect(Buffer.from(sums.sum2.buffer).equals(Buffer.from(sum2.buffer))).toBe(true)
        expect(sum.some((v) => v !== 0)).toBe(true)
      })
    }
  }
  it('uniforms are uniform: mean 0.5 and variance 1/12 within 4 standard errors over 100k', () => {
    const n = 100_000
    let s = 0
    let s2 = 0
    for (let i = 0; i < n; i++) {
      const u = uniformAt(1, i, 5)
      s += u
      s2 += u * u
    }
    const mean = s / n
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n))
    expect(Math.abs(s2 / n - mean * mean - 1 / 12)).toBeLessThan(4 * Math.sqrt(1 / 180 / n))
  })
})

describe('the random variables', () => {
  it('are the §8.7 set: op-amp maxima, idark for a transimpedance stage, supply, each resistor\'s tolerance and tempco', () => {
    const names = yieldModel(CLOSED_FORM_STAGES['transimpedance']!(), 'uniform')!.variables.map((v) => v.name)
    expect(names).toEqual(['vos', 'vos-drift', 'ib', 'ios', 'idark', 'cmrr', 'psrr', 'supply', 'rf:tolerance', 'rcomp:tolerance'])
  })
})

describe('the worst case bounds every trial (property)', () => {
  const CALS: Calibration[] = ['none', 'offset', 'offset-and-gain']
  const names = Object.keys(CLOSED_FORM_STAGES)
  // Relative slack for floating point only: the budget comes from the nodal solve, the trials from the closed form.
  const slack = 1 + 1e-9

  const check = (input: StageInput, distribution: 'uniform' | 'normal'): void => {
    const dc = dcBudget(input)
    const calWorst = dc.calibrated?.worstCaseOutput ?? dc.worstCaseOutput
    const y = runYield(
      {...input, require: {'output-error': dc.worstCaseOutput * slack, 'output-error-calibrated': calWorst * slack}},
      {trials: 2000, seed: 5, distribution},
      dc,
      signalGain(input)
    )
    for (const r of y.results) expect(r.yield).toBe(1)
    expect(y.maxError).toBeLessThanOrEqual(y.worstCase * slack)
    expect(y.errorPercentiles!.p999).toBeLessThanOrEqual(y.worstCase * slack)
  }

  it('the earlier failure: offset-and-gain calibration with 1.5 % resistors, tempco dominant', () => {
    for (const name of names) {
      const base = CLOSED_FORM_STAGES[name]!()
      const move = (r: StageInput['rf']) => (r === null ? null : res(r.value, 0.015, 100e-6))
      const input: StageInput = {
        ...base, rf: move(base.rf), rg: move(base.rg), rs: move(base.rs), rcomp: move(base.rcomp), rp: move(base.rp), rref: move(base.rref),
        r1: move(base.r1), r2: move(base.r2), r3: move(base.r3), temperature: [-40, 85], calibration: 'offset-and-gain'
      }
      check(input, 'uniform')
    }
  })

  it('over topologies, tolerances, tempcos, op-amp maxima, temperatures and calibration modes', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...names),
        fc.constantFrom(...CALS),
        fc.constantFrom<'uniform' | 'normal'>('uniform', 'normal'),
        fc.double({min: 0, max: 0.05, noNaN: true}),
        fc.double({min: 0, max: 300e-6, noNaN: true}),
        fc.record({
          vos: fc.double({min: 0, max: 5e-3, noNaN: true}),
          vosDrift: fc.double({min: 0, max: 20e-6, noNaN: true}),
          ib: fc.double({min: 0, max: 1e-6, noNaN: true}),
          ios: fc.double({min: 0, max: 1e-6, noNaN: true}),
          cmrrDb: fc.double({min: 40, max: 160, noNaN: true}),
          psrrDb: fc.double({min: 40, max: 160, noNaN: true}),
          aolDb: fc.double({min: 60, max: 160, noNaN: true}),
          inputType: fc.constantFrom('bipolar', 'jfet', 'cmos', 'zero-drift', 'bipolar-cancelled' as const)
        }),
        fc.tuple(fc.integer({min: -55, max: 25}), fc.integer({min: 25, max: 125})),
        // Half the cases with a silent op-amp: the resistor terms alone, where a trial comes closest to the bound.
        fc.boolean(),
        (name, calibration, distribution, tol, tc, op, temperature, silent) => {
          const base = CLOSED_FORM_STAGES[name]!()
          const move = (r: StageInput['rf']) => (r === null ? null : res(r.value, tol, tc))
          const input: StageInput = {
            ...base,
            rf: move(base.rf), rg: move(base.rg), rs: move(base.rs), rcomp: move(base.rcomp), rp: move(base.rp), rref: move(base.rref),
            r1: move(base.r1), r2: move(base.r2), r3: move(base.r3), riso: move(base.riso),
            opamp: silent ? silentOpamp() : testOpamp({
              vos: op.vos, vosDrift: op.vosDrift, ib: op.ib, ios: op.ios, inputType: op.inputType,
              cmrr: 10 ** (op.cmrrDb / 20), psrr: 10 ** (op.psrrDb / 20), aol: 10 ** (op.aolDb / 20)
            }),
            temperature, calibration
          }
          check(input, distribution)
        }
      ),
      {numRuns: 60, seed: 20261202}
    )
  })
})
