/**
 * A trial thread (`trials.ts`): runs the range of a Monte Carlo's trials it is sent, writes
 * the errors into the shared arrays and reports through the shared status words — the main
 * thread waits on them synchronously (the evaluate phase does not yield to the event loop).
 */
import {parentPort} from 'node:worker_threads'
import {runTrialJob} from '../engine/index.js'
import {PART_DONE, PART_FAILED, PART_TAKEN, type TrialRequest} from './trials.js'

const port = parentPort
if (port === null) throw new Error('trial-worker.ts runs only as a worker thread')

port.on('message', (req: TrialRequest) => {
  const status = new Int32Array(req.status)
  // Taken: the waiting thread now knows this one is alive (and waits for it up to the deadline).
  Atomics.store(status, 1 + req.part, PART_TAKEN)
  Atomics.add(status, 0, 1)
  Atomics.notify(status, 0)
  const n = req.to - req.from
  let state = PART_DONE
  try {
    runTrialJob(req.job, req.from, req.to, new Float64Array(req.err, req.from * 8, n), new Float64Array(req.errCal, req.from * 8, n))
  } catch {
    state = PART_FAILED
  }
  Atomics.store(status, 1 + req.part, state)
  Atomics.add(status, 0, 1)
  Atomics.notify(status, 0)
})
