/**
 * The Monte Carlo over a chain's DC budget (DESIGN §8.6, §8.7).
 *
 * Each trial draws every stage's variables with that stage's own model (`model.ts`; for an
 * instrumentation stage, which has no closed form, its block model in `ina-model.ts`), the
 * stage's variable indices offset by k·STAGE_STRIDE so no two stages share a draw (stage 0's
 * draws are those of the same stage run alone), and the converter's five maxima (offset,
 * offset-drift, gain-error, gain-drift, inl: truncated normals, σ = max/3) at K·STAGE_STRIDE.
 *
 * A trial's signed error at the converter's input, at one chain input end p and temperature
 * T, is the cascade of the worst-case budget with signs kept:
 *
 *   e(p, T) = Σk ek(pk, Tk) · Πj>k Gj + offset + offset-drift·(T − 25)
 *             + (gain-error + gain-drift·(T − 25))·Vadc(p) + inl·LSB,
 *
 * ek the stage's own signed error sum (`trialErrors`, the residual under the chain's
 * calibration for the calibrated form), Gj the stages' signed nominal gains, pk the input end
 * of stage k that the chain's end p reaches (the stage input point nearest the nominal output
 * of the stage before it: an inverting stage swaps the ends), Vadc(p) the nominal chain output.
 * Every stage is evaluated at the same temperature T in one trial, clamped into that stage's
 * own range widened to 25 °C (so no stage is taken outside the range its own budget covers;
 * with equal ranges, as is usual, the clamp does nothing). With a calibration the converter's
 * offset is removed, and with `offset-and-gain` its gain-error too (as `converterTerms`).
 * Each term's magnitude is at most its term of the chain's worst-case sum, so that sum bounds
 * every trial. The trial's error is max |e| over the ends and Tmin, 25 °C, Tmax of the chain.
 */
import {DATASHEET_TEMPERATURE} from '../constants.js'
import {lsbOf, type ChainDc, type ChainInput, type ChainYieldRequirement, type ChainYieldResult} from '../chain/types.js'
import {CHAIN_YIELD_KEYS, type ChainYieldKey} from '../chain/types.js'
import {YIELD_KEYS, type DcBudget, type StageInput, type YieldKey, type YieldOptions, type YieldResult} from '../types.js'
import {seedKey, trialKey, uniformOf} from './counter-rng.js'
import {DrawKind, SLOT_COUNT, yieldModel, type YieldModel, type YieldVariable} from './model.js'
import {INA_SLOT_COUNT, inaPointError, inaYieldModel, type InaYieldModel} from './ina-model.js'
import {truncatedNormal} from './normal.js'
import {drawTrial, HISTOGRAM_BINS, pointErrorAt, scratchOf, STREAM_B, trialErrors, VARIANCE_ROWS, type Scratch} from './run.js'
import type {TrialJob, TrialSpread} from './spread.js'
import {histogram, jansenTotalEffects, largestVariancePoint, percentileSorted, rankedShares, wilsonInterval} from './stats.js'

/** Variable-index offset between stages (a stage's slots and its Jansen second stream, slot + 64, stay below it). */
export const STAGE_STRIDE = 128
/** The converter's variables, in slot order. */
export const CONVERTER_KEYS = ['offset', 'offset-drift', 'gain-error', 'gain-drift', 'inl'] as const

/** One evaluated stage of the chain, as the Monte Carlo needs it. */
export interface ChainYieldStage {
  /** The stage's input as evaluated (a later stage's input range is the output span before it). */
  input: StageInput
  /** Signed DC signal gain. */
  gain: number
}

/**
 * One stage's signed-error evaluator for the chain: a closed-form stage's model of `model.ts`
 * (the stage's own Monte Carlo), or an instrumentation stage's block model (`ina-model.ts`).
 */
interface StageEvaluator {
  /** Input points (ends × common-mode ends) with the nominal output at each. */
  points: readonly {x: number; cm: number; nominal: number}[]
  variables: readonly YieldVariable[]
  /** Draw trial `key`'s variables into `vals`, the generator's variable index offset by `offset`. */
  draw(key: number, vals: Float64Array, offset: number): void
  /** Signed errors at temps[ti] and point p into out[ti·P + p] (full) and outCal (calibrated residual). */
  errors(vals: Float64Array, temps: Float64Array, out: Float64Array, outCal: Float64Array): void
  pointError(vals: Float64Array, p: number, t: number, calibrated: boolean): number
}

