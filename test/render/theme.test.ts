/**
 * `parseTheme()`: the standard template's theme parses; bad fields are named in the error;
 * the page option changes the paper size.
 */
import {describe, expect, it} from 'vitest'
import {parseTheme, renderPdf} from '../../src/render/pdf/index.js'
import {fontSet, readPdf, report, themeJson} from './helpers.js'

/** The theme JSON as nested objects, to spoil one field per case. */
type Json = Record<string, Record<string, unknown>>

describe('parseTheme()', () => {
  it('reads templates/standard/theme.json (A4)', () => {
    const theme = parseTheme(themeJson())
    expect(theme.page).toBe('a4')
    expect(theme.fontSizes.body).toBeGreaterThan(0)
    expect(theme.callouts['not-met'].accent).toMatch(/^#[0-9a-f]{6}$/)
  })

  it.each([
    ['fontSizes.body', (t: Json) => { t['fontSizes']['body'] = 'big' }, /`theme\.fontSizes\.body` must be a number/],
    ['page', (t: Json) => { (t as Record<string, unknown>)['page'] = 'a5' }, /`theme\.page` must be "a4" or "letter", got "a5"/],
    ['colours.link', (t: Json) => { t['colours']['link'] = 'blue' }, /`theme\.colours\.link` must be a colour/],
    ['callouts.safety', (t: Json) => { delete t['callouts']['safety'] }, /`theme\.callouts\.safety` must be an object, got nothing/],
    ['margins.top', (t: Json) => { t['margins']['top'] = -1 }, /`theme\.margins\.top`/],
    ['unknown key', (t: Json) => { t['spacing']['gutter'] = 4 }, /unexpected key `theme\.spacing\.gutter`/],
  ])('names the bad field: %s', (_name, spoil, message) => {
    const json = themeJson() as Json
    spoil(json)
    expect(() => parseTheme(json)).toThrow(message)
  })

  it('rejects a theme that is not an object', () => {
    expect(() => parseTheme([])).toThrow(/`theme` must be an object/)
  })
})

describe('renderPdf() page size', () => {
  it.each([
    ['a4', 595.28, 841.89],
    ['letter', 612, 792],
  ])('uses %s paper', async (page, width, height) => {
    const theme = parseTheme({...themeJson(), page})
    const out = await renderPdf(report({body: '# One\n\nText.'}), {theme, fonts: fontSet(), images: new Map(), date: new Date(0)})
    const {getDocument} = await import('pdfjs-dist/legacy/build/pdf.mjs')
    const pdf = await getDocument({data: out.pdf.slice(), useSystemFonts: false, disableFontFace: true}).promise
    const view = (await pdf.getPage(1)).view
    expect(view[2]).toBeCloseTo(width, 1)
    expect(view[3]).toBeCloseTo(height, 1)
    expect((await readPdf(out.pdf)).pages[1]).toContain('One')
    await pdf.destroy()
  })
})
