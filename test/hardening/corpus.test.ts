/**
 * The bad-input corpus through the compiled CLI, as a user meets it.
 *
 * test/fixtures/bad/NAME.md: a note that cannot be evaluated. NAME.expected.json lists the
 * diagnostics it must produce ({line, column, severity, fragment}). `check NAME.md` must
 * exit 2 with each of them at its place and no stack trace; `build` in a folder that holds
 * an earlier good PDF of the same name must leave that PDF byte for byte and add no file.
 *
 * test/fixtures/suspicious/NAME.md: possible but suspicious notes. They must give their
 * warnings (positioned diagnostics, and rule notes of the stage in `--json`), no error,
 * the expected exit code (0 or 1), and `build` must still write the PDF.
 *
 * The notes are checked in small batches (the CLI takes many notes and prefixes each
 * diagnostic with its note's path), a few batches at a time; a note's own exit code is the
 * status word the CLI prints for it (`[i/n] error: PATH` is exit code 2, as batch.ts words
 * it), and the batch's exit code is the highest of its notes'. Each `build` is one batch.
 */
import {execFile} from 'node:child_process'
import {copyFileSync, readFileSync, readdirSync, writeFileSync} from 'node:fs'
import {availableParallelism} from 'node:os'
import {basename, join} from 'node:path'
import {beforeAll, describe, expect, it} from 'vitest'
import {CLI, ROOT, runCli, tempNotes, type CliRun} from '../cli/helpers.js'

const BAD = join(ROOT, 'test', 'fixtures', 'bad')
const SUSPICIOUS = join(ROOT, 'test', 'fixtures', 'suspicious')
const STACK_TRACE = /\n\s+at /

interface ExpectedDiagnostic {
  line: number
  column: number
  severity: 'error' | 'warning' | 'info'
  fragment: string
}

interface ExpectedNote {
  stage: string
  rule: string
  severity: string
  fragment: string
}

interface Expected {
  diagnostics: ExpectedDiagnostic[]
  /** Suspicious notes only. */
  exitCode?: 0 | 1
  /** Suspicious notes only: rule notes of a stage in `check --json`. */
  notes?: ExpectedNote[]
}

const notesIn = (dir: string): string[] => readdirSync(dir).filter((f) => f.endsWith('.md')).sort()
const expectedOf = (dir: string, note: string): Expected =>
  JSON.parse(readFileSync(join(dir, `${basename(note, '.md')}.expected.json`), 'utf8')) as Expected

/** `runCli`, but without blocking, so that several checks run at once. */
function runCliAsync(args: string[]): Promise<CliRun> {
  return new Promise((resolve) => {
    execFile(process.execPath, [CLI, ...args], {cwd: ROOT, encoding: 'utf8', maxBuffer: 16 << 20}, (error, stdout, stderr) => {
      const code = error === null ? 0 : typeof error.code === 'number' ? error.code : null
      resolve({status: code, stdout, stderr})
    })
  })
}

/** Run `task` on every item, `lanes` at a time; results in the items' order. */
async function eachLimited<T, R>(items: readonly T[], lanes: number, task: (item: T) => Promise<R>): Promise<R[]> {
  const out: R[] = new Array<R>(items.length)
  let next = 0
  const lane = async (): Promise<void> => {
    while (next < items.length) {
      const i = next++
      out[i] = await task(items[i] as T)
    }
  }
  await Promise.all(Array.from({length: Math.min(lanes, items.length)}, lane))
  return out
}

const LANES = Math.max(2, availableParallelism())
/** Notes per `check` call: small enough that one broken note points at a few others only. */
const CHUNK = 6

/** `check` every note (absolute paths), CHUNK per call, LANES calls at a time: each note's run. */
async function checkAll(paths: readonly string[], extra: readonly string[] = []): Promise<Map<string, CliRun>> {
  const chunks: string[][] = []
  for (let i = 0; i < paths.length; i += CHUNK) chunks.push(paths.slice(i, i + CHUNK))
  const runs = await eachLimited(chunks, LANES, (chunk) => runCliAsync(['check', ...extra, ...chunk]))
  return new Map(chunks.flatMap((chunk, i) => chunk.map((p): [string, CliRun] => [p, runs[i] as CliRun])))
}

/** The status word the CLI printed for `path` in its progress lines (ok, not met, error). */
const statusOf = (stderr: string, path: string): string | undefined =>
  stderr.split('\n').map((l) => /^\[\d+\/\d+\] ([a-z ]+): (.*) \([\d.]+ s\)$/.exec(l)).find((m) => m?.[2] === path)?.[1]

/** The diagnostics printed for `path`, as `LINE:COLUMN: SEVERITY: MESSAGE`. */
const printedFor = (stderr: string, path: string): string[] =>
  stderr.split('\n').filter((l) => l.startsWith(`${path}:`)).map((l) => l.slice(path.length + 1))

const placed = (d: ExpectedDiagnostic): string => `${d.line}:${d.column}: ${d.severity}: …${d.fragment}…`

/** The printed line that matches `d` (place, severity and fragment), or a readable miss. */
const match = (printed: readonly string[], d: ExpectedDiagnostic): string =>
  printed.some((p) => p.startsWith(`${d.line}:${d.column}: ${d.severity}: `) && p.includes(d.fragment)) ? placed(d) : `missing; printed:\n${printed.join('\n')}`