function closedFormEvaluator(m: YieldModel): StageEvaluator {
  const s: Scratch = scratchOf(m)
  return {
    points: m.points,
    variables: m.variables,
    draw: (key, vals, offset) => drawTrial(m, key, vals, offset),
    errors: (vals, temps, out, outCal) => trialErrors(m, vals, s, out, outCal, temps),
    pointError: (vals, p, t, calibrated) => pointErrorAt(m, vals, s, p, t, calibrated)
  }
}

function inaEvaluator(m: InaYieldModel): StageEvaluator {
  const vars = m.variables
  const P = m.points.length
  return {
    points: m.points,
    variables: vars,
    draw(key, vals, offset) {
      for (const v of vars) {
        const u = uniformOf(key, v.slot + offset)
        vals[v.slot] = v.kind === DrawKind.Symmetric ? v.scale * (2 * u - 1) : v.kind === DrawKind.Normal ? truncatedNormal(u, v.scale) : v.scale * u
      }
    },
    errors(vals, temps, out, outCal) {
      for (let ti = 0; ti < temps.length; ti++) {
        for (let p = 0; p < P; p++) {
          out[ti * P + p] = inaPointError(m, vals, p, temps[ti], false)
          outCal[ti * P + p] = inaPointError(m, vals, p, temps[ti], true)
        }
      }
    },
    pointError: (vals, p, t, calibrated) => inaPointError(m, vals, p, t, calibrated)
  }
}

interface CompiledStage {
  id: string
  m: StageEvaluator
  vals: Float64Array
  valsB: Float64Array
  out: Float64Array
  outCal: Float64Array
  /** The chain's temperatures clamped into the stage's range (with 25 °C). */
  temps: Float64Array
  /** For each chain point, the stage's own input point. */
  pointOf: Int32Array
  /** Signed Π of the later stages' gains. */
  later: number
  /** Variable-index offset of the stage. */
  offset: number
}

/** A chain compiled for the trial loop. */
export interface ChainYieldModel {
  stages: CompiledStage[]
  /** Tmin, 25 °C, Tmax of the chain (duplicates dropped), °C. */
  temperatures: number[]
  /** The chain's input points (the first stage's), with the nominal converter input. */
  points: {x: number; cm: number; vadc: number}[]
  /** Converter: scales (V, V/K, 1, 1/K, V) of CONVERTER_KEYS, its draws, and the variable offset; null without one. */
  adc: {name: string; scale: Float64Array; vals: Float64Array; valsB: Float64Array; offset: number} | null
  calibrated: boolean
  gainCalibrated: boolean
  /** The first stage is a difference or instrumentation stage: its points pair the input ends with the common-mode ends. */
  differential: boolean
}

const clamp = (t: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, t))

