/**
 * The Monte Carlo part of the benchmark (DESIGN §8.7; `bench.mjs` section b): the trial loop
 * on one core (target ≥ 5 M trials/s), the same on every core (worker threads, each a
 * disjoint range of trials — trial i depends only on (seed, i), so the joined errors must
 * equal the one-thread run byte for byte), and what a 100k-trial default adds to a stage's
 * evaluation (the whole run: trials, sort, histogram, variance shares; target < 0.1 s).
 *
 * Standalone: `node test/bench/yield-bench.mjs [--quick]` (after `npm run build`) prints its rows.
 */
import {createHash} from 'node:crypto'
import {availableParallelism} from 'node:os'
import {join, resolve} from 'node:path'
import {pathToFileURL} from 'node:url'
import {Worker} from 'node:worker_threads'
import {benchStage} from './bench-stage.mjs'

const digest = (a) => createHash('sha256').update(new Uint8Array(a.buffer, a.byteOffset, a.byteLength)).digest('hex')

// Each worker evaluates its range of trials once to warm up, then again when told, timed.
const WORKER = `
  const {parentPort, workerData} = require('node:worker_threads')
  import(workerData.engine).then(({trialBlock, yieldModel}) => {
    const m = yieldModel(workerData.input, 'uniform')
    const n = workerData.to - workerData.from
    const a = new Float64Array(n), b = new Float64Array(n)
    trialBlock(m, 1, workerData.from, Math.min(workerData.from + 100000, workerData.to), a, b)
    parentPort.postMessage({ready: true})
    parentPort.once('message', () => {
      const t = performance.now()
      trialBlock(m, 1, workerData.from, workerData.to, a, b)
      parentPort.postMessage({seconds: (performance.now() - t) / 1000, err: a}, [a.buffer])
    })
  })`

/**
 * @param {{root: string, quick: boolean, stage: object, row: (section: string, measure: string, value: string, target?: string, ok?: boolean) => void}} o
 */
