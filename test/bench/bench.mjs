/**
 * Workflow benchmark, one run, a plain table at the end (`npm run bench` builds dist/ first):
 *
 *   (a) side by side in rounds (each a child process, median of 5): the floor — Node start
 *       plus minimal pdfkit documents with the same DejaVu fonts and page counts as the
 *       sample reports — against a cold `build` of sample-designs/, and `node -e 0` against
 *       a cold `check`; each ratio with its target and pass/FAIL; and a module-load trace of
 *       `check` (it must load no pdfkit, fontkit or vega and read no font);
 *   (b) stage evaluations per second, in this process, on sample-like inputs, and a chain
 *       of four stages into a converter (target: under 2 ms on one core); the Monte Carlo's
 *       trials per second on one core and on all cores, and what a 100k run adds;
 *   (c) notes of 50, 200 and 1,000 stages built with --format json (the 50-stage one also
 *       as PDF): time and growth per stage;
 *   (d) a no-op rebuild of 100 cached notes;
 *   (e) `build --watch`: from writing a note to its rebuilt PDF (median of 5 saves);
 *   (f) hostile text: long words and a 600 KB table cell built, nesting bombs refused by
 *       `check` — time per MB.
 *
 * Everything is written under one temporary folder, removed at the end; sample-designs/ is
 * only read. Usage: `node test/bench/bench.mjs [--quick] [--chain]` (--quick: fewer repetitions, no
 * 1,000-stage note; --chain: only the chain rows of (b), for a quick look).
 */
import {spawn} from 'node:child_process'
import {copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync} from 'node:fs'
import {availableParallelism, loadavg, tmpdir} from 'node:os'
import {join, resolve} from 'node:path'
import {pathToFileURL} from 'node:url'
import {benchStage, res} from './bench-stage.mjs'

const ROOT = resolve(import.meta.dirname, '..', '..')
const CLI = join(ROOT, 'dist', 'bin', 'index.js')
const SAMPLES = join(ROOT, 'sample-designs')
const QUICK = process.argv.includes('--quick')
const CHAIN_ONLY = process.argv.includes('--chain')
const REPEAT = QUICK ? 3 : 5
const TMP = mkdtempSync(join(tmpdir(), 'ampreview-bench-'))
const started = performance.now()
const loadAtStart = loadavg()[0]?.toFixed(1) ?? '?'

// ---------------------------------------------------------------------------------------
// Helpers

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b)
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2
}

/** Run node with `args` as a child; resolves with the wall time (s) and its output. */
function runNode(args, {cwd = ROOT, okCodes = [0, 1]} = {}) {
  return new Promise((resolvePromise, reject) => {
    const t0 = performance.now()
    const child = spawn(process.execPath, args, {cwd, stdio: ['ignore', 'pipe', 'pipe']})
    let stdout = ''
    let stderr = ''
    child.stdout.setEncoding('utf8').on('data', (s) => { stdout += s })
    child.stderr.setEncoding('utf8').on('data', (s) => { stderr += s })
    child.on('close', (code) => {
      const seconds = (performance.now() - t0) / 1000
      if (!okCodes.includes(code)) reject(new Error(`node ${args.join(' ')} exited ${code}\n${stderr.slice(-2000)}`))
      else resolvePromise({seconds, stdout, stderr, code})
    })
  })
}

const cli = (args, opts) => runNode([CLI, ...args], opts)

async function medianOf(n, fn) {
  const times = []
  for (let i = 0; i < n; i++) times.push((await fn(i)).seconds)
  return median(times)
}

const progress = (s) => process.stderr.write(`bench: ${s}\n`)

