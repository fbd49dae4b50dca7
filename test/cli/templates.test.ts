import {describe, expect, it} from 'vitest'
import {readFileSync} from 'node:fs'
import {join} from 'node:path'
import {getDocument} from 'pdfjs-dist/legacy/build/pdf.mjs'
import {runCli, tempNotes} from './helpers.js'

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
