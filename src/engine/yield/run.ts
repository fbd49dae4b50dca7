/**
 * The Monte Carlo run over a stage's DC budget (DESIGN §8.7): draw every trial's variables
 * from the counter-based generator, evaluate the signed error sums of `model.ts` at every
 * input end and temperature, keep the largest magnitude (with and without the calibration),
 * then the requirement yields with their Wilson intervals, the percentiles, the histogram
 * and the variance shares.
 *
 * Trial i uses only uniformOf(trialKey(seed, i), slot): the draws, and so every figure, are
 * the same however the trials are split. The loop runs over typed arrays, the closed form of
 * `closed-form.ts` evaluated 1 + T·(1 + P) times a trial for T temperatures and P input ends.
 */
import type {DcBudget, StageInput, YieldKey, YieldOptions, YieldRequirement, YieldResult} from '../types.js'
import {YIELD_KEYS} from '../types.js'
import {DEFAULT_YIELD_TRIALS} from '../constants.js'
import {seedKey, trialKey, uniformOf} from './counter-rng.js'
import {DrawKind, SLOT, SLOT_COUNT, tcSlot, tolSlot, yieldModel, type YieldModel} from './model.js'
import {truncatedNormal} from './normal.js'
import type {TrialJob, TrialSpread} from './spread.js'
import {histogram, jansenTotalEffects, largestVariancePoint, percentileSorted, rankedShares, wilsonInterval} from './stats.js'


/**
 * The Monte Carlo options of a stage: its `yield` map, else the defaults when it requires a
 * yield (a yield requirement needs the run), else null (off).
 */
export function yieldOptionsOf(input: StageInput): YieldOptions | null {
  if (input.yield) return input.yield
  return input.require.yield !== undefined ? {trials: DEFAULT_YIELD_TRIALS, seed: 1, distribution: 'uniform'} : null
}

/**
 * The stage with its Monte Carlo off (no `yield` map, no `yield` requirement): for the variants
 * the rules and the chain evaluate only for their DC and noise figures, which the Monte Carlo
 * does not change.
 */
export function withoutMonteCarlo(input: StageInput): StageInput {
  if (!input.yield && input.require.yield === undefined) return input
  const {yield: _dropped, ...require} = input.require
  return {...input, yield: null, require}
}

/** Base rows of the variance-share estimate (each costs one evaluation per variable). */
export const VARIANCE_ROWS = 8192
/** Bins of the report's histogram. */
export const HISTOGRAM_BINS = 48
/** Offset of the second, independent sample of Jansen's design in the generator's variable index. */
export const STREAM_B = 64

/** Fill `vals` (SLOT_COUNT long) with one trial's draws; inactive slots stay 0. */
export function drawTrial(model: YieldModel, key: number, vals: Float64Array, stream = 0): void {
  // One loop per kind (the variables are grouped by kind in the model), no branch per draw.
  const slots = model.varSlot
  const scales = model.varScale
  // Indexed, not destructured: array destructuring runs the iterator protocol every trial.
  const symmetricEnd = model.kindEnds[0]
  const normalEnd = model.kindEnds[1]
  for (let k = 0; k < symmetricEnd; k++) {
    const slot = slots[k]
    vals[slot] = scales[k] * (2 * uniformOf(key, slot + stream) - 1)
  }
  for (let k = symmetricEnd; k < normalEnd; k++) {
    const slot = slots[k]
    vals[slot] = truncatedNormal(uniformOf(key, slot + stream), scales[k])
  }
  for (let k = normalEnd; k < slots.length; k++) {
    const slot = slots[k]
    vals[slot] = scales[k] * uniformOf(key, slot + stream)
  }
}

/** Scratch arrays of one evaluator. */
export interface Scratch {
  /** The one-trial results of `trialErrors` (largest |full| and |calibrated|; not read). */
  one: Float64Array
  oneCal: Float64Array
  rTol: Float64Array
  rT: Float64Array
  rIb: Float64Array
  tol: Float64Array
  /** One temperature's tempco terms per point. */
  tcs: Float64Array
  /** The points' fields (YieldPoint) as typed arrays, and each trial's gain terms per point. */
  px: Float64Array
  pcm: Float64Array
  pnom: Float64Array
  pdev: Float64Array
  paol: Float64Array
  pgain: Float64Array
}

