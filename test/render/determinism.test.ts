/**
 * Reproducible output: the same report, fonts and date give the same bytes, also when the
 * process time zone changes between renders (Node applies a new `process.env.TZ` at once).
 */
import {createHash} from 'node:crypto'
import {afterEach, describe, expect, it} from 'vitest'
import {renderPdf} from '../../src/render/pdf/index.js'
import {fontSet, standardTheme} from './helpers.js'
import {sampleReport} from './sample.js'

const DATE = new Date(Date.UTC(2026, 2, 14, 9, 30))
const sha = (b: Uint8Array): string => createHash('sha256').update(b).digest('hex')
const render = async (): Promise<Uint8Array> =>
  (await renderPdf(sampleReport(), {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: DATE})).pdf

describe('renderPdf() reproducibility', () => {
  const originalTz = process.env['TZ']
  afterEach(() => {
    if (originalTz === undefined) delete process.env['TZ']
    else process.env['TZ'] = originalTz
  })

  it('gives byte-identical PDFs for two renders of the same input', async () => {
    const a = await render()
    const b = await render()
    expect(a.length).toBeGreaterThan(1000)
    expect(sha(a)).toBe(sha(b))
  })

  it('gives the same bytes under a different time zone', async () => {
    process.env['TZ'] = 'UTC'
    const offsetUtc = new Date(DATE).getTimezoneOffset()
    const a = await render()
    process.env['TZ'] = 'Pacific/Chatham'
    expect(new Date(DATE).getTimezoneOffset()).not.toBe(offsetUtc)
    const b = await render()
    expect(sha(a)).toBe(sha(b))
  })

  it('changes the bytes when the date changes (the date is really used)', async () => {
    const a = await render()
    const other = await renderPdf(sampleReport(), {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(Date.UTC(2027, 0, 1))})
    expect(sha(a)).not.toBe(sha(other.pdf))
  })

  it('writes CreationDate and ModDate from the given date, in UTC', async () => {
    const text = Buffer.from(await render()).toString('latin1')
    // pdfkit writes each info value as an indirect object: `(D:…)`, `(ampreview)`.
    expect(text.match(/\(D:20260314093000Z\)/g)).toHaveLength(2)
    expect(text).toContain('(ampreview)')
    expect(text).toContain('(ampreview 0.0.0-test)')
  })
})
