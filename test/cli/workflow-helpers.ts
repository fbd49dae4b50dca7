/**
 * Notes and process helpers for the review-workflow tests: invented stages that build
 * quickly, and a long-running CLI child whose output can be awaited line by line.
 */
import {spawn, type ChildProcessByStdio} from 'node:child_process'
import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import type {Readable} from 'node:stream'
import {deflateSync, crc32} from 'node:zlib'
import {CLI, ROOT} from './helpers.js'

/** A non-inverting stage whose requirements are met; `rf` and the stage id can be varied. */
export const goodNote = (opts: {rf?: string; id?: string; title?: string} = {}): string => `---
title: ${opts.title ?? 'Workflow test note'}
date: 2026-11-30
---

# A stage

\`\`\`stage ${opts.id ?? 'amp'}
topology: noninverting
opamp: precision-bipolar
rf: ${opts.rf ?? '9.09k'} 0.1%
rg: 1k 0.1%
input: -0.1 .. 0.1 V
supply: ±12 V
temperature: 25 °C
band: 0.1 .. 100 Hz
require:
  phase-margin: 45 deg
\`\`\`
`

/** The same stage with a noise requirement it cannot meet (exit 1). */
export const unmetNote = (): string => goodNote().replace('phase-margin: 45 deg', 'noise-rms: 1 nV')

/** A note that cannot be evaluated (exit 2): an unknown key and a reversed range. */
export const BAD_NOTE = `# Broken

\`\`\`stage broken
topology: noninverting
opamp: precision-bipolar
rf: 9.09k
rg: 1k
rff: 10k
input: -0.1 .. 0.1 V
supply: ±12 V
temperature: 85 .. -40 °C
\`\`\`
`

/** A valid PNG of w × h grey pixels of the given shade. */
export function png(w: number, h: number, shade: number): Uint8Array {
  const chunk = (type: string, data: Buffer): Buffer => {
    const len = Buffer.alloc(4)
    len.writeUInt32BE(data.length)
    const td = Buffer.concat([Buffer.from(type, 'ascii'), data])
    const crc = Buffer.alloc(4)
    crc.writeUInt32BE(crc32(td))
    return Buffer.concat([len, td, crc])
  }
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(w, 0)
  ihdr.writeUInt32BE(h, 4)
  ihdr[8] = 8 // bit depth
  ihdr[9] = 0 // greyscale
  const rows = Buffer.alloc((w + 1) * h, shade)
  for (let y = 0; y < h; y++) rows[y * (w + 1)] = 0 // filter type none
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(rows)), chunk('IEND', Buffer.alloc(0))])
}

/** Files under `dir` (recursively) whose names end in `.tmp`. */
export const tmpFiles = (dir: string): string[] =>
  readdirSync(dir, {recursive: true, encoding: 'utf8'}).filter((f) => f.endsWith('.tmp'))

/** A CLI child process whose stdout and stderr are collected and can be awaited. */
export class CliChild {
  readonly child: ChildProcessByStdio<null, Readable, Readable>
  stdout = ''
  stderr = ''
  readonly exited: Promise<{code: number | null; signal: NodeJS.Signals | null}>
  private waiters: (() => void)[] = []
  private closed = false

  constructor(args: string[], opts: {cwd?: string; env?: Record<string, string>} = {}) {
    this.child = spawn(process.execPath, [CLI, ...args], {
      cwd: opts.cwd ?? ROOT, env: {...process.env, ...opts.env}, stdio: ['ignore', 'pipe', 'pipe']
    })
    this.child.stdout.setEncoding('utf8').on('data', (s: string) => { this.stdout += s; this.wake() })
    this.child.stderr.setEncoding('utf8').on('data', (s: string) => { this.stderr += s; this.wake() })
    // 'close' comes after the last output has been read, unlike 'exit'.
    this.exited = new Promise((resolve) => this.child.on('close', (code, signal) => { this.closed = true; resolve({code, signal}); this.wake() }))
  }

  private wake(): void {
    for (const w of this.waiters.splice(0)) w()
  }

  /**
   * Resolves when `test` holds of the output so far; rejects after `limitMs` (a bound on
   * a hang, not a speed check) or when the process exits first.
   */
  until(test: (c: CliChild) => boolean, what: string, limitMs = 40_000): Promise<void> {
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`gave up waiting for ${what}\nstdout: ${this.stdout}\nstderr: ${this.stderr}`)), limitMs)
      const check = (): void => {
        if (test(this)) { clearTimeout(timer); resolve(); return }
        if (this.closed) {
          clearTimeout(timer)
          reject(new Error(`process exited before ${what}\nstdout: ${this.stdout}\nstderr: ${this.stderr}`))
          return
        }
        this.waiters.push(check)
      }
      check()
    })
  }

  /** Lines of stdout matching `re`. */
  linesOut(re: RegExp): string[] {
    return this.stdout.split('\n').filter((l) => re.test(l))
  }

  kill(signal: NodeJS.Signals = 'SIGTERM'): void {
    if (!this.closed) this.child.kill(signal)
  }
}

export {join}