/** Compile the chain, or give the reason it has no Monte Carlo (a stage without a closed form). */
export function chainYieldModel(chain: ChainInput, stages: readonly ChainYieldStage[], options: YieldOptions): ChainYieldModel | string {
  const models: StageEvaluator[] = []
  for (const st of stages) {
    // The stage's residuals are those of the chain's calibration (DESIGN §8.6).
    const input = {...st.input, calibration: chain.calibration}
    if (input.topology === 'instrumentation') {
      const m = inaYieldModel(input, options.distribution)
      if (m === null) return `stage ${st.input.id} (instrumentation) has no block model for the Monte Carlo`
      models.push(inaEvaluator(m))
      continue
    }
    const m = yieldModel(input, options.distribution)
    if (m === null) return `stage ${st.input.id} (${st.input.topology}) has no closed-form DC solution for the Monte Carlo`
    models.push(closedFormEvaluator(m))
  }
  const [tmin, tmax] = chain.temperature
  const temperatures = [...new Set([tmin, DATASHEET_TEMPERATURE, tmax])].sort((a, b) => a - b)
  const first = models[0]
  const points = first.points.map((q) => ({x: q.x, cm: q.cm, vadc: 0}))
  const compiled: CompiledStage[] = []
  let later = 1
  const laterOf = stages.map(() => 1)
  for (let k = stages.length - 1; k >= 0; k--) {
    laterOf[k] = later
    later *= stages[k].gain
  }
  // The nominal signal at each chain point, carried stage by stage.
  let level = points.map(() => 0)
  models.forEach((m, k) => {
    const st = stages[k].input
    const pointOf = new Int32Array(points.length)
    points.forEach((_, p) => {
      if (k === 0) {
        pointOf[p] = p
      } else {
        let best = 0
        for (let i = 1; i < m.points.length; i++) if (Math.abs(m.points[i].x - level[p]) < Math.abs(m.points[best].x - level[p])) best = i
        pointOf[p] = best
      }
    })
    level = points.map((_, p) => m.points[pointOf[p]].nominal)
    const lo = Math.min(st.temperature[0], DATASHEET_TEMPERATURE)
    const hi = Math.max(st.temperature[1], DATASHEET_TEMPERATURE)
    const n = m.points.length * temperatures.length
    compiled.push({
      id: st.id, m, vals: new Float64Array(Math.max(SLOT_COUNT, INA_SLOT_COUNT)), valsB: new Float64Array(Math.max(SLOT_COUNT, INA_SLOT_COUNT)),
      out: new Float64Array(n), outCal: new Float64Array(n),
      temps: Float64Array.from(temperatures, (t) => clamp(t, lo, hi)), pointOf, later: laterOf[k], offset: k * STAGE_STRIDE
    })
  })
  points.forEach((q, p) => (q.vadc = level[p]))
  const a = chain.adc
  return {
    stages: compiled,
    temperatures,
    points,
    adc: a === null ? null : {
      name: a.name,
      scale: Float64Array.from([a.offset, a.offsetDrift, a.gainError, a.gainDrift, a.inl * lsbOf(a)]),
      vals: new Float64Array(CONVERTER_KEYS.length), valsB: new Float64Array(CONVERTER_KEYS.length),
      offset: stages.length * STAGE_STRIDE
    },
    calibrated: chain.calibration !== 'none',
    gainCalibrated: chain.calibration === 'offset-and-gain',
    differential: stages[0].input.topology === 'difference' || stages[0].input.topology === 'instrumentation'
  }
}

/** Draw trial `key`'s variables of every stage (into each stage's `vals`) and of the converter; `stream` selects Jansen's second sample. */
export function drawChainTrial(cm: ChainYieldModel, key: number, stream = 0): void {
  for (const st of cm.stages) st.m.draw(key, stream === 0 ? st.vals : st.valsB, st.offset + stream)
  const a = cm.adc
  if (a === null) return
  const into = stream === 0 ? a.vals : a.valsB
  for (let j = 0; j < CONVERTER_KEYS.length; j++) into[j] = a.scale[j] > 0 ? truncatedNormal(uniformOf(key, a.offset + stream + j), a.scale[j]) : 0
}

/** The converter's signed error at temperature t and converter input v (full, or the calibrated residual). */
function converterError(cm: ChainYieldModel, t: number, v: number, calibrated: boolean): number {
  const a = cm.adc
  if (a === null) return 0
  const x = a.vals
  const dt = t - DATASHEET_TEMPERATURE
  const offset = calibrated && cm.calibrated ? 0 : x[0]
  const gain = calibrated && cm.gainCalibrated ? 0 : x[2]
  return offset + x[1] * dt + (gain + x[3] * dt) * v + x[4]
}

/**
 * The signed chain errors of the drawn trial: `out[ti·P + p]` full and `outCal[ti·P + p]`
 * the calibrated residual at chain temperature ti and chain input point p. Returns the
 * largest |full| and |calibrated| error.
 */
export function chainTrialErrors(cm: ChainYieldModel, out: Float64Array, outCal: Float64Array): [number, number] {
  const P = cm.points.length
  for (const st of cm.stages) st.m.errors(st.vals, st.temps, st.out, st.outCal)
  let e = 0
  let ec = 0
  for (let ti = 0; ti < cm.temperatures.length; ti++) {
    const t = cm.temperatures[ti]
    for (let p = 0; p < P; p++) {
      let a = 0
      let b = 0
      for (const st of cm.stages) {
        const i = ti * st.m.points.length + st.pointOf[p]
        a += st.out[i] * st.later
        b += st.outCal[i] * st.later
      }
      const v = cm.points[p].vadc
      a += converterError(cm, t, v, false)
      b += converterError(cm, t, v, true)
      out[ti * P + p] = a
      outCal[ti * P + p] = b
      if (Math.abs(a) > e) e = Math.abs(a)
      if (Math.abs(b) > ec) ec = Math.abs(b)
    }
  }
  return [e, ec]
}

