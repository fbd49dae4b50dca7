/**
 * The pipeline for one note, DESIGN §2, in three steps:
 *
 *   readNote(path)                          → bytes + the note's resources (fs)
 *   runNote(bytes, name, resources, opts)   → NoteResult: outcome + the files' contents
 *       decode ─▶ text ─parse─▶ ParsedNote ─evaluate─▶ StageEvaluation[]
 *              ─report─▶ ReportDocument ─render─▶ PDF | review.md | JSON
 *   writeOutputs(result, formats, outDir)   → NoteOutcome (atomic, all or nothing)
 *
 * `runNote` touches nothing but what it is given (bytes, loaders for the template, fonts
 * and images), so `compare` runs a note read from a git revision through it directly.
 * Data flows left to right only. Every phase records its problems on the VFile and goes
 * on, so that all of a file's problems are reported in one run; a note with any error
 * stops before the report and writes nothing.
 */
import {createHash} from 'node:crypto'
import {lstat, readFile, stat} from 'node:fs/promises'
import {basename, dirname, extname, join, resolve} from 'node:path'
import type {Root} from 'mdast'
import {VFile} from 'vfile'
import {decodeNote, parseNote} from '../note/index.js'
import {evaluateNoteWithChains, type ChainEvaluation, type StageEvaluation} from '../evaluate/index.js'
import {jsonChain, jsonStage, noteJson, toJson, type JsonChain, type JsonStage} from '../results/json.js'
import {CHAIN_REQUIREMENT_KEYS} from '../engine/chain/types.js'
import {chainRequirementValue, chainLimitText} from '../report/chain-verdicts.js'
import type {FontSet, LoadedFonts} from '../render/pdf/index.js'
import {REQUIREMENT_KEYS} from '../engine/types.js'
import type {TrialSpread} from '../engine/index.js'
import {limitText, requirementValue} from '../report/verdicts.js'
import {recordOf, type OutputRecord} from './cache.js'
import {reportDate} from './dates.js'
import {cliDiagnostic, diagnosticsOf, hasErrors, strictly, type Diagnostic} from './diagnostics.js'
import {readImages, type ImageInput, type NoteImages} from './images.js'
import {loadTemplate, type Template} from './resources.js'
import {writeAllAtomic} from './write.js'
import type {Format} from './formats.js'

export {FORMATS, type Format} from './formats.js'
export {MAX_NOTE_BYTES} from '../note/index.js'

/** What a run shares over all its notes. */
export interface Resources {
  /** The fonts, loaded once on first use (only builds need them). */
  fonts: () => Promise<FontSet>
  /** The same fonts parsed for the PDF renderer, once a run (`lazyFaces`): shaping is shared by its notes. */
  faces: () => Promise<LoadedFonts>
  version: string
  /** The bundle's own hash (`buildId`), for the build cache's key only; never printed. */
  buildId: string
  /** Templates already loaded, by name. */
  templates: Map<string, Template>
  /** Runs large Monte Carlos' trials on the trial threads (`trials.ts`). (optional: in this thread) */
  spread?: TrialSpread
}

/** What one note may read besides its own bytes: everything `runNote` gets from outside. */
export interface NoteResources {
  fonts: () => Promise<FontSet>
  faces: () => Promise<LoadedFonts>
  version: string
  template: (name: string) => Promise<Template>
  /** The images the note's tree names (messages for refused ones go on `file`). */
  images: (tree: Root, file: VFile) => Promise<NoteImages>
  /** As `Resources.spread`. (optional: in this thread) */
  spread?: TrialSpread
}

export interface RunOptions {
  /** Formats to write (build); empty = only evaluate (check). */
  formats: readonly Format[]
  /** Output folder; null = next to the note. */
  outDir: string | null
  /** Treat warnings as errors. */
  strict: boolean
  /** `--yield`: the Monte Carlo on every stage without its own `yield` (DESIGN §8.7). (optional: off) */
  yield?: boolean
  sourceDateEpoch: string | undefined
  /** Evaluate every stage's input-technology alternatives (`--alternatives`, DESIGN §8.8). (optional: only the stages that ask) */
  alternatives?: boolean
  /**
   * Existing files the outputs may replace (the cache's record of this note's outputs);
   * any other existing file at an output path is refused. (optional: no check)
   */
  owned?: readonly string[]
}

export interface NoteOutcome {
  /** The path as given on the command line. */
  file: string
  sourceSha256: string
  diagnostics: Diagnostic[]
  /** The DESIGN §6 result of each evaluated stage. */
  stages: JsonStage[]
  /** The DESIGN §8.6 result of each evaluated chain (absent where nothing was evaluated). */
  chains?: JsonChain[]
  /** Requirements met and not met, over all stages and chains. */
  met: number
  notMet: number
  /** 0 all met, 1 a requirement not met, 2 could not be evaluated. */
  exitCode: 0 | 1 | 2
  /** Paths of the files written (absolute), if any. */
  outputs: string[]
  /** The images the outputs embed, as read (for the build cache). (optional: none) */
  inputs?: ImageInput[]
  /** Size and hash of each file written (for the build cache). (optional: none) */
  records?: OutputRecord[]
}

