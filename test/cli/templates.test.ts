import {describe, expect, it} from 'vitest'
import {readFileSync} from 'node:fs'
import {join} from 'node:path'
import {getDocument} from 'pdfjs-dist/legacy/build/pdf.mjs'
import {runCli, tempNotes} from './helpers.js'
import {DEFAULT_TEMPLATE_OPTIONS, templateOptionsOf} from '../../src/cli/resources.js'

const note = (template: string | null): string =>
  `---\ntitle: Page size\ndate: 2026-11-30\n${template === null ? '' : `template: ${template}\n`}---\n\n# Hello\n\nProse only.\n`

async function pageSize(pdf: Uint8Array): Promise<number[]> {
  const doc = await getDocument({data: pdf, useSystemFonts: false, disableFontFace: true}).promise
  const view = (await doc.getPage(1)).view.map((v) => Math.round(v * 100) / 100)
  await doc.destroy()
  return view
}

describe('templates', () => {
  // Page sizes in points: A4 is 210 × 297 mm (ISO 216), Letter 8.5 × 11 in (from memory).
  it.each([
    ['the standard template (A4)', null, [0, 0, 595.28, 841.89]],
    ['the letter template (US Letter)', 'letter', [0, 0, 612, 792]]
  ])('%s sets the page size', async (_name, template, expected) => {
    const dir = tempNotes({'n.md': note(template)})
    expect(runCli(['build', join(dir, 'n.md')]).status).toBe(0)
    expect(await pageSize(new Uint8Array(readFileSync(join(dir, 'n.pdf'))))).toEqual(expected)
  })
})

/** Every page's text of a PDF, read back with pdfjs. */
async function pagesOf(pdf: Uint8Array): Promise<string[]> {
  const doc = await getDocument({data: pdf, useSystemFonts: false, disableFontFace: true}).promise
  const pages: string[] = []
  for (let i = 1; i <= doc.numPages; i++) {
    const items = (await (await doc.getPage(i)).getTextContent()).items
    pages.push(items.map((it) => ('str' in it ? it.str : '')).join(' ').replace(/\s+/g, ' '))
  }
  await doc.destroy()
  return pages
}

describe('the appendix option', () => {
  const sample = readFileSync(join(import.meta.dirname, '..', '..', 'sample-designs', 'reference-buffer.md'), 'utf8')
  const withTemplate = (t: string | null): string => (t === null ? sample : sample.replace(/^---\n/, `---\ntemplate: ${t}\n`))
  it('short (the short-appendix template) prints one page of method with the full method’s sources', async () => {
    const dir = tempNotes({'short.md': withTemplate('short-appendix'), 'full.md': withTemplate(null)})
    expect(runCli(['build', join(dir, 'short.md'), join(dir, 'full.md')]).status).toBe(0)
    const short = await pagesOf(new Uint8Array(readFileSync(join(dir, 'short.pdf'))))
    const full = await pagesOf(new Uint8Array(readFileSync(join(dir, 'full.pdf'))))
    const s = short.findIndex((p) => p.includes('Appendix A — Method in brief'))
    expect(s).toBeGreaterThan(0)
    // The method in brief and its sources share one page; Appendix B follows on the next.
    expect(short[s]).toContain('Sources')
    expect(short[s]).toContain('J. B. Johnson')
    expect(short[s]).toContain('IEC 60063')
    expect(short[s]).toContain('R. L. Burden and J. D. Faires')
    expect(short[s + 1]).toContain('Appendix B — Assumptions and defaults')
    expect(short.join(' ')).not.toContain('Topology terms at DC')
    // The full method runs over several pages and carries the same sources.
    const f = full.findIndex((p) => p.includes('Appendix A — Method'))
    const fb = full.findIndex((p) => p.includes('Appendix B — Assumptions and defaults'))
    expect(full[f]).toContain('Topology terms at DC')
    expect(fb - f).toBeGreaterThanOrEqual(3)
    expect(full.slice(f, fb + 1).join(' ')).toContain('J. B. Johnson')
    expect(short.length).toBeLessThan(full.length)
  }, 60_000)
})

describe('templateOptionsOf()', () => {
  it('reads appendix: short over the base options', () => {
    expect(templateOptionsOf('t', 'template.json', {appendix: 'short'}, DEFAULT_TEMPLATE_OPTIONS)).toEqual({appendix: 'short'})
  })
  it('keeps the base options when none are given', () => {
    expect(templateOptionsOf('t', 'template.json', undefined, {appendix: 'short'})).toEqual({appendix: 'short'})
  })
  it.each([
    [{appendix: 'tiny'}, /option appendix is "tiny" in template.json, expected "full" or "short"/],
    [{apendix: 'short'}, /unknown option `apendix` in template.json, expected `appendix`/],
    ['short', /must be a map/]
  ])('refuses %j', (json, message) => {
    expect(() => templateOptionsOf('t', 'template.json', json, DEFAULT_TEMPLATE_OPTIONS)).toThrow(message)
  })
})