/** The signed chain error of the drawn trial at one point (the variance shares' evaluations). */
function chainPointError(cm: ChainYieldModel, p: number, ti: number, calibrated: boolean): number {
  let e = 0
  for (const st of cm.stages) e += st.m.pointError(st.vals, st.pointOf[p], st.temps[ti], calibrated) * st.later
  return e + converterError(cm, cm.temperatures[ti], cm.points[p].vadc, calibrated)
}

/** The raw errors of trials [from, to) (full, calibrated), with the point sums of the first `rows` trials. */
export function chainTrialBlock(cm: ChainYieldModel, seed: number, from: number, to: number, err: Float64Array, errCal: Float64Array,
  sums?: {rows: number; calibrated: boolean; sum: Float64Array; sum2: Float64Array}): void {
  const sk = seedKey(seed)
  const n = cm.points.length * cm.temperatures.length
  const out = new Float64Array(n)
  const outCal = new Float64Array(n)
  for (let t = from; t < to; t++) {
    drawChainTrial(cm, trialKey(sk, t))
    const [e, ec] = chainTrialErrors(cm, out, outCal)
    err[t - from] = e
    errCal[t - from] = ec
    if (sums !== undefined && t < sums.rows) {
      const pick = sums.calibrated ? outCal : out
      for (let k = 0; k < n; k++) {
        sums.sum[k] += pick[k]
        sums.sum2[k] += pick[k] * pick[k]
      }
    }
  }
}

const isCalibratedKey = (k: ChainYieldKey): boolean => k.endsWith('-calibrated')

/**
 * The Monte Carlo of a chain (DESIGN §8.7).
 * @param dc
 *   The chain's worst-case budget (the bound shown beside the distribution).
 */
export function runChainYield(chain: ChainInput, stages: readonly ChainYieldStage[], dc: ChainDc, options: YieldOptions, spread?: TrialSpread): ChainYieldResult {
  const calibrated = chain.calibration !== 'none'
  return chainYieldWithBound(chain, stages, calibrated ? (dc.calibrated?.worstCaseOutput ?? dc.worstCaseOutput) : dc.worstCaseOutput, options, spread)
}

/**
 * The Monte Carlo of an instrumentation stage on its own (DESIGN §8.7): it has no closed
 * form, so it runs as a chain of that one stage without a converter, on the block model of
 * `ina-model.ts`: the same draws and errors the stage has inside a chain.
 * @param dc
 *   The stage's budget (the worst-case bound shown beside the distribution).
 */
export function runInstrumentationYield(input: StageInput, options: YieldOptions, dc: DcBudget, gain: number, spread?: TrialSpread): YieldResult {
  const require: ChainInput['require'] = {}
  for (const key of YIELD_KEYS) if (input.require[key] !== undefined) require[key] = input.require[key]
  const chain: ChainInput = {
    id: input.id, title: input.title, stages: [input.id], adc: null, temperature: input.temperature, band: input.band,
    calibration: input.calibration, require, yield: options
  }
  const worstCase = input.calibration === 'none' ? dc.worstCaseOutput : (dc.calibrated?.worstCaseOutput ?? dc.worstCaseOutput)
  const r = chainYieldWithBound(chain, [{input, gain}], worstCase, options, spread)
  const prefix = `${input.id}/`
  return {
    ...r,
    results: r.results.flatMap((row) => (isYieldKey(row.key) ? [{...row, key: row.key}] : [])),
    variance: r.variance.map((v) => ({...v, variable: v.variable.startsWith(prefix) ? v.variable.slice(prefix.length) : v.variable}))
  }
}

const isYieldKey = (k: string): k is YieldKey => (YIELD_KEYS as readonly string[]).includes(k)