export const scratchOf = (m: YieldModel): Scratch => ({
  one: new Float64Array(1),
  oneCal: new Float64Array(1),
  rTol: Float64Array.from(m.nominal),
  rT: Float64Array.from(m.nominal),
  rIb: Float64Array.from(m.nominal),
  tol: new Float64Array(m.points.length),
  tcs: new Float64Array(m.points.length),
  px: Float64Array.from(m.points, (q) => q.x),
  pcm: Float64Array.from(m.points, (q) => q.cm),
  pnom: Float64Array.from(m.points, (q) => q.nominal),
  pdev: Float64Array.from(m.points, (q) => q.cmDeviation),
  paol: Float64Array.from(m.points, (q) => q.aol),
  pgain: new Float64Array(m.points.length)
})

/**
 * One trial's signed errors: `out[ti·P + p]` the full error and `outCal[ti·P + p]` the
 * calibrated residual (equal to the full error without a calibration) at temperature
 * `temps[ti]` (the model's own Tmin, 25 °C, Tmax unless given: a chain evaluates all its
 * stages at the same temperatures) and input end p. The terms are those of `model.ts`.
 */
export function trialErrors(m: YieldModel, vals: Float64Array, s: Scratch, out: Float64Array, outCal: Float64Array, temps: ArrayLike<number> = m.temperatures): void {
  blockMax(m, vals, 1, 1, s, out, outCal, temps, s.one, s.oneCal, 0, undefined, 0)
}

/**
 * The signed errors of `count` trials, the one definition of the trial's arithmetic: trial j's
 * variable `slot` is read at `vals[j + slot·st]` (one trial's vector: count = st = 1; a block
 * of `drawBlock`: st the block's rows). For each trial, `out`/`outCal` get its signed errors
 * (as `trialErrors`), err[at + j] the largest |full error| and errCal[at + j] the largest
 * |calibrated residual|; with `sums`, the errors of trial number first + j are added to the
 * sums while it is below `sums.rows`. What belongs to the model and not to a trial is read once
 * per call.
 */
function blockMax(
  m: YieldModel, vals: Float64Array, count: number, st: number, s: Scratch, out: Float64Array, outCal: Float64Array,
  temps: ArrayLike<number>, err: Float64Array, errCal: Float64Array, at: number, sums: PointSums | undefined, first: number
): void {
  // The same operations in the same order as the terms of `model.ts` (so the same bytes); what
  // does not depend on the temperature (the gain terms) is computed once a trial, the points'
  // fields are read from typed arrays, and the tempco resistors only where they are used.
  const f = m.form
  const signal = m.signal
  const P = s.px.length
  const {px, pcm, pnom, pdev, paol, pgain, rTol, rT, rIb, tol, tcs} = s
  const mov = m.moving
  const nom = m.nominal
  const vref = m.vref
  const kVos = m.kVos
  const kIos = m.kIos
  const kIdark = m.kIdark
  const supplySpan = m.supplySpan
  const calibrated = m.calibrated
  const gainCalibrated = m.gainCalibrated
  const ibResidual = m.ibResidual
  const iosResidual = m.iosResidual
  const idarkResidual = m.idarkResidual
  const T = temps.length
  const sumRows = sums === undefined ? 0 : sums.rows
  const n = P * T
  for (let o = 0; o < count; o++) {
    for (let j = 0; j < mov.length; j++) {
      const i = mov[j]
      rTol[i] = nom[i] * (1 + vals[o + tolSlot(i) * st])
    }
    const cmrr = vals[o + SLOT.cmrr * st]
    signal(rTol, px, pcm, vref, pnom, tol)
    for (let p = 0; p < P; p++) {
      pgain[p] = kVos * pdev[p] * cmrr + paol[p] + tol[p]
    }
    const vos = vals[o + SLOT.vos * st]
    const ib = vals[o + SLOT.ib * st]
    const iosOut = vals[o + SLOT.ios * st] * kIos
    const idarkOut = vals[o + SLOT.idark * st] * kIdark
    const psrrOut = kVos * supplySpan * vals[o + SLOT.supply * st] * vals[o + SLOT.psrr * st]
    const vosDrift = vals[o + SLOT.vosDrift * st]
    let e = 0
    let ec = 0
    for (let ti = 0; ti < T; ti++) {
      const dt = temps[ti] - 25
      const at25 = dt === 0
      if (!at25) {
        for (let j = 0; j < mov.length; j++) {
          const i = mov[j]
          const c = vals[o + tcSlot(i) * st] * dt
          rT[i] = nom[i] * (1 + c)
          if (ib !== 0) rIb[i] = nom[i] * (1 + vals[o + tolSlot(i) * st] + c)
        }
        signal(rT, px, pcm, vref, pnom, tcs)
      }
      // At 25 °C the tempco moves nothing: the bias transfer is at the tolerance draw alone.
      const ibOut = ib === 0 ? 0 : ib * f(at25 ? rTol : rIb, 0, 0, 0, 0, 1, 1)
      const drift = kVos * vosDrift * dt + psrrOut
      const full = drift + ibOut + iosOut + idarkOut + kVos * vos
      const cal = drift + ibOut * ibResidual + iosOut * iosResidual + idarkOut * idarkResidual
      const row = ti * P
      for (let p = 0; p < P; p++) {
        const tc = at25 ? 0 : tcs[p]
        const gainTerms = pgain[p]
        const a = full + tc + gainTerms
        const b = calibrated ? cal + tc + (gainCalibrated ? 0 : gainTerms) : a
        out[row + p] = a
        outCal[row + p] = b
        // Math.max, not a comparison: no data-dependent branch (equal results for every number;
        // a NaN, which no term produces, would pass through where `if (aa > e)` skipped it).
        e = Math.max(e, Math.abs(a))
        ec = Math.max(ec, Math.abs(b))
      }
    }
    err[at + o] = e
    errCal[at + o] = ec
    if (first + o < sumRows) {
      const pick = (sums as PointSums).calibrated ? outCal : out
      const sum = (sums as PointSums).sum
      const sum2 = (sums as PointSums).sum2
      for (let k = 0; k < n; k++) {
        sum[k] += pick[k]
        sum2[k] += pick[k] * pick[k]
      }
    }
  }
}

