/**
 * The trial threads: a large Monte Carlo's trials split over this thread and up to
 * `threads − 1` worker threads (DESIGN §8.7: trial i depends only on (seed, i), so the split
 * changes no byte of any result). The engine asks through its `TrialSpread` hook while it
 * evaluates a note synchronously, so this thread runs the first part itself and then waits
 * for the others on shared memory (`Atomics.wait`), never on the event loop.
 *
 * The threads start on the first run that is large enough and stay for the command's life
 * (unreferenced: they never keep the process alive). A thread marks a part taken when it starts
 * on it. A part that no thread has taken within PICKUP_GRACE_MS after this thread's own part
 * (a thread that failed to load or died: the event loop, which would report it, does not run
 * while this thread waits), or that is not finished by a generous deadline (ten times this
 * thread's own part, plus 10 s), is run here, and the runs after it stay in this thread: a
 * lost thread costs time once, never a result.
 */
import {Worker} from 'node:worker_threads'
import {runTrialJob, type TrialJob, type TrialSpread} from '../engine/index.js'

/**
 * Trials below which a run stays in this thread: 1 M trials take about 0.2 s on one core,
 * about what a thread's start costs the first time; smaller runs gain nothing.
 */
export const SPREAD_MIN_TRIALS = 1_000_000

/** How long after this thread's own part a thread may take to start on its part, ms. */
export const PICKUP_GRACE_MS = 3000

/** One part of a job, as posted to a trial thread (`trial-worker.ts`). */
export interface TrialRequest {
  job: TrialJob
  /** Trials [from, to) of the job. */
  from: number
  to: number
  /** Float64 arrays of job.trials values each (this part writes its range). */
  err: SharedArrayBuffer
  errCal: SharedArrayBuffer
  /** Int32 words: [0] events (a part taken or finished), [1 + part] 0 posted, 3 taken, 1 done, 2 failed. */
  status: SharedArrayBuffer
  part: number
}

/** The status word of a part that finished. */
export const PART_DONE = 1
/** The status word of a part that threw (the main thread runs it itself). */
export const PART_FAILED = 2
/** The status word of a part a thread has started on. */
export const PART_TAKEN = 3

export interface TrialThreads {
  spread: TrialSpread
  /** Stops the threads. */
  close: () => Promise<void>
  /** Worker threads started so far (0 until a large run). */
  started: () => number
  /** Parts run so far: by the worker threads, and in this thread (its own share and any part a thread did not finish). */
  parts: () => {threads: number; here: number}
  /** Why the runs stay in this thread from now on (a part not taken or not finished), or null. */
  stopped: () => string | null
}

/** Options for the tests: another worker script, a shorter grace. */
export interface TrialThreadOptions {
  workerUrl?: URL
  pickupGraceMs?: number
}

/**
 * Trial threads for `threads` cores in all (this one included); `minTrials` the smallest run
 * that is spread (the tests lower it).
 */
export function trialThreads(threads: number, minTrials = SPREAD_MIN_TRIALS, options: TrialThreadOptions = {}): TrialThreads {
  const workers: Worker[] = []
  const parts = {threads: 0, here: 0}
  const grace = options.pickupGraceMs ?? PICKUP_GRACE_MS
  let stopped: string | null = null
  const spread: TrialSpread = (job: TrialJob, err: Float64Array, errCal: Float64Array): boolean => {
    const n = job.trials
    if (stopped !== null || threads < 2 || n < minTrials || n < threads) return false
    while (workers.length < threads - 1) {
      const w = new Worker(options.workerUrl ?? new URL('./trial-worker.js', import.meta.url))
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
    const now0 = performance.now()
    const deadline = now0 + 10 * (now0 - t0) + 10_000
    const pickupBy = now0 + grace
    // Wait until every posted part is finished, or is still untaken after the grace, or the deadline.
    for (;;) {
      // Read before the parts' words: a part taken or finished after this read changes it, so
      // the wait below returns at once instead of sleeping through that event.
      const seen = Atomics.load(status, 0)
      const now = performance.now()
      let waiting = false
      let untaken = false
      for (let k = 1; k <= posted; k++) {
        const st = Atomics.load(status, 1 + k)
        if (st === PART_DONE || st === PART_FAILED) continue
        if (st === 0) untaken = true
        if (st !== 0 || now < pickupBy) waiting = true
      }
      if (!waiting || now >= deadline) break
      // Woken by a thread taking or finishing a part; else at the grace's end or the deadline.
      Atomics.wait(status, 0, seen, (untaken && now < pickupBy ? pickupBy : deadline) - now)
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
        const st = Atomics.load(status, 1 + k)
        if (k <= posted && st !== PART_FAILED) stopped = st === 0 ? 'a trial thread did not take its part in time' : 'a trial thread did not finish its part in time'
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
    parts: () => ({...parts}),
    stopped: () => stopped
  }
}
