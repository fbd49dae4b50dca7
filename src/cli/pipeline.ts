/**
 * The pipeline for one note, DESIGN §2:
 *
 *   note.md ──read──▶ VFile ──parse──▶ ParsedNote ──evaluate──▶ StageEvaluation[]
 *           ──report──▶ ReportDocument ──render──▶ PDF bytes ──write (atomic)──▶ note.pdf
 *
 * Data flows left to right only. Every phase records its problems on the VFile and goes
 * on, so that all of a file's problems are reported in one run; a note with any error
 * stops before the report and writes nothing.
 */
import {createHash} from 'node:crypto'
import {readFile, stat} from 'node:fs/promises'
import {basename, dirname, extname, join, resolve} from 'node:path'
import {VFile} from 'vfile'
import {parseNote} from '../note/index.js'
import {evaluateNote, type StageEvaluation} from '../report/evaluate.js'
import {jsonStage, toJson, type JsonStage} from '../report/json.js'
import type {FontSet} from '../render/index.js'
import {REQUIREMENT_KEYS} from '../engine/types.js'
import {limitText, requirementValue} from '../report/verdicts.js'
import {reportDate} from './dates.js'
import {diagnosticsOf, hasErrors, type Diagnostic} from './diagnostics.js'
import {readImages} from './images.js'
import {loadTemplate, type Template} from './resources.js'
import {writeAllAtomic} from './write.js'
import type {Format} from './formats.js'

export {FORMATS, type Format} from './formats.js'

/** Largest note read, bytes (time and memory stay bounded: README, Limits). */
export const MAX_NOTE_BYTES = 20 * 2 ** 20

export interface Resources {
  /** The fonts, loaded once on first use (only builds need them). */
  fonts: () => Promise<FontSet>
  version: string
  /** Templates already loaded, by name. */
  templates: Map<string, Template>
}

export interface RunOptions {
  /** Formats to write (build); empty = only evaluate (check). */
  formats: readonly Format[]
  /** Output folder; null = next to the note. */
  outDir: string | null
  /** Treat warnings as errors. */
  strict: boolean
  sourceDateEpoch: string | undefined
}

export interface NoteOutcome {
  /** The path as given on the command line. */
  file: string
  sourceSha256: string
  diagnostics: Diagnostic[]
  /** The DESIGN §6 result of each evaluated stage. */
  stages: JsonStage[]
  /** Requirements met and not met, over all stages. */
  met: number
  notMet: number
  /** 0 all met, 1 a requirement not met, 2 could not be evaluated. */
  exitCode: 0 | 1 | 2
  /** Paths of the files written (absolute), if any. */
  outputs: string[]
}

export const failedOutcome = (file: string, message: string, sha = ''): NoteOutcome => ({
  file, sourceSha256: sha, diagnostics: [{severity: 'error', message, line: 1, column: 1}], stages: [], met: 0, notMet: 0, exitCode: 2, outputs: []
})

/** A file beside a note's outputs: `<outDir or the note's folder>/<name>.<ext>`. */
export const outputPath = (notePath: string, outDir: string | null, ext: string): string =>
  join(outDir ?? dirname(resolve(notePath)), `${basename(notePath, extname(notePath))}.${ext}`)

/** File extension of each output format; the Markdown report is `.review.md`, so it never replaces its note. */
export const FORMAT_EXTENSIONS: Record<Format, string> = {pdf: 'pdf', json: 'json', md: 'review.md'}

/** The output file of a note in one format. */
export const outputFile = (notePath: string, outDir: string | null, format: Format): string =>
  outputPath(notePath, outDir, FORMAT_EXTENSIONS[format])

/** The §6 JSON object of one note. */
export const noteJson = (o: Pick<NoteOutcome, 'file' | 'sourceSha256' | 'diagnostics' | 'stages'>): object => ({
  file: o.file,
  sourceSha256: o.sourceSha256,
  diagnostics: o.diagnostics.map((d) => ({severity: d.severity, message: d.message, line: d.line, column: d.column})),
  stages: o.stages
})