/** A run of one note before anything is written: the outcome and each output's name and contents. */
export interface NoteResult {
  outcome: NoteOutcome
  /** File names (no folder: `<stem>.pdf`, `<stem>.review.md`, `<stem>.review.figN.svg`, …) and contents. */
  files: {name: string; data: Uint8Array | string}[]
}

export const failedOutcome = (file: string, message: string, sha = ''): NoteOutcome => ({
  file, sourceSha256: sha, diagnostics: [cliDiagnostic('error', message)], stages: [], chains: [], met: 0, notMet: 0, exitCode: 2, outputs: []
})

/** A file beside a note's outputs: `<outDir or the note's folder>/<name>.<ext>`. */
export const outputPath = (notePath: string, outDir: string | null, ext: string): string =>
  join(outDir ?? dirname(resolve(notePath)), `${basename(notePath, extname(notePath))}.${ext}`)

/** File extension of each output format; the Markdown report is `.review.md`, so it never replaces its note. */
export const FORMAT_EXTENSIONS: Record<Format, string> = {pdf: 'pdf', json: 'json', md: 'review.md'}

/** The output file of a note in one format. */
export const outputFile = (notePath: string, outDir: string | null, format: Format): string =>
  outputPath(notePath, outDir, FORMAT_EXTENSIONS[format])

/** The output file name (no folder) of a note in one format. */
const outputName = (notePath: string, format: Format): string => `${basename(notePath, extname(notePath))}.${FORMAT_EXTENSIONS[format]}`

export {noteJson}

/** The resources of one note: shared fonts and templates, images from the note's folder. */
export function noteResources(path: string, res: Resources): NoteResources {
  return {
    fonts: res.fonts,
    faces: res.faces,
    version: res.version,
    template: async (name) => {
      const known = res.templates.get(name)
      if (known) return known
      const t = await loadTemplate(name)
      res.templates.set(name, t)
      return t
    },
    images: (tree, file) => readImages(tree, path, file),
    ...(res.spread ? {spread: res.spread} : {})
  }
}

/** Read a note's bytes: it must exist and be a file. */
export async function readNote(path: string, res: Resources): Promise<{ok: true; bytes: Uint8Array; resources: NoteResources} | {ok: false; outcome: NoteOutcome}> {
  try {
    const s = await stat(path)
    if (!s.isFile()) return {ok: false, outcome: failedOutcome(path, `Expected a Markdown file, found a ${s.isDirectory() ? 'folder' : 'special file'}`)}
    return {ok: true, bytes: new Uint8Array(await readFile(path)), resources: noteResources(path, res)}
  } catch {
    return {ok: false, outcome: failedOutcome(path, 'File not found or not readable')}
  }
}

/**
 * Place a message for each requirement not met at its key in the block, and one for each
 * practice note of severity `warning` or `caution` at the block's fence, so that CI logs show
 * them, each with its rule id. A note the author accepted, and everything a `baseline` stage
 * raises, is an info message instead: shown, never a warning or a failure.
 */
function markUnmet(file: VFile, evaluations: StageEvaluation[]): void {
  for (const ev of evaluations) {
    const baseline = ev.role === 'baseline'
    for (const n of ev.notes) {
      if (n.severity !== 'warning' && n.severity !== 'caution') continue
      const opts = {place: ev.block.position?.start, ruleId: n.rule, source: 'ampreview'}
      if (n.accepted !== undefined) file.info(`Stage \`${ev.input.id}\`: accepted by the author (${n.accepted}): ${n.text}`, opts)
      else if (baseline) file.info(`Baseline stage \`${ev.input.id}\` (not counted): ${n.text}`, opts)
      else file.message(`Stage \`${ev.input.id}\`: ${n.text}`, opts)
    }
    for (const r of ev.result.requirements) {
      if (r.met !== false) continue
      const t = ev.input.topology
      if (r.kind === 'limit') {
        const text = `Limit \`${r.key}\` of ${baseline ? 'baseline ' : ''}stage \`${ev.input.id}\` not met: ${requirementValue(r, 'value', t)}, expected ${limitText(r, t)}`
        const opts = {place: ev.block.position?.start, ruleId: 'limit-not-met', source: 'ampreview'}
        if (baseline) file.info(`${text} (a baseline stage: shown, not counted)`, opts)
        else file.message(text, opts)
        continue
      }
      const entry = ev.block.entries.find((e) => e.key === `require.${r.key}`)
      const sense = REQUIREMENT_KEYS[r.key].sense === 'max' ? 'at most' : 'at least'
      const text = `Requirement \`${r.key}\` of ${baseline ? 'baseline ' : ''}stage \`${ev.input.id}\` not met: ${requirementValue(r, 'value', t)}, expected ${sense} ${requirementValue(r, 'limit', t)}`
      const opts = {place: entry ? {line: entry.line, column: entry.column} : ev.block.position?.start, ruleId: 'requirement-not-met', source: 'ampreview'}
      if (baseline) file.info(`${text} (a baseline stage: shown, not counted)`, opts)
      else file.message(text, opts)
    }
  }
}