function chainYieldWithBound(chain: ChainInput, stages: readonly ChainYieldStage[], worstCase: number, options: YieldOptions, spread?: TrialSpread): ChainYieldResult {
  const calibrated = chain.calibration !== 'none'
  const basis = calibrated ? 'output-calibrated' as const : 'output' as const
  const cm = chainYieldModel(chain, stages, options)
  if (typeof cm === 'string') {
    return {...options, unavailable: cm, results: [], basis, worstCase, errorPercentiles: null, maxError: 0, variance: [], varianceAt: null, varianceRows: 0, histogram: {top: 0, counts: []}}
  }
  const n = options.trials
  const err = new Float64Array(n)
  const errCal = new Float64Array(n)
  const P = cm.points.length * cm.temperatures.length
  const rows = Math.min(n, VARIANCE_ROWS)
  const sums = {rows, calibrated, sum: new Float64Array(P), sum2: new Float64Array(P)}
  const job: TrialJob = {kind: 'chain', chain, stages, distribution: options.distribution, seed: options.seed, trials: n}
  if (spread !== undefined && spread(job, err, errCal)) chainTrialBlock(cm, options.seed, 0, rows, new Float64Array(rows), new Float64Array(rows), sums)
  else chainTrialBlock(cm, options.seed, 0, n, err, errCal, sums)
  const g = Math.abs(stages.reduce((x, s) => x * s.gain, 1))
  const lsb = chain.adc === null ? null : lsbOf(chain.adc)
  const boundOf = (key: ChainYieldKey, limit: number): number | null =>
    key.startsWith('input') ? limit * g : key.startsWith('error-lsb') ? (lsb === null ? null : limit * lsb) : limit
  const results: ChainYieldRequirement[] = []
  for (const key of CHAIN_YIELD_KEYS) {
    const limit = chain.require[key]
    const bound = limit === undefined ? null : boundOf(key, limit)
    if (limit === undefined || bound === null) continue
    const e = isCalibratedKey(key) ? errCal : err
    let passed = 0
    for (let i = 0; i < n; i++) if (e[i] <= bound) passed++
    results.push({key, limit, passed, yield: passed / n, interval: wilsonInterval(passed, n)})
  }
  const basisErr = calibrated ? errCal : err
  const sorted = Float64Array.from(basisErr).sort()
  const maxError = n > 0 ? sorted[n - 1] : 0
  const limits = results.filter((r) => isCalibratedKey(r.key) === calibrated).map((r) => boundOf(r.key, r.limit) ?? 0)
  const top = Math.max(maxError, worstCase, ...limits) * 1.02
  const shares = chainVarianceShares(cm, options.seed, sums)
  return {
    ...options,
    unavailable: null,
    results,
    basis,
    worstCase,
    errorPercentiles: {p50: percentileSorted(sorted, 0.5), p99: percentileSorted(sorted, 0.99), p999: percentileSorted(sorted, 0.999)},
    maxError,
    variance: shares.variance,
    varianceAt: shares.at,
    varianceRows: shares.rows,
    histogram: {top, counts: histogram(basisErr, HISTOGRAM_BINS, top)}
  }
}

/**
 * Jansen total-effect shares of every stage's and the converter's variables for the signed
 * chain error at the point of largest variance, as for a stage (`run.ts`).
 */
function chainVarianceShares(cm: ChainYieldModel, seed: number, sums: {rows: number; calibrated: boolean; sum: Float64Array; sum2: Float64Array}): {
  variance: {variable: string; share: number}[]
  at: ChainYieldResult['varianceAt']
  rows: number
} {
  const rows = sums.rows
  const vars: {name: string; vals: Float64Array; valsB: Float64Array; slot: number}[] = []
  for (const st of cm.stages) for (const v of st.m.variables) vars.push({name: `${st.id}/${v.name}`, vals: st.vals, valsB: st.valsB, slot: v.slot})
  const a = cm.adc
  if (a !== null) CONVERTER_KEYS.forEach((key, j) => {
    if (a.scale[j] > 0) vars.push({name: `${a.name}/${key}`, vals: a.vals, valsB: a.valsB, slot: j})
  })
  if (rows < 2 || vars.length === 0) return {variance: [], at: null, rows: 0}
  const {p, ti} = largestVariancePoint(sums, cm.points.length)
  const sk = seedKey(seed)
  const fA = new Float64Array(rows)
  const fAB = vars.map(() => new Float64Array(rows))
  for (let j = 0; j < rows; j++) {
    const key = trialKey(sk, j)
    drawChainTrial(cm, key)
    drawChainTrial(cm, key, STREAM_B)
    fA[j] = chainPointError(cm, p, ti, sums.calibrated)
    for (let i = 0; i < vars.length; i++) {
      const v = vars[i]
      const keep = v.vals[v.slot]
      v.vals[v.slot] = v.valsB[v.slot]
      fAB[i][j] = chainPointError(cm, p, ti, sums.calibrated)
      v.vals[v.slot] = keep
    }
  }
  const variance = rankedShares(vars.map((v) => v.name), jansenTotalEffects(fA, fAB))
  const q = cm.points[p]
  return {variance, at: {input: q.x, inputCm: cm.differential ? q.cm : null, temperature: cm.temperatures[ti]}, rows}
}