/**
 * The signed error at one temperature ti and input end p only (the variance shares'
 * evaluations): the same terms as `trialErrors`, full or calibrated.
 */
export function pointError(m: YieldModel, vals: Float64Array, s: Scratch, p: number, ti: number, calibrated: boolean): number {
  return pointErrorAt(m, vals, s, p, m.temperatures[ti], calibrated)
}

/** `pointError` at a temperature `t` (°C) given by value. */
export function pointErrorAt(m: YieldModel, vals: Float64Array, s: Scratch, p: number, t: number, calibrated: boolean): number {
  const f = m.form
  const q = m.points[p]
  const mov = m.moving
  const nom = m.nominal
  const {rTol, rT, rIb} = s
  const dt = t - 25
  for (let j = 0; j < mov.length; j++) {
    const i = mov[j]
    const c = vals[tcSlot(i)] * dt
    rTol[i] = nom[i] * (1 + vals[tolSlot(i)])
    rT[i] = nom[i] * (1 + c)
    rIb[i] = nom[i] * (1 + vals[tolSlot(i)] + c)
  }
  const ib = vals[SLOT.ib]
  const ibOut = ib === 0 ? 0 : ib * f(rIb, 0, 0, 0, 0, 1, 1)
  const iosOut = vals[SLOT.ios] * m.kIos
  const idarkOut = vals[SLOT.idark] * m.kIdark
  const common = m.kVos * vals[SLOT.vosDrift] * dt + m.kVos * m.supplySpan * vals[SLOT.supply] * vals[SLOT.psrr]
  const tc = dt === 0 ? 0 : f(rT, q.x, q.cm, m.vref, 0, 0, 0) - q.nominal
  const gainTerms = m.kVos * q.cmDeviation * vals[SLOT.cmrr] + q.aol + (f(rTol, q.x, q.cm, m.vref, 0, 0, 0) - q.nominal)
  if (calibrated && m.calibrated) {
    return common + ibOut * m.ibResidual + iosOut * m.iosResidual + idarkOut * m.idarkResidual + tc + (m.gainCalibrated ? 0 : gainTerms)
  }
  return common + ibOut + iosOut + idarkOut + m.kVos * vals[SLOT.vos] + tc + gainTerms
}

/** Sums of the signed error at every point over the first `rows` trials (to find the point of largest variance). */
export interface PointSums {
  rows: number
  calibrated: boolean
  sum: Float64Array
  sum2: Float64Array
}

