/**
 * Spreading one Monte Carlo's trials over other threads (DESIGN §8.7, "large runs use the
 * worker pool"). The engine stays pure: it describes the run as a `TrialJob` (plain data, so
 * it can be posted to a thread) and asks an optional `TrialSpread`, which the caller supplies,
 * to fill the trials' errors; `runTrialJob` is the one way to compute any range of them, here
 * and on every thread. Trial i depends only on (seed, i), so the errors — and every figure
 * built from them — are the same bytes however the trials were split.
 */
import type {ChainInput} from '../chain/types.js'
import type {StageInput, YieldDistribution} from '../types.js'
import {chainTrialBlock, chainYieldModel, type ChainYieldStage} from './chain.js'
import {yieldModel} from './model.js'
import {trialBlock} from './run.js'

/** What a Monte Carlo's trials are computed from: a stage's model, or a chain's. */
export type TrialJob =
  | {kind: 'stage'; input: StageInput; distribution: YieldDistribution; seed: number; trials: number}
  | {kind: 'chain'; chain: ChainInput; stages: readonly ChainYieldStage[]; distribution: YieldDistribution; seed: number; trials: number}

/**
 * Fills err[i] and errCal[i] (the largest |full error| and |calibrated residual| of trial i,
 * i < job.trials) by running parts of the job elsewhere; returns false when it did not (a
 * small run, no threads), and the engine then runs the trials itself.
 */
export type TrialSpread = (job: TrialJob, err: Float64Array, errCal: Float64Array) => boolean

/** Trials [from, to) of a job into err/errCal (indexed from 0 = trial `from`). */
export function runTrialJob(job: TrialJob, from: number, to: number, err: Float64Array, errCal: Float64Array): void {
  if (job.kind === 'stage') {
    const m = yieldModel(job.input, job.distribution)
    if (m === null) throw new Error(`the ${job.input.topology} topology has no closed-form DC solution for the Monte Carlo`)
    trialBlock(m, job.seed, from, to, err, errCal)
    return
  }
  const cm = chainYieldModel(job.chain, job.stages, {trials: job.trials, seed: job.seed, distribution: job.distribution})
  if (typeof cm === 'string') throw new Error(cm)
  chainTrialBlock(cm, job.seed, from, to, err, errCal)
}
