/**
 * `evaluateStage`: the whole engine for one stage, StageInput → StageResult (DESIGN §4).
 *
 *   1. topology terms (§4.1)   2. DC budget (§4.2)   3. noise (§4.3)
 *   4. stability (§4.4)        5. limits (§4.6)      6. requirements (§3.3), then the limits
 *
 * Pure: no I/O, clock or randomness; the same input gives the same result.
 */
import {dcAnalysis} from './dc/budget.js'
import {signalGain} from './dc/solve.js'
import {filterFigures} from './filter.js'
import {evaluateInstrumentation} from './instrumentation.js'
import {noiseAnalysis} from './noise/budget.js'
import {checkRequirements} from './requirements.js'
import {stabilityAnalysis} from './stability.js'
import {checkLimits, swingOf} from './limits.js'
import {topologyTerms} from './topology/index.js'
import type {StageInput, StageResult} from './types.js'
import {runYield, yieldOptionsOf} from './yield/run.js'
import type {TrialSpread} from './yield/spread.js'

/**
 * Reject inputs the engine cannot evaluate (the note layer reports these with positions;
 * this guards library callers).
 */
export function assertEvaluable(input: StageInput): void {
  const needs = (key: 'rf' | 'rg', ok: boolean): void => {
    if (!ok) throw new RangeError(`Unexpected missing \`${key}\` in stage \`${input.id}\`, expected a resistor for a ${input.topology} stage`)
  }
  const t = input.topology
  if (t === 'instrumentation') {
    if (input.ina === null) throw new RangeError(`Unexpected missing \`ina\` in stage \`${input.id}\`, expected an instrumentation amplifier`)
    needs('rg', input.rg !== null && input.rg.value > 0)
  }
  const needsRf = t === 'noninverting' || t === 'inverting' || t === 'transimpedance' || t === 'difference'
  if (needsRf) needs('rf', input.rf !== null && input.rf.value > 0)
  if (t === 'noninverting' || t === 'inverting' || t === 'difference') needs('rg', input.rg !== null && input.rg.value > 0)
  const part = (key: 'rp' | 'rref' | 'r1' | 'r2' | 'r3' | 'c1' | 'c2', ok: boolean): void => {
    if (!ok) throw new RangeError(`Unexpected missing \`${key}\` in stage \`${input.id}\`, expected a value > 0 for a ${t} stage`)
  }
  if (t === 'difference') for (const k of ['rp', 'rref'] as const) part(k, (input[k]?.value ?? 0) > 0)
  if (t === 'lowpass-sallen-key' || t === 'lowpass-mfb') for (const k of ['r1', 'r2', 'c1', 'c2'] as const) part(k, (input[k]?.value ?? 0) > 0)
  if (t === 'lowpass-mfb') part('r3', (input.r3?.value ?? 0) > 0)
  const [fL, fH] = input.band
  if (!(fL > 0 && fH > fL)) throw new RangeError(`Unexpected band ${fL} .. ${fH} Hz in stage \`${input.id}\`, expected 0 < fL < fH`)
  if (!(input.opamp.gbw > 0 && input.opamp.aol > 0)) throw new RangeError(`Unexpected gbw or aol in stage \`${input.id}\`, expected positive values`)
}

/** What an evaluation may use besides its input; none of it changes the result. */
export interface EvaluateContext {
  /** Runs a Monte Carlo's trials on other threads (`yield/spread.ts`). (optional: all in this thread) */
  spread?: TrialSpread
}

/** Evaluate a stage: DC budget, noise, stability, swing and requirement verdicts. */
export function evaluateStage(input: StageInput, context: EvaluateContext = {}): StageResult {
  assertEvaluable(input)
  if (input.topology === 'instrumentation') return evaluateInstrumentation(input, context.spread)
  const terms = topologyTerms(input)
  const dc = dcAnalysis(input)
  const noise = noiseAnalysis(input)
  const loop = stabilityAnalysis(input)
  const figures = {dc: dc.budget, noise: noise.budget, stability: loop.stability}
  const limits = checkLimits(input)
  const gain = signalGain(input)
  const options = yieldOptionsOf(input)
  const yieldResult = options === null ? null : runYield(input, options, dc.budget, gain, context.spread)
  return {
    id: input.id,
    topology: input.topology,
    opamp: input.opamp.name,
    gain,
    noiseGain: terms.noiseGain,
    ...figures,
    filter: filterFigures(input),
    requirements: [...checkRequirements(input, {...figures, yield: yieldResult}), ...limits],
    curves: {...noise.curves, ...loop.curves},
    swing: swingOf(input, limits),
    bias: dc.bias,
    yield: yieldResult
  }
}
