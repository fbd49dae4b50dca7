import {describe, expect, it} from 'vitest'
import type {TopLevelSpec} from 'vega-lite'
import * as vega from 'vega'
import {renderChartSvg} from '../../../src/render/chart/vega.js'
import {CHART_CONFIG} from '../../../src/report/charts/theme.js'
import {measureText} from '../../../src/report/charts/fonts.js'
import {FONTS, svgTexts} from './helpers.js'

/** One left-aligned text mark: the SVG's width follows the text's measured width. */
const textSpec = (text: string): TopLevelSpec => ({
  config: {...CHART_CONFIG, padding: 0},
  data: {values: [{t: text}]},
  mark: {type: 'text', align: 'left', baseline: 'top', fontSize: 20},
  encoding: {text: {field: 't', type: 'nominal'}, x: {value: 0}, y: {value: 0}}
})

const pointSpec: TopLevelSpec = {
  config: CHART_CONFIG,
  width: 120,
  height: 80,
  data: {values: [{x: 1, y: 2}, {x: 3, y: 5}]},
  mark: 'point',
  encoding: {x: {field: 'x', type: 'quantitative'}, y: {field: 'y', type: 'quantitative'}}
}

describe('renderChartSvg()', () => {
  it('returns an SVG whose width and height match its own attributes', async () => {
    const chart = await renderChartSvg(pointSpec, FONTS)
    expect(chart.svg.startsWith('<svg')).toBe(true)
    const root = /<svg\b[^>]*>/.exec(chart.svg)?.[0] ?? ''
    expect(root).toContain(`width="${chart.width}"`)
    expect(root).toContain(`height="${chart.height}"`)
    expect(chart.width).toBeGreaterThan(120)
    expect(chart.warnings).toEqual([])
  })

  it('gives the same SVG string for the same spec', async () => {
    const a = await renderChartSvg(pointSpec, FONTS)
    const b = await renderChartSvg(pointSpec, FONTS)
    expect(b.svg).toBe(a.svg)
  })

  it('gives the same results when renders overlap as when they run one by one', async () => {
    const one = (await renderChartSvg(textSpec('WWWW'), FONTS)).svg
    const two = (await renderChartSvg(textSpec('iiii'), FONTS)).svg
    const both = await Promise.all([renderChartSvg(textSpec('WWWW'), FONTS), renderChartSvg(textSpec('iiii'), FONTS)])
    expect(both.map((c) => c.svg)).toEqual([one, two])
  })

  it("puts vega's own text metric and random source back, even while a render is still running", async () => {
    const runtime = vega as unknown as {textMetrics: {width: unknown}; random: unknown}
    const metric = runtime.textMetrics.width
    const random = runtime.random
    let done = false
    const pending = renderChartSvg(textSpec('WWWW'), FONTS).finally(() => { done = true })
    // Between any two steps of the render, nothing of it is installed.
    let ticks = 0
    while (!done) {
      expect(runtime.textMetrics.width).toBe(metric)
      expect(runtime.random).toBe(random)
      await (ticks++ % 2 === 0 ? Promise.resolve() : new Promise((r) => setImmediate(r)))
    }
    expect((await pending).warnings).toEqual([])
    expect(ticks).toBeGreaterThan(1)
    expect(runtime.textMetrics.width).toBe(metric)
    expect(runtime.random).toBe(random)
  })

  it('lays text out with the DejaVu advance widths, not a per-character estimate', async () => {
    const wide = await renderChartSvg(textSpec('WWWW'), FONTS)
    const narrow = await renderChartSvg(textSpec('iiii'), FONTS)
    // A per-character estimate would give both strings the same width.
    expect(wide.width - narrow.width).toBeGreaterThan(30)
    expect(wide.width).toBe(Math.ceil(measureText(FONTS, 'regular', 20, 'WWWW')))
  })

  it('refuses a spec that loads data from a file', async () => {
    const spec: TopLevelSpec = {data: {url: '/etc/passwd', format: {type: 'csv'}}, mark: 'point'}
    await expect(renderChartSvg(spec, FONTS)).rejects.toThrow(/charts never load files or URLs \(asked for \/etc\/passwd\)/)
  })

  it('refuses a spec that loads data from a URL', async () => {
    const spec: TopLevelSpec = {data: {url: 'https://example.com/data.json'}, mark: 'point'}
    await expect(renderChartSvg(spec, FONTS)).rejects.toThrow(/charts never load files or URLs/)
  })

  it('returns the warning vega logs for a zero on a log scale', async () => {
    const spec: TopLevelSpec = {
      config: CHART_CONFIG,
      data: {values: [{x: 1, y: 0}, {x: 2, y: 3}]},
      mark: 'line',
      encoding: {x: {field: 'x', type: 'quantitative'}, y: {field: 'y', type: 'quantitative', scale: {type: 'log'}}}
    }
    const chart = await renderChartSvg(spec, FONTS)
    expect(chart.warnings).toEqual([expect.stringMatching(/^Log scale domain includes zero/)])
  })

  it('returns vega-lite compile warnings too', async () => {
    const spec: TopLevelSpec = {
      data: {values: [{a: 'x'}]},
      mark: 'bar',
      encoding: {x: {field: 'a', type: 'nominal'}, shape: {field: 'a', type: 'nominal'}}
    }
    const chart = await renderChartSvg(spec, FONTS)
    expect(chart.warnings.some((w) => /shape/i.test(w))).toBe(true)
  })

  it('uses only the font family of the config', async () => {
    const chart = await renderChartSvg(pointSpec, FONTS)
    const families = new Set([...chart.svg.matchAll(/font-family="([^"]*)"/g)].map((m) => m[1]))
    expect([...families]).toEqual(['DejaVu Sans'])
    expect(svgTexts(chart.svg).length).toBeGreaterThan(0)
  })
})

describe('renderChartSvg() on a broken spec', () => {
  it('rejects an expression vega cannot parse', async () => {
    const spec: TopLevelSpec = {data: {values: [{a: 1}]}, transform: [{calculate: 'datum.a +', as: 'b'}], mark: 'point'}
    await expect(renderChartSvg(spec, FONTS)).rejects.toThrow()
  })
})
