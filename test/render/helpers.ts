/**
 * Test helpers for `src/render`: the DejaVu fonts and the standard theme read from disk,
 * a report tree built from Markdown with remark (+gfm), and a PDF read back with pdfjs.
 */
import {readFileSync} from 'node:fs'
import {createRequire} from 'node:module'
import {dirname, join, resolve} from 'node:path'
import type {Root, RootContent} from 'mdast'
import {getDocument} from 'pdfjs-dist/legacy/build/pdf.mjs'
import remarkGfm from 'remark-gfm'
import remarkParse from 'remark-parse'
import {unified} from 'unified'
import type {DocumentMeta} from '../../src/note/types.js'
import {parseTheme, type FontSet, type Theme} from '../../src/render/pdf/index.js'
import type {CoverSummary, CoverVerdict, ReportDocument, Verdict} from '../../src/report/types.js'

const ROOT = resolve(import.meta.dirname, '..', '..')

export function fontSet(): FontSet {
  const require = createRequire(import.meta.url)
  const dir = join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf')
  const read = (f: string): Uint8Array => new Uint8Array(readFileSync(join(dir, f)))
  return {
    regular: read('DejaVuSans.ttf'),
    bold: read('DejaVuSans-Bold.ttf'),
    italic: read('DejaVuSans-Oblique.ttf'),
    boldItalic: read('DejaVuSans-BoldOblique.ttf'),
    mono: read('DejaVuSansMono.ttf'),
    monoBold: read('DejaVuSansMono-Bold.ttf'),
  }
}

export function themeJson(): Record<string, unknown> {
  return JSON.parse(readFileSync(join(ROOT, 'templates/standard/theme.json'), 'utf8')) as Record<string, unknown>
}

export function standardTheme(): Theme {
  return parseTheme(themeJson())
}

export function markdown(md: string): Root {
  const processor = unified().use(remarkParse).use(remarkGfm)
  return processor.runSync(processor.parse(md)) as Root
}

export function templateText(name: 'signoff.md' | 'closing.md'): string {
  return readFileSync(join(ROOT, 'templates/standard', name), 'utf8')
}

export function meta(overrides: Partial<DocumentMeta> = {}): DocumentMeta {
  return {
    title: 'Bridge front end of the invented scale WX-7',
    document: 'DR-0042',
    revision: 'B',
    date: '2026-03-14',
    author: 'Ada Kestrel',
    reviewers: [{name: 'Tomas Vell', role: 'Reviewer'}, {name: 'Ines Marlow', role: 'Approver'}],
    project: 'Weigh-cell concept',
    status: 'for-review',
    context: [],
    template: null,
    ...overrides,
  }
}

export interface ReportParts {
  meta?: DocumentMeta
  body?: string
  bodyNodes?: RootContent[]
  appendix?: string
  verdicts?: CoverVerdict[]
  overall?: Verdict
}

/** A cover summary for hand-made verdict rows: every row counted, no notes or archetypes. */
export function coverOf(verdicts: CoverVerdict[], overall: Verdict, extra: Partial<CoverSummary> = {}): CoverSummary {
  const counted = verdicts.filter((v) => v.counted)
  return {
    verdicts, overall, baseline: [], archetypes: [], notes: [],
    counted: {stages: new Set(counted.map((v) => v.stage)).size, chains: 0, requirements: counted.length, notMet: counted.filter((v) => v.verdict === 'not-met').length},
    ...extra
  }
}

export function report(parts: ReportParts): ReportDocument {
  const body = markdown(parts.body ?? '')
  body.children.push(...(parts.bodyNodes ?? []))
  return {
    meta: parts.meta ?? meta(),
    cover: coverOf(parts.verdicts ?? [], parts.overall ?? 'not-evaluated'),
    body,
    appendix: markdown(parts.appendix ?? ''),
    closing: markdown(`${templateText('signoff.md')}\n\n${templateText('closing.md')}`),
    sourceSha256: '0'.repeat(64),
    toolVersion: '0.0.0-test',
  }
}

export interface ReadBack {
  numPages: number
  /** Text of each page, items joined by spaces, NFKC-normalised. */
  pages: string[]
  outline: {title: string; items: {title: string; items: unknown[]}[]}[]
  links: string[]
  title: string
}

export const nfkc = (s: string): string => s.normalize('NFKC')

export async function readPdf(bytes: Uint8Array): Promise<ReadBack> {
  const pdf = await getDocument({data: bytes.slice(), useSystemFonts: false, disableFontFace: true}).promise
  const pages: string[] = []
  const links: string[] = []
  for (let i = 1; i <= pdf.numPages; i++) {
    const page = await pdf.getPage(i)
    const content = await page.getTextContent()
    const text = content.items.map((item) => ('str' in item ? item.str : '')).join(' ')
    pages.push(nfkc(text).replace(/\s+/g, ' '))
    for (const a of await page.getAnnotations()) {
      const url = (a as {url?: unknown}).url
      if (typeof url === 'string') links.push(url)
    }
  }
  const outline = ((await pdf.getOutline()) ?? []) as ReadBack['outline']
  const info = (await pdf.getMetadata()).info as {Title?: string}
  const result = {numPages: pdf.numPages, pages, outline, links, title: info.Title ?? ''}
  await pdf.destroy()
  return result
}
