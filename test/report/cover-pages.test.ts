/**
 * The cover and sign-off fit on one page for an ordinary note: the photodiode and
 * current-shunt samples (open notes and archetype lines included) and the starting note of every topology
 * (no open note). Read back with pdfjs: the closing statements are on page 1 and the body
 * starts on page 2. The reference-buffer, weigh-scale-chain and load-cell samples (twelve or
 * more verdict rows; the load cell has two stages) are longer than a page: its closing statements flow onto page 2, whole, before the body.
 * The load-cell sample's calibration code block is not split across pages.
 */
import {describe, expect, it} from 'vitest'
import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import {readPdf} from '../render/helpers.js'
import {pdfOf, ROOT} from './helpers.js'

/** Samples whose verdict table (twelve rows or more) makes the cover longer than a page. */
const LONG_COVERS = ['reference-buffer.md', 'weigh-scale-chain.md', 'load-cell-bridge.md']
const NOTES = [
  ...readdirSync(join(ROOT, 'sample-designs')).filter((f) => f.endsWith('.md') && !LONG_COVERS.includes(f)).map((f) => join(ROOT, 'sample-designs', f)),
  ...readdirSync(join(ROOT, 'test', 'fixtures', 'topologies')).filter((f) => f.endsWith('.md')).map((f) => join(ROOT, 'test', 'fixtures', 'topologies', f)),
].sort()

describe('the cover on one page', () => {
  it.each(NOTES)('%s', async (path) => {
    const pages = (await readPdf((await pdfOf(path)).pdf)).pages
    const cover = pages[0] ?? ''
    expect(cover).toContain('Requirement verdicts')
    expect(cover).toContain('Sign-off statement')
    expect(cover).toContain('Limits of this report')
    expect(cover).toMatch(/page 1 of \d+/)
    expect(pages[1] ?? '').not.toContain('Limits of this report')
    expect(pages[1] ?? '').not.toContain('Sign-off statement')
  }, 60_000)
})

describe('a cover longer than a page', () => {
  it.each(LONG_COVERS)('%s flows its closing statements onto page 2, whole, and the body starts on page 3', async (name) => {
    const pages = (await readPdf((await pdfOf(join(ROOT, 'sample-designs', name))).pdf)).pages
    expect(pages[0]).toContain('Requirement verdicts')
    expect(pages[1]).toContain('Limits of this report')
    expect(pages[1]).not.toContain('Purpose')
    expect(pages[2]).not.toContain('Limits of this report')
  }, 60_000)
})

describe('the load-cell sample’s calibration code', () => {
  it('stays on one page with the paragraph that introduces it', async () => {
    const pages = (await readPdf((await pdfOf(join(ROOT, 'sample-designs', 'load-cell-bridge.md'))).pdf)).pages
    const intro = pages.findIndex((p) => p.includes('The firmware applies the calibration below'))
    expect(intro).toBeGreaterThan(0)
    expect(pages[intro]).toContain('counts_zero = adc_average(64);')
    expect(pages[intro]).toContain('grams = (raw - counts_zero)')
  }, 60_000)
})