async function templateFor(name: string, res: Resources): Promise<Template> {
  const known = res.templates.get(name)
  if (known) return known
  const t = await loadTemplate(name)
  res.templates.set(name, t)
  return t
}

/**
 * Place a message for each requirement not met at its key in the block, and one for each
 * practice note of severity `warning` or `caution` at the block's fence, so that CI logs show them.
 */
function markUnmet(file: VFile, evaluations: StageEvaluation[]): void {
  for (const ev of evaluations) {
    for (const n of ev.notes) {
      if (n.severity !== 'warning' && n.severity !== 'caution') continue
      file.message(`Stage \`${ev.input.id}\`: ${n.text} [${n.rule}]`, {place: ev.block.position?.start, ruleId: n.rule, source: 'ampreview'})
    }
    for (const r of ev.result.requirements) {
      if (r.met !== false) continue
      const t = ev.input.topology
      if (r.kind === 'limit') {
        file.message(`Limit \`${r.key}\` of stage \`${ev.input.id}\` not met: ${requirementValue(r, 'value', t)}, expected ${limitText(r, t)}`,
          {place: ev.block.position?.start, ruleId: 'limit-not-met', source: 'ampreview'})
        continue
      }
      const entry = ev.block.entries.find((e) => e.key === `require.${r.key}`)
      const sense = REQUIREMENT_KEYS[r.key].sense === 'max' ? 'at most' : 'at least'
      file.message(`Requirement \`${r.key}\` of stage \`${ev.input.id}\` not met: ${requirementValue(r, 'value', t)}, expected ${sense} ${requirementValue(r, 'limit', t)}`,
        {place: entry ? {line: entry.line, column: entry.column} : ev.block.position?.start, ruleId: 'requirement-not-met', source: 'ampreview'})
    }
  }
}

