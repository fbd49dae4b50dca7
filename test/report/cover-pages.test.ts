/**
 * The cover and sign-off fit on one page: every sample (the reference buffer's ten verdict
 * rows, the chain's thirteen and the two-stage load cell included, their open notes and
 * archetype lines with them) and the starting note of every topology. Read back with pdfjs:
 * the closing statements are on page 1 and the body starts on page 2. A cover too long for
 * one page still flows on (test/render/flow.test.ts).
 * The load-cell sample's calibration code block is not split across pages.
 */
import {describe, expect, it} from 'vitest'
import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import {readPdf} from '../render/helpers.js'
import {pdfOf, ROOT} from './helpers.js'

const NOTES = [
  ...readdirSync(join(ROOT, 'sample-designs')).filter((f) => f.endsWith('.md')).map((f) => join(ROOT, 'sample-designs', f)),
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

describe('the load-cell sample’s calibration code', () => {
  it('stays on one page with the paragraph that introduces it', async () => {
    const pages = (await readPdf((await pdfOf(join(ROOT, 'sample-designs', 'load-cell-bridge.md'))).pdf)).pages
    const intro = pages.findIndex((p) => p.includes('The firmware applies the calibration below'))
    expect(intro).toBeGreaterThan(0)
    expect(pages[intro]).toContain('counts_zero = adc_average(64);')
    expect(pages[intro]).toContain('grams = (raw - counts_zero)')
  }, 60_000)
})