export async function yieldBench({root, quick, stage, row}) {
  const engineUrl = pathToFileURL(join(root, 'dist', 'engine', 'index.js')).href
  const {runYield, trialBlock, yieldModel, evaluateStage} = await import(engineUrl)
  const input = {...stage, calibration: 'offset-and-gain', require: {'output-error': 2e-3, 'output-error-calibrated': 1e-3}}
  const model = yieldModel(input, 'uniform')
  const trials = quick ? 1_000_000 : 4_000_000
  const errA = new Float64Array(trials)
  const errB = new Float64Array(trials)
  trialBlock(model, 1, 0, 200_000, errA, errB)
  // Per core = trials per second of this thread's CPU time (process.cpuUsage: only this
  // thread is busy), which a shared, loaded machine distorts far less than the wall clock;
  // the wall-clock rate is printed beside it.
  const oneCore = []
  const wall = []
  for (let r = 0; r < (quick ? 2 : 3); r++) {
    const c = process.cpuUsage()
    const t = performance.now()
    trialBlock(model, 1, 0, trials, errA, errB)
    wall.push(trials / ((performance.now() - t) / 1000))
    const used = process.cpuUsage(c)
    oneCore.push(trials / ((used.user + used.system) / 1e6))
  }
  const perCore = Math.max(...oneCore)
  row('b', `Monte Carlo trial loop, one core (${(trials / 1e6).toFixed(0)} M trials, best of ${oneCore.length}, per CPU-second)`,
    `${(perCore / 1e6).toFixed(2)} M trials/s (wall clock ${(Math.max(...wall) / 1e6).toFixed(2)} M/s)`, '≥ 5 M/s', perCore >= 5e6)

  const oneThread = digest(errA)
  const cores = availableParallelism()
  /** The trials on `count` worker threads: the rate, and whether the joined errors equal the one-thread run's. */
  const onWorkers = async (count) => {
    const chunk = Math.ceil(trials / count)
    const workers = Array.from({length: count}, (_, k) =>
      new Worker(WORKER, {eval: true, workerData: {engine: engineUrl, input, from: k * chunk, to: Math.min(trials, (k + 1) * chunk)}}))
    await Promise.all(workers.map((w) => new Promise((ok) => w.once('message', ok))))
    const t0 = performance.now()
    const parts = await Promise.all(workers.map((w) => new Promise((ok) => { w.once('message', ok); w.postMessage('go') })))
    const rate = trials / ((performance.now() - t0) / 1000)
    for (const w of workers) await w.terminate()
    const joined = new Float64Array(trials)
    parts.forEach((p, k) => joined.set(p.err, k * chunk))
    return {rate, identical: digest(joined) === oneThread}
  }
  const all = await onWorkers(cores)
  row('b', `Monte Carlo trial loop, all ${cores} cores (worker threads)`, `${(all.rate / 1e6).toFixed(2)} M trials/s`, '—')
  const counts = [...new Set([1, 2, 4, cores])].sort((a, b) => a - b)
  const same = []
  for (const count of counts) same.push(count === cores ? all.identical : (await onWorkers(count)).identical)
  const identical = same.every(Boolean)
  row('b', `Monte Carlo errors on ${counts.join(' / ')} workers vs one thread (sha-256)`, identical ? 'identical' : 'DIFFERENT', 'identical', identical)

  // The command's own trial threads (src/cli/trials.ts): this thread takes one part and waits
  // for the others; the first run also starts the threads (timed separately).
  const {trialThreads} = await import(pathToFileURL(join(root, 'dist', 'cli', 'trials.js')).href)
  const threads = trialThreads(cores, 1)
  const job = {kind: 'stage', input, distribution: 'uniform', seed: 1, trials}
  const spreadErr = new Float64Array(trials)
  const spreadCal = new Float64Array(trials)
  let t1 = performance.now()
  threads.spread(job, spreadErr, spreadCal)
  const first = (performance.now() - t1) / 1000
  t1 = performance.now()
  threads.spread(job, spreadErr, spreadCal)
  const warm = (performance.now() - t1) / 1000
  await threads.close()
  const spreadSame = digest(spreadErr) === oneThread
  row('b', `Monte Carlo through the command's trial threads, ${cores} threads in all (${(trials / 1e6).toFixed(0)} M trials; first run incl. thread start)`,
    `${(trials / warm / 1e6).toFixed(2)} M trials/s (first run ${first.toFixed(2)} s, one thread ${(trials / Math.max(...wall)).toFixed(2)} s); errors ${spreadSame ? 'identical' : 'DIFFERENT'}`, 'identical', spreadSame)

  const dc = evaluateStage(input).dc
  const ms = []
  const cpu = []
  for (let r = 0; r < (quick ? 3 : 7); r++) {
    const c = process.cpuUsage()
    const t = performance.now()
    runYield(input, {trials: 100_000, seed: 1, distribution: 'uniform'}, dc, 1)
    ms.push(performance.now() - t)
    const used = process.cpuUsage(c)
    cpu.push((used.user + used.system) / 1e3)
  }
  const mid = (a) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)] / 1000
  row('b', `Monte Carlo, 100k-trial default added to a stage (median of ${ms.length}, CPU time)`,
    `${mid(cpu).toFixed(3)} s (wall clock ${mid(ms).toFixed(3)} s)`, '< 0.1 s', mid(cpu) < 0.1)
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const root = resolve(import.meta.dirname, '..', '..')
  const {ARCHETYPES} = await import(pathToFileURL(join(root, 'dist', 'engine', 'index.js')).href)
  // The noninverting stage of bench.mjs section b.
  const stage = benchStage(ARCHETYPES)
  const row = (_s, measure, value, target, ok) => console.log(`${measure}: ${value}  target ${target ?? ''}  ${ok === undefined ? '' : ok ? 'pass' : 'FAIL'}`)
  await yieldBench({root, quick: process.argv.includes('--quick'), stage, row})
}
