/**
 * The trial threads (src/cli/trials.ts, run from dist/ as the command runs them): a Monte
 * Carlo's trials split over this thread and worker threads give the same bytes as one thread
 * (DESIGN §8.7: trial i depends only on (seed, i)), for a stage and for a chain; small runs
 * and one-thread settings stay here; and through the command, a note's JSON does not depend
 * on `--jobs`.
 */
import {createHash} from 'node:crypto'
import {mkdtempSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {pathToFileURL} from 'node:url'
import {join} from 'node:path'
import {afterAll, describe, expect, it} from 'vitest'
import type {TrialJob} from '../../src/engine/index.js'
import {ampNote, runCli, tempNotes} from './helpers.js'
import {res, stageFrom} from '../support/stage-input.js'

type Threads = {
  spread: (job: TrialJob, err: Float64Array, errCal: Float64Array) => boolean; close: () => Promise<void>; started: () => number
  parts: () => {threads: number; here: number}; stopped: () => string | null
}
const dist = new URL('../../dist/', import.meta.url)
const {trialThreads} = (await import(new URL('cli/trials.js', dist).href)) as {
  trialThreads: (threads: number, minTrials?: number, options?: {workerUrl?: URL; pickupGraceMs?: number}) => Threads
}
const {runTrialJob} = (await import(new URL('engine/index.js', dist).href)) as {runTrialJob: (job: TrialJob, from: number, to: number, err: Float64Array, errCal: Float64Array) => void}

const digest = (a: Float64Array): string => createHash('sha256').update(new Uint8Array(a.buffer, a.byteOffset, a.byteLength)).digest('hex')
const oneThread = (job: TrialJob): [string, string] => {
  const err = new Float64Array(job.trials)
  const errCal = new Float64Array(job.trials)
  runTrialJob(job, 0, job.trials, err, errCal)
  return [digest(err), digest(errCal)]
}

const stage = stageFrom('engine', {rcomp: res(470, 0.01), rs: res(500, 0.01), calibration: 'offset'})
const stageJob: TrialJob = {kind: 'stage', input: stage, distribution: 'normal', seed: 5, trials: 30_001}
const second = stageFrom('engine', {id: 'second', rf: res(20e3, 0.001), rg: res(10e3, 0.001)})
const chainJob: TrialJob = {
  kind: 'chain', distribution: 'uniform', seed: 9, trials: 20_003,
  chain: {id: 'c', title: 'c', stages: [stage.id, 'second'], adc: null, temperature: [0, 50], band: [0.1, 10], calibration: 'none', require: {}, yield: {trials: 20_003, seed: 9, distribution: 'uniform'}},
  stages: [{input: stage, gain: 11}, {input: second, gain: 3}]
}

const opened: Threads[] = []
const threadsOf = (n: number, min?: number, options?: {workerUrl?: URL; pickupGraceMs?: number}): Threads => {
  const t = trialThreads(n, min, options)
  opened.push(t)
  return t
}
afterAll(async () => {
  for (const t of opened) await t.close()
})

describe('trial threads', () => {
  for (const count of [2, 3, 4]) {
    it(`${count} threads: a stage's and a chain's errors equal one thread's, byte for byte`, () => {
      const t = threadsOf(count, 1000)
      for (const job of [stageJob, chainJob]) {
        const err = new Float64Array(job.trials)
        const errCal = new Float64Array(job.trials)
        expect(t.spread(job, err, errCal)).toBe(true)
        expect([digest(err), digest(errCal)]).toEqual(oneThread(job))
      }
      expect(t.started()).toBe(count - 1)
      // Each job: one part here, the others on the threads.
      expect(t.parts()).toEqual({threads: 2 * (count - 1), here: 2})
    })
  }
  it('a run below the smallest spread size, or one thread in all, stays in this thread (false, no thread started)', () => {
    const small = threadsOf(4)
    expect(small.spread(stageJob, new Float64Array(stageJob.trials), new Float64Array(stageJob.trials))).toBe(false)
    const one = threadsOf(1, 10)
    expect(one.spread(stageJob, new Float64Array(stageJob.trials), new Float64Array(stageJob.trials))).toBe(false)
    expect(small.started() + one.started()).toBe(0)
  })
  it('a job that cannot be posted to a thread (not plain data) is run here in full: the same bytes', () => {
    const t = threadsOf(3, 10)
    const job = {...stageJob, input: {...stage, note: () => 'a function cannot be cloned'}} as TrialJob
    const err = new Float64Array(job.trials)
    const errCal = new Float64Array(job.trials)
    expect(t.spread(job, err, errCal)).toBe(true)
    expect([digest(err), digest(errCal)]).toEqual(oneThread(stageJob))
    expect(t.parts()).toEqual({threads: 0, here: 3})
  })
  it('a job that cannot be run throws here as it does on one thread, and the threads stay usable', () => {
    // A chain whose model cannot be built throws in runTrialJob everywhere, this thread's own part included.
    const t = threadsOf(2, 10)
    const bad: TrialJob = {...chainJob, stages: []}
    expect(() => t.spread(bad, new Float64Array(bad.trials), new Float64Array(bad.trials))).toThrow()
    // The threads are still usable afterwards.
    const err = new Float64Array(stageJob.trials)
    const errCal = new Float64Array(stageJob.trials)
    expect(t.spread(stageJob, err, errCal)).toBe(true)
    expect([digest(err), digest(errCal)]).toEqual(oneThread(stageJob))
    // The bad job's thread part failed and ran here (and threw); the good one's ran on the thread.
    expect(t.parts().threads).toBe(1)
    expect(t.stopped()).toBeNull()
  })
  it('a thread that never takes its part (a worker script that loads and does nothing): run here after the grace, later runs stay here', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ampreview-idle-worker-'))
    const idle = join(dir, 'idle.mjs')
    writeFileSync(idle, '// takes no part\n')
    const t = threadsOf(3, 10, {workerUrl: pathToFileURL(idle), pickupGraceMs: 300})
    const err = new Float64Array(stageJob.trials)
    const errCal = new Float64Array(stageJob.trials)
    const t0 = performance.now()
    expect(t.spread(stageJob, err, errCal)).toBe(true)
    // The grace (0.3 s), not the deadline (10 s and more), bounds the wait.
    expect(performance.now() - t0).toBeLessThan(5000)
    expect([digest(err), digest(errCal)]).toEqual(oneThread(stageJob))
    expect(t.parts()).toEqual({threads: 0, here: 3})
    expect(t.stopped()).toBe('a trial thread did not take its part in time')
    expect(t.spread(stageJob, err, errCal)).toBe(false)
  })
})

describe('through the command', () => {
  it('a note with a 1.2 M-trial Monte Carlo gives the same JSON with --jobs 1 and --jobs 2 (and --debug says a part ran on the thread)', () => {
    const dir = tempNotes({'big.md': ampNote('yield: { trials: 1.2M, seed: 4 }\n')})
    const one = runCli(['check', join(dir, 'big.md'), '--json', '--jobs', '1', '--debug'])
    const two = runCli(['check', join(dir, 'big.md'), '--json', '--jobs', '2', '--debug'])
    expect(one.status).toBe(two.status)
    // One run stays here with one job; with two, one part ran on the trial thread.
    expect(one.stderr).not.toContain('Monte Carlo trial parts')
    expect(two.stderr).toContain('Monte Carlo trial parts: 1 on trial threads, 1 in the main thread')
    expect(JSON.parse(one.stdout).files[0].stages[0].yield.trials).toBe(1_200_000)
    expect(two.stdout).toBe(one.stdout)
  })
})
