/**
 * Page flow: nothing is lost or orphaned when content runs past a page. A table row taller
 * than a page is split, long code and long callouts continue, headings stay with what
 * follows, figures stay whole, and no page is left without content.
 */
import {beforeAll, describe, expect, it} from 'vitest'
import {renderPdf} from '../../src/render/pdf/index.js'
import {flowReport, range} from './flow-sample.js'
import {coverOf, fontSet, readPdf, standardTheme, type ReadBack} from './helpers.js'

/** Numbers k for which `prefix + k` occurs as a whole word, in order of appearance. */
function found(text: string, prefix: string): number[] {
  return [...text.matchAll(new RegExp(`\\b${prefix}(\\d+)\\b`, 'g'))].map((m) => Number(m[1]))
}

describe('renderPdf() page flow', () => {
  let pdf: ReadBack
  let pageCount = 0
  const all = (): string => pdf.pages.join(' ')

  beforeAll(async () => {
    const out = await renderPdf(flowReport(), {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(0)})
    pageCount = out.pageCount
    pdf = await readPdf(out.pdf)
  })

  it('splits a table row taller than a page without losing a word', () => {
    expect(found(all(), 'w')).toEqual(range(2500))
  })

  it('repeats the header on the page a split row continues on', () => {
    const pages = pdf.pages.filter((t) => /\bw\d+\b/.test(t))
    expect(pages.length).toBeGreaterThanOrEqual(3)
    for (const p of pages) expect(p).toMatch(/Key Long cell/)
  })

  it('keeps the row after a split row', () => {
    expect(all()).toMatch(/after short/)
  })

  it('continues a long code block across pages, every line in order', () => {
    expect(found(all(), 'line')).toEqual(range(150))
    expect(pdf.pages.filter((t) => /\bline\d+ =/.test(t)).length).toBeGreaterThanOrEqual(2)
  })

  it('continues a long block quote across pages', () => {
    expect(found(all(), 'q')).toEqual(range(700))
  })

  it('flows a callout longer than a page, label and all text kept', () => {
    expect(all()).toContain('SAFETY')
    expect(found(all(), 'c')).toEqual(range(900))
  })

  it.each(range(24))('keeps heading "Section %i" on the page of its first paragraph', (k) => {
    const page = pdf.pages.find((t) => new RegExp(`Section ${k}\\b`).test(t))
    expect(page).toBeDefined()
    expect(page).toMatch(new RegExp(`Bodytext${k}\\b`))
  })

  it.each(range(4))('keeps figure %i whole on one page with its caption', (k) => {
    const page = pdf.pages.find((t) => t.includes(`FigTop${k}`))
    expect(page).toContain(`FigEnd${k}`)
    expect(page).toContain(`Figure ${k} — Chart ${k}`)
  })

  it('leaves no page with only header and footer', () => {
    expect(pdf.numPages).toBe(pageCount)
    pdf.pages.forEach((text, i) => {
      const rest = text
        .replace(`page ${i + 1} of ${pageCount}`, '')
        .replace('Bridge front end of the invented scale WX-7', '')
        .replace(/DR-0042 · Rev B/, '')
        .replace('Rev B · For review', '')
      expect(rest.trim().length).toBeGreaterThan(10)
    })
  })
})

describe('renderPdf() cover overflow', () => {
  it('flows a long verdict table onto the next page, header repeated, body after it', async () => {
    const verdicts = range(45).map((k) => ({stage: `stage-${k}`, requirement: 'noise-rms', value: `${k} µV`, limit: '≤ 30 µV', verdict: k > 30 ? 'not-met' as const : 'met' as const, counted: true}))
    const doc = {...flowReport(), cover: coverOf(verdicts, 'not-met')}
    doc.body = {type: 'root', children: [{type: 'heading', depth: 1, children: [{type: 'text', value: 'Body starts'}]}]}
    const out = await renderPdf(doc, {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(0)})
    const pdf = await readPdf(out.pdf)
    const all = pdf.pages.join(' ')
    for (const k of range(45)) expect(all).toMatch(new RegExp(`stage-${k} noise-rms`))
    const last = pdf.pages.findIndex((t) => t.includes('stage-45'))
    expect(last).toBeGreaterThanOrEqual(1)
    expect(pdf.pages[last]).toContain('Stage Requirement Value Limit Verdict')
    const closing = pdf.pages.findIndex((t) => t.includes('Limits of this report'))
    const body = pdf.pages.findIndex((t) => t.includes('Body starts'))
    expect(body).toBe(closing + 1)
    expect(all).toContain('Overall: 15 of the 45 requirements of 45 stages not met')
  })
})
