/**
 * Where notes are processed: in this thread for a small batch, or on a pool of worker
 * threads (one per free core by default, see `freeCores`) for a larger one. Either way a caller gets one
 * promise per note.
 */
import {availableParallelism, loadavg} from 'node:os'
import {Worker} from 'node:worker_threads'
import {failedOutcome, processNote, type NoteOutcome, type Resources, type RunOptions} from './pipeline.js'
import type {WorkerReply, WorkerRequest} from './worker.js'

export interface NoteRunner {
  run(path: string, opts: RunOptions): Promise<NoteOutcome>
  close(): Promise<void>
  /** Notes it can work on at once. */
  size: number
}

/** Runs notes in this thread, sharing the already-loaded resources. */
export const inThread = (res: Resources): NoteRunner => ({
  run: (path, opts) => processNote(path, res, opts),
  close: async () => undefined,
  size: 1
})

/**
 * A worker pool of up to `size` threads; each note goes to the next free worker. Threads
 * start on the first note that needs one (a batch whose notes are all up to date starts
 * none). A thread that dies fails its note and is replaced, so the batch goes on.
 */
export function workerPool(size: number): NoteRunner {
  type Job = {req: WorkerRequest; resolve: (o: NoteOutcome) => void}
  const workers = new Set<Worker>()
  const idle: Worker[] = []
  const queue: Job[] = []
  const busy = new Map<Worker, Job>()
  let next = 0
  let closing = false
  const finish = (w: Worker, outcome: NoteOutcome): void => {
    const job = busy.get(w)
    if (!job) return
    busy.delete(w)
    job.resolve(outcome)
  }
  const spawn = (): void => {
    const w = new Worker(new URL('./worker.js', import.meta.url))
    workers.add(w)
    idle.push(w)
    w.on('message', (reply: WorkerReply) => {
      if (busy.get(w)?.req.id !== reply.id) return
      finish(w, reply.outcome)
      idle.push(w)
      pump()
    })
    const lost = (why: string): void => {
      if (!workers.delete(w)) return
      const i = idle.indexOf(w)
      if (i >= 0) idle.splice(i, 1)
      const job = busy.get(w)
      if (job) finish(w, failedOutcome(job.req.path, `internal error in worker: ${why}`))
      if (!closing) pump()
    }
    w.on('error', (error) => lost(error.message))
    w.on('exit', (code) => lost(`the thread stopped (exit code ${code})`))
  }
  const pump = (): void => {
    while (queue.length > idle.length && workers.size < size) spawn()
    while (idle.length > 0 && queue.length > 0) {
      const w = idle.pop()!
      const job = queue.shift()!
      busy.set(w, job)
      w.postMessage(job.req)
    }
  }
  return {
    run: (path, opts) => new Promise((resolve) => {
      queue.push({req: {id: next++, path, opts}, resolve})
      pump()
    }),
    close: async () => {
      closing = true
      for (const job of queue.splice(0)) job.resolve(failedOutcome(job.req.path, 'not processed: the worker pool was closed'))
      await Promise.all([...workers].map((w) => w.terminate()))
    },
    size
  }
}

/**
 * Threads worth starting by default: the cores not already busy (one-minute load average;
 * 0 where the system reports none), at least one. A worker costs a load of the modules
 * (about 0.5 s of CPU), which pays only when a core is free to run it; on a busy machine the
 * notes run faster in this thread. `--jobs N` overrides it. The outputs do not depend on it.
 */
export const freeCores = (cores = availableParallelism(), load = loadavg()[0] ?? 0): number =>
  Math.max(1, Math.min(cores, Math.round(cores - load)))

/** The runner for `count` notes: in this thread for small or check-only batches, else a pool. */
export function runnerFor(count: number, jobs: number | null, res: Resources, building: boolean): NoteRunner {
  const size = Math.min(jobs ?? freeCores(), count)
  // Evaluating without writing takes milliseconds a note: a worker's start-up would cost more.
  return size <= 1 || (jobs === null && (count <= 2 || !building)) ? inThread(res) : workerPool(size)
}