/** The same for chains: a note at the chain block for each practice note and each verdict not met. */
function markUnmetChains(file: VFile, chains: ChainEvaluation[]): void {
  for (const ev of chains) {
    const place = ev.block.position?.start
    for (const n of ev.notes) {
      if (n.severity !== 'warning' && n.severity !== 'caution') continue
      const opts = {place, ruleId: n.rule, source: 'ampreview'}
      if (n.accepted !== undefined) file.info(`Chain \`${ev.input.id}\`: accepted by the author (${n.accepted}): ${n.text}`, opts)
      else file.message(`Chain \`${ev.input.id}\`: ${n.text}`, opts)
    }
    for (const r of ev.result.requirements) {
      if (r.met !== false) continue
      if (r.kind === 'limit') {
        file.message(`Limit \`${r.key}\` of chain \`${ev.input.id}\` not met: ${chainRequirementValue(ev, r, 'value')}, expected ${chainLimitText(ev, r)}`,
          {place, ruleId: 'limit-not-met', source: 'ampreview'})
        continue
      }
      const entry = ev.block.entries.find((e) => e.key === `require.${r.key}`)
      const sense = CHAIN_REQUIREMENT_KEYS[r.key].sense === 'max' ? 'at most' : 'at least'
      file.message(`Requirement \`${r.key}\` of chain \`${ev.input.id}\` not met: ${chainRequirementValue(ev, r, 'value')}, expected ${sense} ${chainRequirementValue(ev, r, 'limit')}`,
        {place: entry ? {line: entry.line, column: entry.column} : place, ruleId: 'requirement-not-met', source: 'ampreview'})
    }
  }
}

/**
 * Run one note from its bytes: `name` is the path as given (diagnostics, JSON `file`,
 * output names); nothing is read but through `res`, nothing is written.
 */