/** Trials drawn at a time by `trialBlock` (the rows of its column block). */
export const DRAW_BLOCK = 256

/**
 * Draw trials [from, from + count) of seed key `sk` (count ≤ the block's rows `st`) into the
 * column block `cols`: variable `slot` of the block's row j at cols[j + slot·st]. The same
 * numbers as `drawTrial` row by row (the same operations on the same uniforms), one variable
 * at a time over the rows: short loops of one kind of draw, which run about a third faster
 * than the variables of one trial after another. Inactive slots are not written (they stay 0).
 * (The loops are `drawTrial`'s over another index: one shared function ran 10 % slower, measured
 * in the bench; the tests check the two for equal bytes.)
 */
export function drawBlock(model: YieldModel, sk: number, from: number, count: number, cols: Float64Array, keys: Int32Array, st: number): void {
  for (let j = 0; j < count; j++) keys[j] = trialKey(sk, from + j)
  const slots = model.varSlot
  const scales = model.varScale
  const symmetricEnd = model.kindEnds[0]
  const normalEnd = model.kindEnds[1]
  for (let k = 0; k < symmetricEnd; k++) {
    const slot = slots[k]
    const scale = scales[k]
    const o = slot * st
    for (let j = 0; j < count; j++) cols[o + j] = scale * (2 * uniformOf(keys[j], slot) - 1)
  }
  for (let k = symmetricEnd; k < normalEnd; k++) {
    const slot = slots[k]
    const scale = scales[k]
    const o = slot * st
    for (let j = 0; j < count; j++) cols[o + j] = truncatedNormal(uniformOf(keys[j], slot), scale)
  }
  for (let k = normalEnd; k < slots.length; k++) {
    const slot = slots[k]
    const scale = scales[k]
    const o = slot * st
    for (let j = 0; j < count; j++) cols[o + j] = scale * uniformOf(keys[j], slot)
  }
}

/** The raw errors of trials [from, to): full and calibrated, max |signed sum| over the points. */
export function trialBlock(m: YieldModel, seed: number, from: number, to: number, err: Float64Array, errCal: Float64Array, sums?: PointSums): void {
  const sk = seedKey(seed)
  const st = DRAW_BLOCK
  const cols = new Float64Array(SLOT_COUNT * st)
  const keys = new Int32Array(st)
  const s = scratchOf(m)
  const n = m.points.length * m.temperatures.length
  const out = new Float64Array(n)
  const outCal = new Float64Array(n)
  for (let b = from; b < to; b += st) {
    const count = Math.min(st, to - b)
    drawBlock(m, sk, b, count, cols, keys, st)
    blockMax(m, cols, count, st, s, out, outCal, m.temperatures, err, errCal, b - from, sums, b)
  }
}

/** The figure a requirement is judged on, from the trial's full and calibrated output errors. */
export const ERROR_OF: Record<YieldKey, 'full' | 'cal'> = {
  'output-error': 'full',
  'input-error': 'full',
  'output-error-calibrated': 'cal',
  'input-error-calibrated': 'cal'
}

/** An unavailable result (no closed form for the topology). */
function unavailableResult(input: StageInput, options: YieldOptions, reason: string, dc: DcBudget): YieldResult {
  return {
    ...options,
    unavailable: reason,
    results: [],
    basis: input.calibration === 'none' ? 'output' : 'output-calibrated',
    worstCase: dc.calibrated?.worstCaseOutput ?? dc.worstCaseOutput,
    errorPercentiles: null,
    maxError: 0,
    variance: [],
    varianceAt: null,
    varianceRows: 0,
    histogram: {top: 0, counts: []}
  }
}

/**
 * The Monte Carlo of one stage (DESIGN §8.7).
 * @param dc
 *   The stage's budget (the worst-case bound shown beside the distribution).
 * @param gain
 *   The signed signal gain G (input-referred = output ÷ |G|).
 * @param spread
 *   Runs the trials on other threads when it can (`spread.ts`); the result is the same bytes.
 */