/** Pages of a PDF written by pdfkit (page objects are never in object streams there). */
const pageCount = (pdf) => (pdf.toString('latin1').match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length

// ---------------------------------------------------------------------------------------
// Sample-like stages, one per topology (the samples' archetypes and values).

const STAGE_BLOCKS = [
  (i) => `\`\`\`stage s${i}
title: Bridge amplifier ${i}
topology: noninverting
opamp: precision-bipolar
rf: ${(49.9 + (i % 7)).toFixed(1)}k 0.1% 25ppm/K
rg: 499 0.1% 25ppm/K
rs: 350
cstray: 2 pF
input: -10m .. 10m V
supply: ±15 V
temperature: 0 .. 50 °C
band: 0.1 .. 10 Hz
require:
  output-error: 15 mV
  phase-margin: 50 deg
\`\`\``,
  (i) => `\`\`\`stage s${i}
title: Inverting stage ${i}
topology: inverting
opamp: precision-bipolar
rf: ${10 + (i % 5)}k 0.1% 25ppm/K
rg: 1k 0.1% 25ppm/K
input: -0.5 .. 0.5 V
supply: ±12 V
band: 0.1 .. 1k Hz
require:
  output-error: 5 mV
  noise-rms: 50 uV
\`\`\``,
  (i) => `\`\`\`stage s${i}
title: Reference follower ${i}
topology: follower
opamp: precision-cmos
rs: 10k 1%
cstray: ${4 + (i % 5)}p
input: 2.499 .. 2.501 V
supply: 0 .. 5 V
temperature: 0 .. 70 °C
band: 0.1 .. 10 Hz
require:
  output-error: 150 uV
  phase-margin: 45 deg
\`\`\``,
  (i) => `\`\`\`stage s${i}
title: Photodiode receiver ${i}
topology: transimpedance
opamp: precision-jfet
rf: ${1 + (i % 3)}M 0.5% 50ppm/K
cf: 2.2p
csource: 20p
input: 0 .. 1u A
supply: ±5 V
band: 1 .. 10k Hz
require:
  noise-rms: 100 uV
  phase-margin: 45 deg
\`\`\``
]

const noteOf = (stages, title) => `---
title: ${title}
date: 2026-11-30
---

# Stages

${Array.from({length: stages}, (_v, i) => `## Stage ${i + 1}\n\n${STAGE_BLOCKS[i % 4](i)}\n`).join('\n')}`

/** Print the table of every row so far (and remove the temporary folder). */
function printTable() {
  rmSync(TMP, {recursive: true, force: true})
  const cpu = (() => {
    try {
      return /^model name\s*:\s*(.*)$/m.exec(readFileSync('/proc/cpuinfo', 'utf8'))?.[1] ?? 'unknown'
    } catch {
      return 'unknown'
    }
  })()
  const header = {section: '', measure: 'measure', value: 'value', target: 'target', verdict: 'verdict', load: 'load'}
  const cols = ['section', 'measure', 'value', 'target', 'verdict', 'load']
  const widths = cols.map((c) => Math.max(...[header, ...rows].map((r) => String(r[c]).length)))
  const line = (r) => cols.map((c, i) => String(r[c]).padEnd(widths[i])).join('  ').trimEnd()
  console.log(`ampreview bench — ${availableParallelism()} cores, ${cpu}, node ${process.version}${QUICK ? ', --quick' : ''}${CHAIN_ONLY ? ', --chain' : ''}; load: one-minute load average when each figure was taken (${loadAtStart} at the start)`)
  console.log(line(header))
  console.log(widths.map((w) => '-'.repeat(w)).join('  '))
  for (const r of rows) console.log(line(r))
  console.log(`(bench took ${((performance.now() - started) / 1000).toFixed(0)} s)`)
}

/**
 * (b2) Measurement chains of four stages into a converter (DESIGN §8.6), in this process (one
 * core): the cascade alone (each stage evaluated once beforehand), and the whole chain with
 * its four stage evaluations — for four op-amp stages, and for instrumentation → inverting
 * with cf → Sallen–Key → multiple feedback.
 */
async function chainBench() {
  progress('chain evaluations')
  const {ARCHETYPES, INA_ARCHETYPES, inaAsOpamp, evaluateStage, evaluateChain, stageSpectrum, ADC_ARCHETYPES} = await import(join(ROOT, 'dist', 'engine', 'index.js'))
  const cap = (value, tolerance = 0.05) => ({value, tolerance})
  const base = benchStage(ARCHETYPES)
  const ina = INA_ARCHETYPES['precision-ina']
  const chains = {
    'op-amp stages': [
      {...base, id: 's1'},
      {...base, id: 's2', topology: 'inverting', rf: res(10e3), rg: res(10e3), rs: null, cf: 100e-9, input: [-1, 1]},
      {...base, id: 's3', rf: res(1e3), rg: res(1e3), rs: null, input: [-1, 1]},
      {...base, id: 's4', topology: 'follower', rf: null, rg: null, rs: null, input: [-2, 2]}
    ],
    'instrumentation → inverting → Sallen–Key → MFB': [
      {...base, id: 't1', topology: 'instrumentation', ina, opamp: inaAsOpamp(ina), rf: null, rg: res(499, 0.001, 10e-6), rs: res(175, 0, 0), inputCm: [2.5, 2.5]},
      {...base, id: 't2', topology: 'inverting', rf: res(10e3), rg: res(10e3), rs: null, cf: 10e-9, input: [-1, 1]},
      {...base, id: 't3', topology: 'lowpass-sallen-key', rf: null, rg: null, rs: null, r1: res(10e3), r2: res(10e3), c1: cap(220e-9), c2: cap(100e-9), input: [-1, 1]},
      {...base, id: 't4', topology: 'lowpass-mfb', opamp: ARCHETYPES['precision-cmos'], rf: null, rg: null, rs: null,
        r1: res(10e3), r2: res(20e3), r3: res(10e3), c1: cap(10e-9), c2: cap(470e-9), input: [-1, 1], supply: [-5, 5]}
    ]
  }
  const viewsOf = (evaluated) => evaluated.map(({input, result}) => ({
    id: input.id, gain: result.gain, contributors: result.dc.contributors, calibrated: null, outputSpan: result.swing.outputSpan,
    inputSpan: input.input, bandwidth: result.stability.bandwidth, spectrum: stageSpectrum(input)
  }))
  const CHAINS = QUICK ? 200 : 1000
  for (const [name, stages] of Object.entries(chains)) {
    const chainInput = {id: 'bench-chain', title: 'bench', stages: stages.map((s) => s.id), adc: ADC_ARCHETYPES['delta-sigma-24'],
      temperature: [0, 50], band: [0.1, 10], calibration: 'none', require: {'noise-free-bits': 16}}
    const wholeChain = () => evaluateChain(chainInput, viewsOf(stages.map((input) => ({input, result: evaluateStage(input)}))))
    const evaluatedOnce = stages.map((input) => ({input, result: evaluateStage(input)}))
    for (let i = 0; i < 50; i++) wholeChain()
    let t0 = performance.now()
    for (let i = 0; i < CHAINS; i++) evaluateChain(chainInput, viewsOf(evaluatedOnce))
    const cascadeMs = (performance.now() - t0) / CHAINS
    t0 = performance.now()
    for (let i = 0; i < CHAINS; i++) wholeChain()
    const chainMs = (performance.now() - t0) / CHAINS
    row('b', `chain of 4 ${name} + converter, cascade only (${CHAINS} runs)`, `${cascadeMs.toFixed(3)} ms`, '—')
    row('b', `chain of 4 ${name} + converter, with its 4 stage evaluations (${CHAINS} runs)`, `${chainMs.toFixed(3)} ms`, '< 2 ms', chainMs < 2)
  }
}


// ---------------------------------------------------------------------------------------
// (a) Floor, cold build, cold check

const rows = []
// Each figure with the one-minute load average when it was taken: the machine may be shared.
const load = () => loadavg()[0]?.toFixed(1) ?? '?'
const row = (section, measure, value, target, ok, loadText = load()) =>
  rows.push({section, measure, value, target: target ?? '', verdict: ok === undefined ? '' : ok ? 'pass' : 'FAIL', load: loadText})

// `--chain`: only the chain rows, for a quick look on a busy machine.
if (CHAIN_ONLY) {
  await chainBench()
  printTable()
  process.exit(0)
}

// Rounds side by side: in each round the floor, the build, `node -e 0` and the check run
// one after the other, so that load from other work falls on both sides of each ratio.
const outSamples = join(TMP, 'samples')
progress('first build of the samples (page counts for the floor)')
await cli(['build', SAMPLES, '--force', '--out', outSamples, '--quiet'])
const samplePdfs = readdirSync(outSamples).filter((f) => f.endsWith('.pdf')).sort()
const pages = samplePdfs.map((f) => pageCount(readFileSync(join(outSamples, f))))

const floorScript = join(TMP, 'floor.mjs')
writeFileSync(floorScript, `
import {createRequire} from 'node:module'
import {createWriteStream, readFileSync} from 'node:fs'
import {dirname, join} from 'node:path'
const require = createRequire(${JSON.stringify(join(ROOT, 'package.json'))})
const PDFDocument = require('pdfkit')
const fontDir = join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf')
const faces = ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf', 'DejaVuSans-Oblique.ttf', 'DejaVuSans-BoldOblique.ttf', 'DejaVuSansMono.ttf', 'DejaVuSansMono-Bold.ttf']
const fonts = faces.map((f) => readFileSync(join(fontDir, f)))
const pages = ${JSON.stringify(pages)}
await Promise.all(pages.map((n, d) => new Promise((done) => {
  const doc = new PDFDocument({autoFirstPage: false, info: {CreationDate: new Date(Date.UTC(2000, 0, 1))}})
  doc.pipe(createWriteStream(join(${JSON.stringify(TMP)}, 'floor-' + d + '.pdf'))).on('finish', done)
  fonts.forEach((f, k) => doc.registerFont('f' + k, f))
  for (let p = 0; p < n; p++) {
    doc.addPage({size: 'A4'})
    fonts.forEach((_f, k) => doc.font('f' + k).fontSize(10).text('Page ' + (p + 1) + ' — 0.1 Hz … 10 kHz, ±15 V, µV, Ω', 72, 72 + 14 * k))
  }
  doc.end()
})))
`)
const times = {floor: [], build: [], node: [], check: []}
const roundLoads = []
for (let i = 0; i < REPEAT; i++) {
  progress(`side-by-side round ${i + 1} of ${REPEAT}: floor, build, node -e 0, check`)
  roundLoads.push(loadavg()[0] ?? 0)
  times.floor.push((await runNode([floorScript])).seconds)
  times.build.push((await cli(['build', SAMPLES, '--force', '--out', outSamples, '--quiet'])).seconds)
  times.node.push((await runNode(['-e', '0'])).seconds)
  times.check.push((await cli(['check', SAMPLES, '--quiet'])).seconds)
}
const floor = median(times.floor)
const buildMedian = median(times.build)
const nodeMedian = median(times.node)
const checkMedian = median(times.check)
// Ratio of each round's pair, then the median: each pair ran under the same load.
const ratio = (a, b) => median(times[a].map((t, i) => t / times[b][i]))
const buildRatio = ratio('build', 'floor')
const checkRatio = ratio('check', 'node')

const roundsLoad = `${Math.min(...roundLoads).toFixed(1)}–${Math.max(...roundLoads).toFixed(1)}`
row('a', `floor: node + pdfkit, ${pages.join('+')} pages, 6 DejaVu faces`, `${floor.toFixed(2)} s`, undefined, undefined, roundsLoad)
row('a', `build sample-designs (${samplePdfs.length} notes, cold, --force)`, `${buildMedian.toFixed(2)} s`, undefined, undefined, roundsLoad)
row('a', 'RATIO build / floor (median of per-round ratios)', `${buildRatio.toFixed(2)} ×`, '≤ 2 ×', buildRatio <= 2, roundsLoad)
row('a', 'node -e 0', `${nodeMedian.toFixed(3)} s`, undefined, undefined, roundsLoad)
row('a', 'check sample-designs (cold)', `${checkMedian.toFixed(3)} s`, undefined, undefined, roundsLoad)
row('a', 'RATIO check / node -e 0 (median of per-round ratios)', `${checkRatio.toFixed(2)} ×`, '≤ 2 ×', checkRatio <= 2, roundsLoad)

// What `check` loads: module-load trace mapped to packages with esbuild's metafile.
{
  const traceFile = join(TMP, 'trace.txt')
  await new Promise((done, fail) => {
    const child = spawn(process.execPath, ['--import', pathToFileURL(join(ROOT, 'test/bench/load-trace.mjs')).href, CLI, 'check', SAMPLES, '--quiet'],
      {cwd: ROOT, stdio: 'ignore', env: {...process.env, AMPREVIEW_LOAD_TRACE: traceFile}})
    child.on('close', (code) => (code === 0 || code === 1 ? done() : fail(new Error(`traced check exited ${code}`))))
  })
  const meta = JSON.parse(readFileSync(join(ROOT, 'dist/bin/meta.json'), 'utf8'))
  const prefix = pathToFileURL(ROOT).href + '/'
  const lines = readFileSync(traceFile, 'utf8').split('\n')
  const pkgs = new Set()
  for (const l of lines.filter((x) => x.startsWith('module '))) {
    const url = l.slice(7)
    for (const input of Object.keys(meta.outputs[url.startsWith(prefix) ? url.slice(prefix.length) : '']?.inputs ?? {})) {
      const m = /node_modules\/((?:@[^/]+\/)?[^/]+)\//.exec(input)
      if (m) pkgs.add(m[1])
    }
  }
  const heavy = ['pdfkit', 'fontkit', 'vega', 'vega-lite', 'svg-to-pdfkit'].filter((p) => pkgs.has(p))
  const fonts = lines.filter((x) => x.startsWith('font ')).length
  row('a', 'check loads pdfkit/fontkit/vega, reads fonts (trace)', `${heavy.length === 0 ? 'none' : heavy.join(', ')}; ${fonts} font files`, 'none; 0', heavy.length === 0 && fonts === 0)
}

// ---------------------------------------------------------------------------------------
// (b) Stage evaluations per second, in this process

progress('stage evaluations')
const {ARCHETYPES, INA_ARCHETYPES, inaAsOpamp, evaluateStage} = await import(join(ROOT, 'dist', 'engine', 'index.js'))
const base = benchStage(ARCHETYPES, {'output-error': 15e-3, 'phase-margin': 50})
const cap = (value, tolerance = 0.05) => ({value, tolerance})
const inputs = {
  noninverting: base,
  inverting: {...base, topology: 'inverting', rf: res(10e3), rg: res(1e3), rs: null, input: [-0.5, 0.5], supply: [-12, 12], band: [0.1, 1e3],
    temperature: [25, 25], require: {'output-error': 5e-3, 'noise-rms': 50e-6}},
  follower: {...base, topology: 'follower', opamp: ARCHETYPES['precision-cmos'], rf: null, rg: null, rs: res(10e3, 0.01, 0), cstray: 8e-12,
    input: [2.499, 2.501], supply: [0, 5], temperature: [0, 70], require: {'output-error': 150e-6, 'phase-margin': 45}},
  transimpedance: {...base, topology: 'transimpedance', opamp: ARCHETYPES['precision-jfet'], rf: res(1e6, 0.005, 50e-6), rg: null, rs: null,
    cf: 2.2e-12, csource: 20e-12, cstray: 0, input: [0, 1e-6], supply: [-5, 5], temperature: [25, 25], band: [1, 1e4],
    require: {'noise-rms': 100e-6, 'phase-margin': 45}},
  // DESIGN §8: the new topologies, and a loaded stage whose capacitive-load rule is not in this figure (engine only).
  difference: {...base, topology: 'difference', opamp: ARCHETYPES['precision-cmos'], rf: res(200e3, 0.0002, 2e-6), rg: res(10e3, 0.0002, 2e-6), rs: null,
    rp: res(10e3, 0.0002, 2e-6), rref: res(200e3, 0.0002, 2e-6), vref: 0.25, input: [0, 0.05], inputCm: [4.75, 5.25], supply: [0, 5.5],
    riso: res(110, 0, 0), cload: 10e-9, band: [1, 1e3], require: {'output-error': 12.5e-3, 'phase-margin': 45}},
  'lowpass-sallen-key': {...base, topology: 'lowpass-sallen-key', opamp: ARCHETYPES['general-bipolar'], rf: null, rg: null, rs: null,
    r1: res(10e3), r2: res(10e3), c1: cap(22e-9), c2: cap(10e-9), input: [-1, 1], supply: [-12, 12], band: [0.1, 500]},
  'lowpass-mfb': {...base, topology: 'lowpass-mfb', opamp: ARCHETYPES['precision-cmos'], rf: null, rg: null, rs: null,
    r1: res(10e3), r2: res(20e3), r3: res(10e3), c1: cap(1e-9), c2: cap(47e-9), input: [-1, 1], supply: [-5, 5], band: [0.1, 300]},
  instrumentation: {...base, topology: 'instrumentation', ina: INA_ARCHETYPES['precision-ina'], opamp: inaAsOpamp(INA_ARCHETYPES['precision-ina']),
    rf: null, rg: res(499, 0.001, 10e-6), rs: res(175, 0, 0), inputCm: [2.5, 2.5], require: {'output-error': 10e-3}},
  'noninverting, loaded': {...base, opamp: {...ARCHETYPES['precision-bipolar'], rout: 60}, riso: res(220, 0, 0), cload: 1e-9, rload: 10e3}
}
const EVALS = QUICK ? 1000 : 3000
let allEvals = 0
let allSeconds = 0
const rates = {}
for (const [name, input] of Object.entries(inputs)) {
  for (let i = 0; i < 200; i++) evaluateStage(input)
  const t0 = performance.now()
  for (let i = 0; i < EVALS; i++) evaluateStage(input)
  const s = (performance.now() - t0) / 1000
  rates[name] = EVALS / s
  allEvals += EVALS
  allSeconds += s
}
const overall = allEvals / allSeconds
for (const [name, rate] of Object.entries(rates)) row('b', `evaluateStage, ${name} (${EVALS} runs)`, `${rate.toFixed(0)} /s`, '≥ 2000 /s', rate >= 2000)
row('b', 'evaluateStage, all topologies', `${overall.toFixed(0)} /s`, '≥ 2000 /s', overall >= 2000)

await chainBench()

// ---------------------------------------------------------------------------------------
// (b3) Monte Carlo yield over the DC budget (DESIGN §8.7), in this process: the trial loop
// on one core (target ≥ 5 M trials/s), the same on every core (worker threads, each a
// disjoint range of trials — trial i depends only on (seed, i), so the joined errors must
// equal the one-thread run byte for byte), and what a 100k-trial default adds to a stage's
// evaluation (the whole run: trials, sort, histogram, variance shares; target < 0.1 s).

progress('Monte Carlo yield')
const {yieldBench} = await import('./yield-bench.mjs')
await yieldBench({root: ROOT, quick: QUICK, stage: base, row})

// ---------------------------------------------------------------------------------------
// (c) Large notes

const sizes = QUICK ? [50, 200] : [50, 200, 1000]
const bigDir = join(TMP, 'big')
mkdirSync(bigDir)
const perStage = {}
for (const n of sizes) {
  const note = join(bigDir, `stages-${n}.md`)
  writeFileSync(note, noteOf(n, `${n} stages`))
  progress(`${n}-stage note, --format json`)
  const {seconds} = await cli(['build', note, '--format', 'json', '--force', '--out', join(bigDir, 'out'), '--quiet'])
  perStage[n] = seconds / n
  row('c', `${n}-stage note, --format json`, `${seconds.toFixed(2)} s (${(perStage[n] * 1000).toFixed(1)} ms/stage` +
    `${n === sizes[0] ? '' : `, ×${(perStage[n] / perStage[sizes[0]]).toFixed(2)} per stage vs ${sizes[0]}`})`)
  if (n === 50) {
    progress('50-stage note, pdf')
    const pdf = await cli(['build', note, '--format', 'pdf', '--force', '--out', join(bigDir, 'out'), '--quiet'])
    const p = pageCount(readFileSync(join(bigDir, 'out', 'stages-50.pdf')))
    row('c', `50-stage note, --format pdf (${p} pages)`, `${pdf.seconds.toFixed(2)} s (${(pdf.seconds / 50 * 1000).toFixed(1)} ms/stage)`)
  }
}

// ---------------------------------------------------------------------------------------
// (d) No-op rebuild of 100 cached notes

progress('100 notes: first build')
const manyDir = join(TMP, 'many')
mkdirSync(manyDir)
for (let i = 0; i < 100; i++) writeFileSync(join(manyDir, `note-${String(i).padStart(3, '0')}.md`), noteOf(1, `Note ${i}`).replace('s0', `n${i}`).replace(/rf: [\d.]+k/, `rf: ${(49.9 + i / 10).toFixed(2)}k`))
const manyOut = join(manyDir, 'out')
const first = await cli(['build', manyDir, '--format', 'json', '--out', manyOut, '--quiet'])
progress('100 notes: no-op rebuilds')
const noop = await medianOf(REPEAT, async () => {
  const r = await cli(['build', manyDir, '--format', 'json', '--out', manyOut])
  const upToDate = r.stderr.split('\n').filter((l) => / up to date: /.test(l)).length
  if (upToDate !== 100) throw new Error(`expected 100 notes up to date, got ${upToDate}\n${r.stderr.slice(0, 2000)}`)
  return r
})
row('d', '100 notes, first build (--format json)', `${first.seconds.toFixed(2)} s`)
row('d', '100 notes, no-op rebuild (all up to date)', `${noop.toFixed(2)} s`, '≤ 1 s', noop <= 1)

// ---------------------------------------------------------------------------------------
// (e) Watch: save to rebuilt PDF

progress('watch: save to PDF')
const watchDir = join(TMP, 'watch')
mkdirSync(watchDir)
const watched = join(watchDir, 'load-cell-bridge.md')
copyFileSync(join(SAMPLES, 'load-cell-bridge.md'), watched)
for (const f of readdirSync(SAMPLES)) if (/\.(png|jpe?g)$/i.test(f)) copyFileSync(join(SAMPLES, f), join(watchDir, f))
const original = readFileSync(watched, 'utf8')
const saves = await new Promise((resolvePromise, reject) => {
  const child = spawn(process.execPath, [CLI, 'build', '--watch', watched], {cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe']})
  let out = ''
  let err = ''
  const waiters = []
  const wake = () => { for (const w of waiters.splice(0)) w() }
  child.stdout.setEncoding('utf8').on('data', (s) => { out += s; wake() })
  child.stderr.setEncoding('utf8').on('data', (s) => { err += s; wake() })
  child.on('close', wake)
  const until = (test, what) => new Promise((ok, fail) => {
    const timer = setTimeout(() => fail(new Error(`watch: gave up waiting for ${what}\n${err.slice(-2000)}`)), 60_000)
    const check = () => {
      if (test()) { clearTimeout(timer); ok() } else if (child.exitCode !== null) { clearTimeout(timer); fail(new Error(`watch exited\n${err}`)) } else waiters.push(check)
    }
    check()
  })
  const lines = () => out.split('\n').filter((l) => l.includes('load-cell-bridge.md: ')).length
  ;(async () => {
    await until(() => err.includes('watching 1 note(s)'), 'the first build')
    const times = []
    for (let i = 0; i < REPEAT; i++) {
      const seen = lines()
      const t0 = performance.now()
      writeFileSync(watched, original.replace(/^title: (.*)$/m, `title: $1 (save ${i + 1})`))
      await until(() => lines() > seen, `rebuild ${i + 1}`)
      times.push((performance.now() - t0) / 1000)
      statSync(join(watchDir, 'load-cell-bridge.pdf'))
    }
    child.kill('SIGINT')
    resolvePromise(times)
  })().catch((e) => { child.kill('SIGKILL'); reject(e) })
})
const saveMedian = median(saves)
row('e', `build --watch: save → rebuilt PDF (median of ${REPEAT})`, `${saveMedian.toFixed(2)} s`, '< 1 s', saveMedian < 1)

// ---------------------------------------------------------------------------------------
// (f) Hostile text: long words and nesting bombs, time per MB (README, Limits)

const hostileDir = join(TMP, 'hostile')
mkdirSync(hostileDir)
const hostile = [
  ['one 200,000-character word in prose, build', 'word.md', `# Long word\n\n${'x'.repeat(200_000)}\n`, 'build'],
  ['one 200,000-character word in a code fence, build', 'code.md', `# Long code\n\n\`\`\`\n${'y'.repeat(200_000)}\n\`\`\`\n`, 'build'],
  ['600 KB of words in one table cell, build', 'cell.md', `# Cell\n\n| a | b |\n| - | - |\n| ${'word '.repeat(120_000)} | b |\n`, 'build'],
  ['4 MB of nested `[`, check (refused)', 'brackets.md', `# Brackets\n\n${'['.repeat(4_000_000)}\n`, 'check'],
  ['4 MB of `>`, check (refused)', 'quotes.md', `# Quotes\n\n${'>'.repeat(4_000_000)} x\n`, 'check']
]
for (const [what, name, text, command] of hostile) {
  progress(`hostile: ${what}`)
  writeFileSync(join(hostileDir, name), text)
  const mb = Buffer.byteLength(text) / 1e6
  const t = await medianOf(QUICK ? 1 : 3, () => cli([command, join(hostileDir, name), ...(command === 'build' ? ['--force'] : [])], {okCodes: [0, 1, 2]}))
  row('f', `${what} (${mb.toFixed(2)} MB)`, `${t.toFixed(2)} s = ${(t / mb).toFixed(2)} s/MB`)
}

// ---------------------------------------------------------------------------------------
// The table

printTable()
