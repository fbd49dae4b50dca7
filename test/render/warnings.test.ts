/**
 * What `renderPdf()` warns about, and what it prints instead: missing glyphs, missing or
 * unreadable images, unknown nodes, external images inside an SVG, dangling footnotes.
 * Also that a real PNG is embedded.
 */
import {deflateSync, crc32} from 'node:zlib'
import type {RootContent} from 'mdast'
import {describe, expect, it} from 'vitest'
import {renderPdf, type RenderOutput} from '../../src/render/pdf/index.js'
import {fontSet, readPdf, report, standardTheme} from './helpers.js'

async function render(body: string, nodes: RootContent[] = [], images = new Map<string, Uint8Array>()): Promise<RenderOutput> {
  return renderPdf(report({body, bodyNodes: nodes}), {theme: standardTheme(), fonts: fontSet(), images, date: new Date(0)})
}

const bodyText = async (out: RenderOutput): Promise<string> => (await readPdf(out.pdf)).pages.slice(1).join(' ')

/** A w × h RGB PNG of one colour (no alpha), built with zlib. */
function png(w: number, h: number): Uint8Array {
  const chunk = (type: string, data: Buffer): Buffer => {
    const head = Buffer.from(type, 'latin1')
    const len = Buffer.alloc(4)
    len.writeUInt32BE(data.length)
    const crc = Buffer.alloc(4)
    crc.writeUInt32BE(crc32(Buffer.concat([head, data])))
    return Buffer.concat([len, head, data, crc])
  }
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(w, 0)
  ihdr.writeUInt32BE(h, 4)
  ihdr.set([8, 2, 0, 0, 0], 8)
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(w * 3, 0x5a)])
  const raw = Buffer.concat(Array.from({length: h}, () => row))
  const sig = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])
  return new Uint8Array(Buffer.concat([sig, chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', Buffer.alloc(0))]))
}

describe('renderPdf() warnings', () => {
  it('replaces a character DejaVu lacks by "?" and warns once', async () => {
    const out = await render('Label 中 and again 中.')
    expect(out.warnings).toEqual(['U+4E2D not in DejaVu Sans'])
    expect(await bodyText(out)).toContain('Label ? and again ?.')
  })

  it('checks glyphs against the font used (mono for inline code)', async () => {
    const out = await render('Code `x中`.')
    expect(out.warnings).toEqual(['U+4E2D not in DejaVu Sans Mono'])
  })

  it('prints a framed placeholder with the alt text for a missing image', async () => {
    const out = await render('![Board photo](images/board.png)')
    expect(out.warnings).toEqual(['Image `images/board.png` was not found: a placeholder was printed'])
    expect(await bodyText(out)).toContain('Image not available: Board photo — images/board.png')
  })

  it('prints a placeholder for bytes that are not PNG or JPEG', async () => {
    const out = await render('![Scan](scan.png)', [], new Map([['scan.png', new Uint8Array([1, 2, 3, 4])]]))
    expect(out.warnings[0]).toMatch(/`scan\.png` could not be used \(only PNG and JPEG images are supported\)/)
  })

  it('embeds a PNG given in the image map, without a warning', async () => {
    const out = await render('Before.\n\n![Bench setup](bench.png)\n\nAfter.', [], new Map([['bench.png', png(40, 20)]]))
    expect(out.warnings).toEqual([])
    expect(Buffer.from(out.pdf).toString('latin1')).toMatch(/\/Subtype \/Image/)
    expect(await bodyText(out)).toMatch(/Before\. After\./)
  })

  it('prints the text of an unknown node and warns', async () => {
    const odd = {type: 'gadget', children: [{type: 'text', value: 'gadget text'}]} as unknown as RootContent
    const out = await render('', [odd])
    expect(out.warnings).toEqual(['Unknown node `gadget`: printed as plain text'])
    expect(await bodyText(out)).toContain('gadget text')
  })

  it('refuses an external image inside an SVG figure', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="100" height="50">' +
      '<image x="0" y="0" width="10" height="10" xlink:href="/etc/hostname"/><text x="5" y="40">Plot</text></svg>'
    const out = await render('', [{type: 'figure', number: 3, caption: 'Outside', svg, width: 100, height: 50}])
    expect(out.warnings).toContain('Figure 3: external image `/etc/hostname` in SVG refused (data: URLs only)')
    expect(await bodyText(out)).toContain('Plot')
  })

  it('warns about a footnote reference without a definition', async () => {
    // remark leaves an undefined `[^x]` as text, so the reference is built by hand.
    const para: RootContent = {type: 'paragraph', children: [{type: 'text', value: 'Text'}, {type: 'footnoteReference', identifier: 'nowhere', label: 'nowhere'}]}
    const out = await render('', [para])
    expect(out.warnings).toEqual(['Footnote [^nowhere] has no definition'])
    expect(await bodyText(out)).toMatch(/Text ?1/)
  })

  it('draws every callout kind with its label', async () => {
    const kinds = ['info', 'caution', 'warning', 'safety', 'met', 'not-met', 'not-evaluated'] as const
    const nodes: RootContent[] = kinds.map((severity) => ({type: 'callout', severity, label: `LABEL-${severity}`, children: []}))
    const out = await render('', nodes)
    expect(out.warnings).toEqual([])
    const text = await bodyText(out)
    for (const k of kinds) expect(text).toContain(`LABEL-${k}`)
  })

  it('prints two blank sign-off rows when there are no reviewers', async () => {
    const doc = report({body: 'x'})
    doc.meta.reviewers = []
    const out = await renderPdf(doc, {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(0)})
    const cover = (await readPdf(out.pdf)).pages[0] ?? ''
    expect(cover).toMatch(/Prepared by Ada Kestrel Reviewer Approver/)
  })

  it('keeps a title with an ampersand in the metadata', async () => {
    const doc = report({body: 'x'})
    doc.meta.title = 'Offset & drift <review>'
    const out = await renderPdf(doc, {theme: standardTheme(), fonts: fontSet(), images: new Map(), date: new Date(0)})
    expect((await readPdf(out.pdf)).title).toBe('Offset & drift <review>')
  })
})

describe('renderPdf() figure glyphs', () => {
  it('warns about a character in SVG text that DejaVu lacks', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="50"><text x="5" y="40">Axis &#x4E2D; &amp; µ</text></svg>'
    const out = await render('', [{type: 'figure', number: 2, caption: 'Glyphs', svg, width: 100, height: 50}])
    expect(out.warnings).toEqual(['U+4E2D not in DejaVu Sans'])
  })
})
