/**
 * The trial threads: a large Monte Carlo's trials split over this thread and up to
 * `threads − 1` worker threads (DESIGN §8.7: trial i depends only on (seed, i), so the split
 * changes no byte of any result). The engine asks through its `TrialSpread` hook while it
 * evaluates a note synchronously, so this thread runs the first part itself and then waits
 * for the others on shared memory (`Atomics.wait`), never on the event loop.
 *
 * The threads start on the first run that is large enough and stay for the command's life
 * (unreferenced: they never keep the process alive). A part whose thread fails or has not
 * finished by a generous deadline (ten times this thread's own part, plus 10 s) is run here:
 * a lost thread costs time, never a result.
 */
import {Worker} from 'node:worker_threads'
import {runTrialJob, type TrialJob, type TrialSpread} from '../engine/index.js'

/**
 * Trials below which a run stays in this thread: 1 M trials take about 0.2 s on one core,
 * about what a thread's start costs the first time; smaller runs gain nothing.
 */
export const SPREAD_MIN_TRIALS = 1_000_000

/** One part of a job, as posted to a trial thread (`trial-worker.ts`). */
export interface TrialRequest {
  job: TrialJob
  /** Trials [from, to) of the job. */
  from: number
  to: number
  /** Float64 arrays of job.trials values each (this part writes its range). */
  err: SharedArrayBuffer
  errCal: SharedArrayBuffer
  /** Int32 words: [0] parts finished, [1 + part] 1 done / 2 failed. */
  status: SharedArrayBuffer
  part: number
}

/** The status word of a part that finished. */
export const PART_DONE = 1
/** The status word of a part that threw (the main thread runs it itself). */
export const PART_FAILED = 2

export interface TrialThreads {
  spread: TrialSpread
  /** Stops the threads. */
  close: () => Promise<void>
  /** Worker threads started so far (0 until a large run). */
  started: () => number
  /** Parts run so far: by the worker threads, and in this thread (its own share and any part a thread did not finish). */
  parts: () => {threads: number; here: number}
}

/**
 * Trial threads for `threads` cores in all (this one included); `minTrials` the smallest run
 * that is spread (the tests lower it).
 */
export function trialThreads(threads: number, minTrials = SPREAD_MIN_TRIALS): TrialThreads {
  const workers: Worker[] = []
  const parts = {threads: 0, here: 0}
  const spread: TrialSpread = (job: TrialJob, err: Float64Array, errCal: Float64Array): boolean => {
    const n = job.trials
    if (threads < 2 || n < minTrials || n < threads) return false
    while (workers.length < threads - 1) {
      const w = new Worker(new URL('./trial-worker.js', import.meta.url))
      w.unref()
      // A thread that dies is dropped (seen between notes, when the event loop runs); the parts it held were run here.
      const drop = (): void => {
        const i = workers.indexOf(w)
        if (i >= 0) workers.splice(i, 1)
      }
      w.on('error', drop)
      w.on('exit', drop)
      workers.push(w)
    }
    const count = workers.length + 1
    const chunk = Math.ceil(n / count)
    const range = (k: number): [number, number] => [Math.min(n, k * chunk), Math.min(n, (k + 1) * chunk)]
    const shared = {err: new SharedArrayBuffer(n * 8), errCal: new SharedArrayBuffer(n * 8), status: new SharedArrayBuffer(4 * (count + 1))}
    const status = new Int32Array(shared.status)
    let posted = 0
    try {
      for (let k = 1; k < count; k++) {
        const [from, to] = range(k)
        workers[k - 1]!.postMessage({job, from, to, ...shared, part: k} satisfies TrialRequest)
        posted++
      }
    } catch {
      // The job could not be posted (not plain data): whatever was posted is ignored below.
    }
    const t0 = performance.now()
    const [from0, to0] = range(0)
    runTrialJob(job, from0, to0, err.subarray(from0, to0), errCal.subarray(from0, to0))
    parts.here++
    const deadline = performance.now() + 10 * (performance.now() - t0) + 10_000
    for (;;) {
      const finished = Atomics.load(status, 0)
      const left = deadline - performance.now()
      if (finished >= posted || left <= 0) break
      Atomics.wait(status, 0, finished, left)
    }
    const doneErr = new Float64Array(shared.err)
    const doneCal = new Float64Array(shared.errCal)
    for (let k = 1; k < count; k++) {
      const [from, to] = range(k)
      if (Atomics.load(status, 1 + k) === PART_DONE) {
        err.set(doneErr.subarray(from, to), from)
        errCal.set(doneCal.subarray(from, to), from)
        parts.threads++
      } else {
        runTrialJob(job, from, to, err.subarray(from, to), errCal.subarray(from, to))
        parts.here++
      }
    }
    return true
  }
  return {
    spread,
    close: async () => {
      await Promise.all(workers.splice(0).map((w) => w.terminate()))
    },
    started: () => workers.length,
    parts: () => ({...parts})
  }
}