export async function runNote(bytes: Uint8Array, name: string, res: NoteResources, opts: Pick<RunOptions, 'formats' | 'strict' | 'sourceDateEpoch' | 'alternatives' | 'yield'>): Promise<NoteResult> {
  const sha = createHash('sha256').update(bytes).digest('hex')
  const decoded = decodeNote(bytes)
  if (!decoded.ok) return {outcome: failedOutcome(name, decoded.message, sha), files: []}
  const file = new VFile({path: name, value: decoded.text})

  // 1. Parse: front matter, blocks, the stage language.
  const parsed = parseNote(file)
  const templateName = parsed.meta.template ?? 'standard'
  let template: Template | null = null
  try {
    template = await res.template(templateName)
  } catch (error) {
    file.message(error instanceof Error ? error.message : String(error), {place: {line: 1, column: 1}, ruleId: 'template', source: 'ampreview'}).fatal = true
  }

  // 2. Evaluate: engine and rules, per stage.
  const {stages: evaluations, chains} = evaluateNoteWithChains(parsed, file, {alternatives: opts.alternatives === true, yield: opts.yield === true, ...(res.spread ? {spread: res.spread} : {})})
  markUnmet(file, evaluations)
  markUnmetChains(file, chains)
  const wantPdf = opts.formats.includes('pdf')
  const {images, inputs} = wantPdf ? await res.images(parsed.tree, file) : {images: new Map<string, Uint8Array>(), inputs: []}

  let diagnostics = diagnosticsOf(file)
  if (opts.strict) diagnostics = strictly(diagnostics)
  // Baseline stages are shown but not counted (exit code, summary). A limit not met fails
  // like a requirement (exit 1); a skipped limit (met null) counts neither way. Chain
  // verdicts count like a stage's.
  const requirements: {met: boolean | null}[] = [
    ...evaluations.filter((ev) => ev.role !== 'baseline').flatMap((ev) => ev.result.requirements),
    ...chains.flatMap((ev) => ev.result.requirements)
  ]
  const notMet = requirements.filter((r) => r.met === false).length
  const exitCode = hasErrors(diagnostics) || template === null ? 2 : notMet > 0 ? 1 : 0
  const outcome: NoteOutcome = {
    file: name, sourceSha256: sha, diagnostics, stages: evaluations.map(jsonStage), chains: chains.map(jsonChain),
    met: requirements.filter((r) => r.met === true).length, notMet, exitCode, outputs: [], inputs
  }
  if (opts.formats.length === 0 || exitCode === 2 || template === null) return {outcome, files: []}

  const jsonFile = (o: NoteOutcome): NoteResult['files'][number] => ({name: outputName(name, 'json'), data: `${toJson({files: [noteJson(o)]})}\n`})
  // A JSON-only build needs neither the report tree nor the charts.
  if (opts.formats.every((f) => f === 'json')) return {outcome, files: [jsonFile(outcome)]}

  // 3. Report: the tree with each block replaced by its section (synchronous, no chart
  //    library). The render modules (vega, pdfkit) load only when something is to be
  //    drawn, keeping `check` fast; the charts compile once for every format.
  const [{buildReport}, {compileFigures}, {renderPdf}, {reportToMarkdown}, fonts] = await Promise.all([
    import('../report/build.js'), import('../render/chart/compile.js'), import('../render/pdf/index.js'), import('../render/markdown/index.js'), res.fonts()
  ])
  const report = buildReport({
    parsed, evaluations, chains,
    fragments: {method: template.method, closing: template.closing, appendix: template.options.appendix},
    sourceSha256: sha, toolVersion: res.version, fileName: basename(name)
  })

  // 4. Render every format asked for.
  const figures = await compileFigures(report.document, {regular: fonts.regular, bold: fonts.bold})
  const files: NoteResult['files'] = []
  let renderWarnings: string[] = []
  if (wantPdf) {
    const rendered = await renderPdf(report.document, {
      theme: template.theme, fonts, faces: await res.faces(), images, figures, date: reportDate(parsed.meta.date, opts.sourceDateEpoch)
    })
    renderWarnings = rendered.warnings
    files.push({name: outputName(name, 'pdf'), data: rendered.pdf})
  }
  const warnings = [...report.warnings, ...figures.warnings, ...renderWarnings].map((message): Diagnostic => cliDiagnostic('warning', message, 'build'))
  const final = {...outcome, diagnostics: [...diagnostics, ...warnings]}
  if (opts.formats.includes('json')) files.push(jsonFile(final))
  if (opts.formats.includes('md')) {
    const mdName = outputName(name, 'md')
    const stem = basename(mdName, '.md')
    const md = reportToMarkdown(report.document, figures, (n) => `${stem}.fig${n}.svg`)
    files.push({name: mdName, data: md.markdown}, ...md.figures.map((f) => ({name: f.name, data: f.svg})))
  }
  return {outcome: final, files}
}

/**
 * Write a result's files into `outDir` (null: beside the note), all or nothing. A failed
 * write becomes an error diagnostic (exit code 2) and replaces no earlier output.
 */
export async function writeOutputs(result: NoteResult, outDir: string | null, owned?: readonly string[]): Promise<NoteOutcome> {
  const o = result.outcome
  if (result.files.length === 0) return o
  const dir = outDir === null ? dirname(resolve(o.file)) : resolve(outDir)
  const files = result.files.map((f): [string, Uint8Array | string] => [join(dir, f.name), f.data])
  if (owned !== undefined) {
    for (const [path] of files) {
      if (owned.includes(path) || !(await lstat(path).then(() => true, () => false))) continue
      const d: Diagnostic = cliDiagnostic('error',
        `Not written: ${path} exists and was not written by ampreview for this note; no output file was replaced (remove it, build into another folder with --out, or replace it with --force)`, 'build')
      return {...o, diagnostics: [...o.diagnostics, d], exitCode: 2, outputs: []}
    }
  }
  try {
    await writeAllAtomic(files)
    return {...o, outputs: files.map(([p]) => p), records: files.map(([p, data]) => recordOf(p, data))}
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code
    const why = code === 'EACCES' || code === 'EPERM' ? 'permission denied'
      : code === 'ENOSPC' ? 'no space left on the device' : code === 'EROFS' ? 'read-only file system'
        : error instanceof Error ? error.message : String(error)
    const d: Diagnostic = cliDiagnostic('error', `Cannot write the outputs of this note (${why}); no output file was replaced (choose another folder with --out)`, 'build')
    return {...o, diagnostics: [...o.diagnostics, d], exitCode: 2, outputs: []}
  }
}

/** One note from its path to its written outputs: read → run → write. */
export async function processNote(path: string, res: Resources, opts: RunOptions): Promise<NoteOutcome> {
  const read = await readNote(path, res)
  if (!read.ok) return read.outcome
  return writeOutputs(await runNote(read.bytes, path, read.resources, opts), opts.outDir, opts.owned)
}
