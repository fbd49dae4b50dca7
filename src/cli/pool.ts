/**
 * Where notes are processed: in this thread for a small batch, or on a pool of worker
 * threads (one per core by default) for a larger one. Either way a caller gets one
 * promise per note.
 */
import {availableParallelism} from 'node:os'
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

/** A worker pool of `size` threads; each note goes to the next free worker. */
export function workerPool(size: number): NoteRunner {
  const workers = Array.from({length: size}, () => new Worker(new URL('./worker.js', import.meta.url)))
  const idle = [...workers]
  const queue: {req: WorkerRequest; resolve: (o: NoteOutcome) => void}[] = []
  const pending = new Map<number, {worker: Worker; resolve: (o: NoteOutcome) => void; path: string}>()
  let next = 0
  const pump = (): void => {
    while (idle.length > 0 && queue.length > 0) {
      const w = idle.pop()!
      const job = queue.shift()!
      pending.set(job.req.id, {worker: w, resolve: job.resolve, path: job.req.path})
      w.postMessage(job.req)
    }
  }
  for (const w of workers) {
    w.on('message', (reply: WorkerReply) => {
      const p = pending.get(reply.id)
      if (!p) return
      pending.delete(reply.id)
      idle.push(w)
      p.resolve(reply.outcome)
      pump()
    })
    w.on('error', (error) => {
      for (const [id, p] of pending) {
        if (p.worker !== w) continue
        pending.delete(id)
        p.resolve(failedOutcome(p.path, `internal error in worker: ${error.message}`))
      }
    })
  }
  return {
    run: (path, opts) => new Promise((resolve) => {
      queue.push({req: {id: next++, path, opts}, resolve})
      pump()
    }),
    close: async () => {
      await Promise.all(workers.map((w) => w.terminate()))
    },
    size
  }
}

/** The runner for `count` notes: in this thread for small or check-only batches, else a pool. */
export function runnerFor(count: number, jobs: number | null, res: Resources, building: boolean): NoteRunner {
  const size = Math.min(jobs ?? availableParallelism(), count)
  // Evaluating without writing takes milliseconds a note: a worker's start-up would cost more.
  return size <= 1 || (jobs === null && (count <= 2 || !building)) ? inThread(res) : workerPool(size)
}