describe('the bad-input corpus (test/fixtures/bad)', () => {
  const cases = notesIn(BAD)
  let checks = new Map<string, CliRun>()
  let folder = ''
  let earlierPdf: Uint8Array = new Uint8Array()
  let before: string[] = []
  let after: string[] = []
  let build: CliRun = {status: null, stdout: '', stderr: ''}

  beforeAll(async () => {
    checks = await checkAll(cases.map((note) => join(BAD, note)))

    // A folder as an earlier good build left it: the note's PDF and the build cache.
    folder = tempNotes({'earlier-good.md': readFileSync(join(import.meta.dirname, 'earlier-good.md'))})
    const good = runCli(['build', '--quiet', 'earlier-good.md'], {cwd: folder})
    expect(good.status, good.stderr).toBe(0)
    earlierPdf = readFileSync(join(folder, 'earlier-good.pdf'))
    for (const note of cases) {
      copyFileSync(join(BAD, note), join(folder, note))
      writeFileSync(join(folder, `${basename(note, '.md')}.pdf`), earlierPdf)
    }
    before = readdirSync(folder).sort()
    build = runCli(['build', '--quiet', ...cases], {cwd: folder})
    after = readdirSync(folder).sort()
  })

  it('holds at least 45 notes, each with its expectations', () => {
    expect(cases.length).toBeGreaterThanOrEqual(45)
    for (const note of cases) expect(expectedOf(BAD, note).diagnostics.length, note).toBeGreaterThan(0)
  })

  it.each(cases)('check %s exits 2 with every expected diagnostic at its place', (note) => {
    const path = join(BAD, note)
    const run = checks.get(path)
    expect(run?.status, run?.stderr).toBe(2)
    expect(statusOf(run?.stderr ?? '', path), run?.stderr).toBe('error')
    const printed = printedFor(run?.stderr ?? '', path)
    for (const d of expectedOf(BAD, note).diagnostics) expect(match(printed, d)).toBe(placed(d))
  })

  it.each(cases)('check %s prints no stack trace', (note) => {
    const run = checks.get(join(BAD, note))
    expect(run?.stderr).not.toMatch(STACK_TRACE)
    expect(run?.stdout).not.toMatch(STACK_TRACE)
  })

  it.each(cases)('build %s leaves the earlier good PDF byte for byte', (note) => {
    const pdf = readFileSync(join(folder, `${basename(note, '.md')}.pdf`))
    expect(Buffer.compare(pdf, earlierPdf)).toBe(0)
  })

  it('build of the whole corpus exits 2, with no stack trace', () => {
    expect(build.status, build.stderr).toBe(2)
    expect(build.stderr).not.toMatch(STACK_TRACE)
  })

  it('build of the whole corpus adds no file to the folder (no temporary .tmp)', () => {
    expect(after).toEqual(before)
  })
})

describe('suspicious notes (test/fixtures/suspicious)', () => {
  const cases = notesIn(SUSPICIOUS)
  let checks = new Map<string, CliRun>()
  let folder = ''
  let build: CliRun = {status: null, stdout: '', stderr: ''}

  beforeAll(async () => {
    // One note per call here: each note's own exit code is the point, and there are few.
    const runs = await eachLimited(cases, LANES, (note) => runCliAsync(['check', '--json', join(SUSPICIOUS, note)]))
    checks = new Map(cases.map((note, i) => [note, runs[i] as CliRun]))
    folder = tempNotes(Object.fromEntries(cases.map((note) => [note, readFileSync(join(SUSPICIOUS, note))])))
    build = runCli(['build', '--quiet', ...cases], {cwd: folder})
  })

  interface JsonFile {
    diagnostics: {severity: string; message: string; line: number; column: number}[]
    stages: {id: string; notes: {rule: string; severity: string; text: string}[]}[]
  }
  const resultOf = (note: string): JsonFile => (JSON.parse(checks.get(note)?.stdout ?? '{}') as {files: JsonFile[]}).files[0] as JsonFile

  it.each(cases)('check %s exits with its expected code and no error', (note) => {
    const run = checks.get(note)
    expect(run?.status, run?.stderr).toBe(expectedOf(SUSPICIOUS, note).exitCode)
    expect(run?.stderr).not.toMatch(STACK_TRACE)
    expect(resultOf(note).diagnostics.filter((d) => d.severity === 'error')).toEqual([])
  })

  it.each(cases)('check %s gives its expected warnings', (note) => {
    const expected = expectedOf(SUSPICIOUS, note)
    const printed = resultOf(note).diagnostics.map((d) => `${d.line}:${d.column}: ${d.severity}: ${d.message}`)
    for (const d of expected.diagnostics) expect(match(printed, d)).toBe(placed(d))
    const stages = resultOf(note).stages
    for (const n of expected.notes ?? []) {
      const found = stages.find((s) => s.id === n.stage)?.notes.some((x) => x.rule === n.rule && x.severity === n.severity && x.text.includes(n.fragment))
      expect(found, `${n.stage}: ${n.rule} (${n.severity}) …${n.fragment}…`).toBe(true)
    }
    expect(expected.diagnostics.length + (expected.notes ?? []).length).toBeGreaterThan(0)
  })

  it.each(cases)('build %s still writes the PDF', (note) => {
    const pdf = readFileSync(join(folder, `${basename(note, '.md')}.pdf`))
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
  })

  it('build of the suspicious notes exits 0 or 1, with no stack trace', () => {
    expect([0, 1], build.stderr).toContain(build.status)
    expect(build.stderr).not.toMatch(STACK_TRACE)
  })
})