export async function processNote(path: string, res: Resources, opts: RunOptions): Promise<NoteOutcome> {
  // 1. Read: the note must exist, be a file, and be text.
  let bytes: Buffer
  try {
    const s = await stat(path)
    if (!s.isFile()) return failedOutcome(path, `Expected a Markdown file, found a ${s.isDirectory() ? 'folder' : 'special file'}`)
    bytes = await readFile(path)
  } catch {
    return failedOutcome(path, 'File not found or not readable')
  }
  const sha = createHash('sha256').update(bytes).digest('hex')
  if (bytes.length > MAX_NOTE_BYTES) {
    return failedOutcome(path, `The note is ${(bytes.length / 2 ** 20).toFixed(2)} MiB, larger than the ${MAX_NOTE_BYTES / 2 ** 20} MiB a note may be: split it into several notes`, sha)
  }
  if (bytes.includes(0)) return failedOutcome(path, 'This is a binary file, not a Markdown note (it contains NUL bytes)', sha)
  const text = bytes.toString('utf8')
  if (text.includes('\uFFFD') && !bytes.includes(Buffer.from('\uFFFD'))) {
    return failedOutcome(path, 'The note is not valid UTF-8 text; save it as UTF-8', sha)
  }
  if (text.replace(/^\uFEFF/, '').trim() === '') return failedOutcome(path, 'The note is empty: expected Markdown prose and stage blocks', sha)
  const file = new VFile({path, value: text})

  // 2. Parse: front matter, blocks, the stage language.
  const parsed = parseNote(file)
  const templateName = parsed.meta.template ?? 'standard'
  let template: Template | null = null
  try {
    template = await templateFor(templateName, res)
  } catch (error) {
    file.message(error instanceof Error ? error.message : String(error), {place: {line: 1, column: 1}, ruleId: 'template', source: 'ampreview'}).fatal = true
  }

  // 3. Evaluate: engine and rules, per stage.
  const evaluations = evaluateNote(parsed, file)
  markUnmet(file, evaluations)
  const wantPdf = opts.formats.includes('pdf')
  const images = wantPdf ? await readImages(parsed.tree, path, file) : new Map<string, Uint8Array>()

  let diagnostics = diagnosticsOf(file)
  if (opts.strict) diagnostics = diagnostics.map((d) => (d.severity === 'warning' && !d.message.startsWith('Requirement ') && !d.message.startsWith('Limit ') ? {...d, severity: 'error'} : d))
  const requirements = evaluations.flatMap((ev) => ev.result.requirements)
  // A limit not met fails like a requirement (exit 1); a skipped limit (met null) counts neither way.
  const notMet = requirements.filter((r) => r.met === false).length
  const exitCode = hasErrors(diagnostics) || template === null ? 2 : notMet > 0 ? 1 : 0
  const outcome: NoteOutcome = {
    file: path, sourceSha256: sha, diagnostics, stages: evaluations.map(jsonStage),
    met: requirements.filter((r) => r.met === true).length, notMet, exitCode, outputs: []
  }
  if (opts.formats.length === 0 || exitCode === 2 || template === null) return outcome

  const outDir = opts.outDir === null ? null : resolve(opts.outDir)
  const writeAll = async (o: NoteOutcome, files: [string, Uint8Array | string][]): Promise<NoteOutcome> => {
    try {
      await writeAllAtomic(files)
      return {...o, outputs: files.map(([p]) => p)}
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code
      const why = code === 'EACCES' || code === 'EPERM' ? 'permission denied'
        : code === 'ENOSPC' ? 'no space left on the device' : code === 'EROFS' ? 'read-only file system'
          : error instanceof Error ? error.message : String(error)
      const d: Diagnostic = {severity: 'error', line: 1, column: 1,
        message: `Cannot write the outputs of this note (${why}); no output file was replaced (choose another folder with --out)`}
      return {...o, diagnostics: [...o.diagnostics, d], exitCode: 2, outputs: []}
    }
  }
  const jsonFile = (o: NoteOutcome): [string, string] => [outputFile(path, outDir, 'json'), `${toJson({files: [noteJson(o)]})}\n`]
  // A JSON-only build needs neither the report tree nor the charts.
  if (opts.formats.every((f) => f === 'json')) return writeAll(outcome, [jsonFile(outcome)])

  // 4. Report: the tree with each block replaced by its section. The report and render
  //    modules (vega, pdfkit) load only when something is to be drawn, keeping `check` fast.
  const [{buildReport}, {renderPdf}, {reportToMarkdown}, fonts] = await Promise.all([
    import('../report/build.js'), import('../render/index.js'), import('../report/markdown.js'), res.fonts()
  ])
  const report = await buildReport({
    parsed, evaluations, fonts: {regular: fonts.regular, bold: fonts.bold},
    fragments: {method: template.method, closing: template.closing},
    sourceSha256: sha, toolVersion: res.version, fileName: basename(path)
  })

  // 5. Render, then write every format at once, all or nothing.
  const files: [string, Uint8Array | string][] = []
  let renderWarnings: string[] = []
  if (wantPdf) {
    const rendered = await renderPdf(report.document, {
      theme: template.theme, fonts, images, date: reportDate(parsed.meta.date, opts.sourceDateEpoch)
    })
    renderWarnings = rendered.warnings
    files.push([outputFile(path, outDir, 'pdf'), rendered.pdf])
  }
  const warnings = [...report.warnings, ...renderWarnings].map((message): Diagnostic => ({severity: 'warning', message, line: 1, column: 1}))
  const final = {...outcome, diagnostics: [...diagnostics, ...warnings]}
  if (opts.formats.includes('json')) files.push(jsonFile(final))
  if (opts.formats.includes('md')) {
    const mdPath = outputFile(path, outDir, 'md')
    const stem = basename(mdPath, '.md')
    const md = reportToMarkdown(report.document, (n) => `${stem}.fig${n}.svg`)
    files.push([mdPath, md.markdown], ...md.figures.map((f): [string, string] => [join(dirname(mdPath), f.name), f.svg]))
  }
  return writeAll(final, files)
}
