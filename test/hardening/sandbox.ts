/**
 * A worker thread that runs fuzz inputs (see fuzz-worker.mjs). One call at a time; when a
 * call is abandoned (fast-check's `timeout` gave up on it because the input hangs), the
 * next call replaces the stuck worker with a fresh one, so a hang fails one run and
 * shrinking can go on.
 */
import {Worker} from 'node:worker_threads'
import {join} from 'node:path'
import type {Dimension} from '../../src/units/index.js'

export type FuzzKind = 'quantity' | 'range' | 'supply' | 'resistor' | 'note'

export interface FuzzCall {
  kind: FuzzKind
  text: string
  /** For 'quantity' and 'range'. (optional) */
  dim?: Dimension
}

interface Pending {
  id: number
  resolve: (problems: string[]) => void
  reject: (error: Error) => void
}

const WORKER = join(import.meta.dirname, 'fuzz-worker.mjs')

export class Sandbox {
  private worker: Worker | null = null
  private pending: Pending | null = null
  private nextId = 0

  private start(): Worker {
    const w = new Worker(WORKER)
    w.on('message', (reply: {id: number; problems: string[]}) => {
      const p = this.pending
      if (p === null || p.id !== reply.id) return
      this.pending = null
      p.resolve(reply.problems)
    })
    w.on('error', (error) => {
      const p = this.pending
      this.pending = null
      this.worker = null
      p?.reject(error)
    })
    return w
  }

  /** The invariant violations of one input (empty when it behaved). */
  async run(call: FuzzCall): Promise<string[]> {
    if (this.pending !== null) {
      // The previous call never answered: its worker is stuck on that input.
      this.pending = null
      await this.worker?.terminate()
      this.worker = null
    }
    this.worker ??= this.start()
    const id = this.nextId++
    return new Promise<string[]>((resolve, reject) => {
      this.pending = {id, resolve, reject}
      this.worker?.postMessage({id, ...call})
    })
  }

  async close(): Promise<void> {
    this.pending = null
    await this.worker?.terminate()
    this.worker = null
  }
}
