/**
 * Run a note through the phases up to the report tree, or through the whole pipeline to a
 * PDF in a temporary folder, in this process.
 */
import {mkdtempSync, readFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join, resolve} from 'node:path'
import {VFile} from 'vfile'
import {parseNote} from '../../src/note/index.js'
import {evaluateNote} from '../../src/evaluate/index.js'
import {buildReport, type ReportOutput} from '../../src/report/build.js'
import {processNote, type NoteOutcome, type Resources} from '../../src/cli/pipeline.js'
import {lazyFaces, lazyFonts, loadFonts, loadTemplate} from '../../src/cli/resources.js'
import {compileFigures, type CompiledFigures} from '../../src/render/chart/compile.js'

export const ROOT = resolve(import.meta.dirname, '..', '..')
export const sample = (name: string): string => join(ROOT, 'sample-designs', name)

/** The report tree of a note file (no PDF, no chart compiled). */
export async function reportOf(path: string): Promise<ReportOutput> {
  const file = new VFile({path, value: readFileSync(path, 'utf8')})
  const parsed = parseNote(file)
  const evaluations = evaluateNote(parsed, file)
  const template = await loadTemplate('standard')
  return buildReport({
    parsed, evaluations,
    fragments: {method: template.method, closing: template.closing},
    sourceSha256: '0'.repeat(64), toolVersion: '0.0.0-test', fileName: 'note.md'
  })
}

/** The report tree of a note file and its figures compiled as the renderers compile them. */
export async function compiledReportOf(path: string): Promise<ReportOutput & {figures: CompiledFigures}> {
  const report = await reportOf(path)
  const fonts = await loadFonts()
  return {...report, figures: await compileFigures(report.document, {regular: fonts.regular, bold: fonts.bold})}
}

/** Build a note to PDF in a fresh temporary folder; returns the outcome and the PDF bytes. */
export async function pdfOf(path: string): Promise<{outcome: NoteOutcome; pdf: Uint8Array}> {
  const fonts = lazyFonts()
  const res: Resources = {fonts, faces: lazyFaces(fonts), version: '0.0.0-test', buildId: '', templates: new Map()}
  const outDir = mkdtempSync(join(tmpdir(), 'ampreview-report-'))
  const outcome = await processNote(path, res, {formats: ['pdf'], outDir, strict: false, sourceDateEpoch: undefined})
  const pdfPath = outcome.outputs.find((o) => o.endsWith('.pdf'))
  if (!pdfPath) throw new Error(`no PDF built: ${JSON.stringify(outcome.diagnostics)}`)
  return {outcome, pdf: new Uint8Array(readFileSync(pdfPath))}
}
