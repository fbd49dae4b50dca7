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
import {buildReport} from '../report/build.js'
import {renderPdf, type FontSet} from '../render/index.js'
import {reportDate} from './dates.js'
import {diagnosticsOf, hasErrors, type Diagnostic} from './diagnostics.js'
import {readImages} from './images.js'
import {loadTemplate, type Template} from './resources.js'
import {writeAtomic} from './write.js'

export interface Resources {
  fonts: FontSet
  version: string
  /** Templates already loaded, by name. */
  templates: Map<string, Template>
}

export interface RunOptions {
  /** Write the PDF (build) or only evaluate (check). */
  pdf: boolean
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
  evaluations: StageEvaluation[]
  /** 0 all met, 1 a requirement not met, 2 could not be evaluated. */
  exitCode: 0 | 1 | 2
  /** Path of the PDF written, if any. */
  output: string | null
}

const fail = (file: string, message: string, sha = ''): NoteOutcome => ({
  file, sourceSha256: sha, diagnostics: [{severity: 'error', message, line: 1, column: 1}], evaluations: [], exitCode: 2, output: null
})

export const outputPath = (notePath: string, outDir: string | null): string =>
  join(outDir ?? dirname(notePath), `${basename(notePath, extname(notePath))}.pdf`)

async function templateFor(name: string, res: Resources): Promise<Template> {
  const known = res.templates.get(name)
  if (known) return known
  const t = await loadTemplate(name)
  res.templates.set(name, t)
  return t
}

/** Place a message for each requirement not met at its key in the block. */
function markUnmet(file: VFile, evaluations: StageEvaluation[]): void {
  for (const ev of evaluations) {
    for (const r of ev.result.requirements) {
      if (r.met) continue
      const entry = ev.block.entries.find((e) => e.key === `require.${r.key}`)
      file.message(`Requirement \`${r.key}\` of stage \`${ev.input.id}\` not met: value ${r.value ?? 'none'}, limit ${r.limit} (SI units)`,
        {place: entry ? {line: entry.line, column: entry.column} : ev.block.position?.start, ruleId: 'requirement-not-met', source: 'ampreview'})
    }
  }
}

export async function processNote(path: string, res: Resources, opts: RunOptions): Promise<NoteOutcome> {
  // 1. Read: the note must exist, be a file, and be text.
  let bytes: Buffer
  try {
    const s = await stat(path)
    if (!s.isFile()) return fail(path, `Expected a Markdown file, found a ${s.isDirectory() ? 'folder' : 'special file'}`)
    bytes = await readFile(path)
  } catch {
    return fail(path, 'File not found or not readable')
  }
  const sha = createHash('sha256').update(bytes).digest('hex')
  if (bytes.includes(0)) return fail(path, 'This is a binary file, not a Markdown note (it contains NUL bytes)', sha)
  const text = bytes.toString('utf8')
  if (text.includes('\uFFFD') && !bytes.includes(Buffer.from('\uFFFD'))) {
    return fail(path, 'The note is not valid UTF-8 text; save it as UTF-8', sha)
  }
  if (text.replace(/^\uFEFF/, '').trim() === '') return fail(path, 'The note is empty: expected Markdown prose and stage blocks', sha)
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
  const images = opts.pdf ? await readImages(parsed.tree, path, file) : new Map<string, Uint8Array>()

  let diagnostics = diagnosticsOf(file)
  if (opts.strict) diagnostics = diagnostics.map((d) => (d.severity === 'warning' && !d.message.startsWith('Requirement ') ? {...d, severity: 'error'} : d))
  const unmet = evaluations.some((ev) => ev.result.requirements.some((r) => !r.met))
  const exitCode = hasErrors(diagnostics) || template === null ? 2 : unmet ? 1 : 0
  const outcome: NoteOutcome = {file: path, sourceSha256: sha, diagnostics, evaluations, exitCode, output: null}
  if (!opts.pdf || exitCode === 2 || template === null) return outcome

  // 4. Report: the tree with each block replaced by its section.
  const report = await buildReport({
    parsed, evaluations, fonts: {regular: res.fonts.regular, bold: res.fonts.bold},
    fragments: {method: template.method, closing: template.closing},
    sourceSha256: sha, toolVersion: res.version, fileName: basename(path)
  })

  // 5. Render and write atomically.
  const rendered = await renderPdf(report.document, {
    theme: template.theme, fonts: res.fonts, images, date: reportDate(parsed.meta.date, opts.sourceDateEpoch)
  })
  const warnings = [...report.warnings, ...rendered.warnings].map((message): Diagnostic => ({severity: 'warning', message, line: 1, column: 1}))
  const target = outputPath(resolve(path), opts.outDir === null ? null : resolve(opts.outDir))
  await writeAtomic(target, rendered.pdf)
  return {...outcome, diagnostics: [...diagnostics, ...warnings], output: target}
}