export function runYield(input: StageInput, options: YieldOptions, dc: DcBudget, gain: number, spread?: TrialSpread): YieldResult {
  const model = yieldModel(input, options.distribution)
  if (model === null) {
    return unavailableResult(input, options, `the ${input.topology} topology has no closed-form DC solution for the Monte Carlo`, dc)
  }
  const n = options.trials
  const err = new Float64Array(n)
  const errCal = new Float64Array(n)
  const calibrated = input.calibration !== 'none'
  const P = model.points.length * model.temperatures.length
  const rows = Math.min(n, VARIANCE_ROWS)
  const sums: PointSums = {rows, calibrated, sum: new Float64Array(P), sum2: new Float64Array(P)}
  // The first `rows` trials (in order, so any later split keeps these sums) also locate the point of largest variance.
  const job: TrialJob = {kind: 'stage', input, distribution: options.distribution, seed: options.seed, trials: n}
  if (spread !== undefined && spread(job, err, errCal)) trialBlock(model, options.seed, 0, rows, new Float64Array(rows), new Float64Array(rows), sums)
  else trialBlock(model, options.seed, 0, n, err, errCal, sums)
  const g = Math.abs(gain)
  const results: YieldRequirement[] = []
  for (const key of YIELD_KEYS) {
    const limit = input.require[key]
    if (limit === undefined) continue
    const e = ERROR_OF[key] === 'full' ? err : errCal
    const bound = key.startsWith('input') ? limit * g : limit
    let passed = 0
    for (let i = 0; i < n; i++) if (e[i] <= bound) passed++
    results.push({key, limit, passed, yield: passed / n, interval: wilsonInterval(passed, n)})
  }
  const basisErr = calibrated ? errCal : err
  const worstCase = calibrated ? (dc.calibrated?.worstCaseOutput ?? dc.worstCaseOutput) : dc.worstCaseOutput
  const sorted = Float64Array.from(basisErr).sort()
  const maxError = n > 0 ? sorted[n - 1] : 0
  const limits = results.filter((r) => ERROR_OF[r.key] === (calibrated ? 'cal' : 'full')).map((r) => (r.key.startsWith('input') ? r.limit * g : r.limit))
  const top = Math.max(maxError, worstCase, ...limits) * 1.02
  const shares = varianceShares(model, options.seed, sums)
  return {
    ...options,
    unavailable: null,
    results,
    basis: calibrated ? 'output-calibrated' : 'output',
    worstCase,
    errorPercentiles: {p50: percentileSorted(sorted, 0.5), p99: percentileSorted(sorted, 0.99), p999: percentileSorted(sorted, 0.999)},
    maxError,
    variance: shares.variance,
    varianceAt: shares.at === null ? null : {input: shares.at.x, inputCm: input.topology === 'difference' ? shares.at.cm : null, temperature: shares.at.t},
    varianceRows: shares.rows,
    histogram: {top, counts: histogram(basisErr, HISTOGRAM_BINS, top)}
  }
}

/**
 * Variance shares (DESIGN §8.7): Jansen's total-effect index of each variable for the signed
 * error at the input end and temperature of largest variance (from `sums`), over the first
 * `sums.rows` trials (matrix A) and an independent second draw of the same trials (matrix B),
 * normalised to sum 1.
 */
function varianceShares(m: YieldModel, seed: number, sums: PointSums): {
  variance: {variable: string; share: number}[]
  at: {x: number; cm: number; t: number} | null
  rows: number
} {
  const rows = sums.rows
  if (rows < 2 || m.variables.length === 0) return {variance: [], at: null, rows: 0}
  const sk = seedKey(seed)
  const {p, ti} = largestVariancePoint(sums, m.points.length)
  const vals = new Float64Array(SLOT_COUNT)
  const valsB = new Float64Array(SLOT_COUNT)
  const s = scratchOf(m)
  const fA = new Float64Array(rows)
  const fAB = m.variables.map(() => new Float64Array(rows))
  for (let j = 0; j < rows; j++) {
    const key = trialKey(sk, j)
    drawTrial(m, key, vals)
    drawTrial(m, key, valsB, STREAM_B)
    fA[j] = pointError(m, vals, s, p, ti, sums.calibrated)
    for (let i = 0; i < m.variables.length; i++) {
      const slot = m.variables[i].slot
      const keep = vals[slot]
      vals[slot] = valsB[slot]
      fAB[i][j] = pointError(m, vals, s, p, ti, sums.calibrated)
      vals[slot] = keep
    }
  }
  const variance = rankedShares(m.variables.map((v) => v.name), jansenTotalEffects(fA, fAB))
  const q = m.points[p]
  return {variance, at: {x: q.x, cm: q.cm, t: m.temperatures[ti]}, rows}
}
