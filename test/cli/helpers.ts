/**
 * Run the compiled CLI (dist/, built once per run by test/global-setup.ts) and make
 * throw-away folders of notes. `runCli` runs the command in this process (a worker thread
 * that keeps dist/cli loaded) unless the run needs a process of its own — another working
 * directory or environment, or `child: true`; `runCliProcess` always starts the real
 * executable (dist/bin/index.js) as a user would. AMPREVIEW_TEST_CHILD=1 sends every run
 * to a child process (the whole suite through the real executable, and the A/B of the two).
 */
import {spawnSync} from 'node:child_process'
import {MessageChannel, receiveMessageOnPort, Worker} from 'node:worker_threads'
import {mkdtempSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join, resolve} from 'node:path'

export const ROOT = resolve(import.meta.dirname, '..', '..')
export const CLI = join(ROOT, 'dist', 'bin', 'index.js')

export interface CliRun {
  status: number | null
  stdout: string
  stderr: string
}

export interface CliRunOptions {
  cwd?: string
  env?: Record<string, string>
  /** Start the executable in a child process even when in-process would do. */
  child?: boolean
}

/** The command in a child process: `node dist/bin/index.js …`, the bundled executable. */
export function runCliProcess(args: string[], opts: CliRunOptions = {}): CliRun {
  const r = spawnSync(process.execPath, [CLI, ...args], {
    cwd: opts.cwd ?? ROOT,
    env: {...process.env, ...opts.env},
    encoding: 'utf8'
  })
  return {status: r.status, stdout: r.stdout, stderr: r.stderr}
}

let worker: Worker | null = null

/**
 * The command, synchronously, as in a child process but without starting one: `main` of
 * dist/cli runs in a worker thread while this thread waits. The environment it sees is
 * this process's, as a child's would be; the working directory is this process's.
 */
export function runCliInProcess(args: string[]): CliRun {
  if (worker === null) {
    worker = new Worker(new URL('./in-process-worker.mjs', import.meta.url))
    worker.unref()
    // A worker that died (it should not: main catches its errors) is replaced on the next run.
    worker.on('error', () => { worker = null })
  }
  const signal = new Int32Array(new SharedArrayBuffer(4))
  const {port1, port2} = new MessageChannel()
  worker.postMessage({args, env: {...process.env}, port: port2, signal}, [port2])
  if (Atomics.wait(signal, 0, 0, 300_000) === 'timed-out') throw new Error(`in-process run of ampreview ${args.join(' ')} did not finish in 300 s`)
  const reply = receiveMessageOnPort(port1)
  port1.close()
  if (reply === undefined) throw new Error(`in-process run of ampreview ${args.join(' ')} gave no answer`)
  return reply.message as CliRun
}

/**
 * Run the command: in-process when it can be (same working directory as this process, no
 * extra environment), in a child process otherwise.
 */
export function runCli(args: string[], opts: CliRunOptions = {}): CliRun {
  const inProcess = opts.child !== true && process.env['AMPREVIEW_TEST_CHILD'] !== '1' && opts.env === undefined && resolve(opts.cwd ?? ROOT) === process.cwd()
  return inProcess ? runCliInProcess(args) : runCliProcess(args, opts)
}

/** A fresh temporary folder with the given files written into it. */
export function tempNotes(files: Record<string, string | Uint8Array>): string {
  const dir = mkdtempSync(join(tmpdir(), 'ampreview-test-'))
  for (const [name, content] of Object.entries(files)) writeFileSync(join(dir, name), content)
  return dir
}

/** A noninverting gain-11 note with 0.1 % resistors and an output-error requirement; `extra` lines go before `require`. */
export const ampNote = (extra = ''): string => `# Amp

\`\`\`stage amp
topology: noninverting
opamp: precision-bipolar
rf: 10k 0.1% 25ppm/K
rg: 1k 0.1% 25ppm/K
input: -0.1 .. 0.1 V
supply: ±15 V
temperature: 0 .. 50 °C
${extra}require:
  output-error: 2 mV
\`\`\`
`
