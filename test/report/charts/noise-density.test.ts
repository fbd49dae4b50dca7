import {describe, expect, it} from 'vitest'
import {coincidingCurves, noiseDensitySpec, TOTAL_LABEL, ZERO_SIGNAL_LABEL} from '../../../src/report/charts/noise-density.js'
import {NOISE_STYLES, TOTAL_STYLE} from '../../../src/report/charts/theme.js'
import {NOISE_KEYS} from '../../../src/engine/types.js'
import {renderChartSvg} from '../../../src/render/chart/vega.js'
import {FONTS, attributeValues, stageCurves, svgTexts} from './helpers.js'

const LABELS = {en: 'Voltage noise', 'in+': 'Current noise +', 'in-': 'Current noise −', 'r:rf': 'Rf thermal', 'r:rg': 'Rg thermal'}

const chartOf = (curves = stageCurves(), minShare?: number) =>
  noiseDensitySpec(curves, minShare === undefined ? {labels: LABELS} : {labels: LABELS, minShare})

describe('noiseDensitySpec()', () => {
  it('omits zero contributors and those under 0.1 % of the total everywhere', () => {
    // Every key without a curve in the fixture is omitted too (the fixture draws en, in-, rf, rg; in+ is tiny).
    expect(chartOf().omitted).toEqual(NOISE_KEYS.filter((k) => !['en', 'in-', 'r:rf', 'r:rg'].includes(k)))
  })

  it('keeps a small contributor when the share is lowered', () => {
    expect(chartOf(stageCurves(), 1e-9).omitted).toEqual(NOISE_KEYS.filter((k) => !['en', 'in+', 'in-', 'r:rf', 'r:rg'].includes(k)))
  })

  it('renders without warnings', async () => {
    expect((await renderChartSvg(chartOf().spec, FONTS)).warnings).toEqual([])
  })

  it('titles both axes with units', async () => {
    const texts = svgTexts((await renderChartSvg(chartOf().spec, FONTS)).svg).map((t) => t.text)
    expect(texts).toEqual(expect.arrayContaining(['Frequency', 'Output noise density (V/√Hz)']))
  })

  it('prints decade ticks with SI prefixes on both axes', async () => {
    const texts = svgTexts((await renderChartSvg(chartOf().spec, FONTS)).svg).map((t) => t.text)
    expect(texts).toEqual(expect.arrayContaining(['0.1 Hz', '1 Hz', '10 Hz', '100 Hz', '1 kHz', '10 kHz']))
    expect(texts).not.toContain('100m')
    expect(texts).toEqual(expect.arrayContaining(['1n', '10n', '100n', '1µ']))
  })

  it('names the kept contributors and the total in the legend, not the omitted ones', async () => {
    const texts = svgTexts((await renderChartSvg(chartOf().spec, FONTS)).svg).map((t) => t.text)
    expect(texts).toEqual(expect.arrayContaining(['Voltage noise', 'Current noise −', 'Rf thermal', 'Rg thermal', TOTAL_LABEL]))
    expect(texts).not.toContain('Current noise +')
  })

  it('tells lines apart by dash as well as colour', async () => {
    const svg = (await renderChartSvg(chartOf().spec, FONTS)).svg
    const dashes = attributeValues(svg, 'stroke-dasharray')
    for (const key of ['en', 'in-', 'r:rf', 'r:rg'] as const) expect(dashes).toContain(NOISE_STYLES[key].dash.join(','))
    expect(svg).toContain(`stroke="${TOTAL_STYLE.colour}" stroke-width="${TOTAL_STYLE.width}"`)
  })

  it('drops points a log axis cannot show instead of warning', async () => {
    const curves = stageCurves()
    curves.noiseDensity.en = curves.noiseDensity.en.map((v, i) => (i === 3 ? 0 : i === 5 ? -v : v))
    const chart = await renderChartSvg(noiseDensitySpec(curves, {labels: LABELS}).spec, FONTS)
    expect(chart.warnings).toEqual([])
  })

  it('refuses a total with no positive value', () => {
    const curves = stageCurves()
    curves.noiseTotal = curves.noiseTotal.map(() => 0)
    expect(() => noiseDensitySpec(curves, {labels: LABELS})).toThrow(RangeError)
  })
})

describe('coincidingCurves()', () => {
  it('names two drawn contributors that lie within 2 % of each other everywhere, and no others', () => {
    const curves = stageCurves()
    const same = curves.noiseDensity['r:rf'].map((v) => v * 1.01)
    const twin = {...curves, noiseDensity: {...curves.noiseDensity, 'r:rg': same}}
    expect(coincidingCurves(twin, ['en', 'r:rf', 'r:rg'])).toEqual([['r:rf', 'r:rg']])
    expect(coincidingCurves(curves, ['en', 'r:rf', 'r:rg'])).toEqual([])
  })
})

describe('noiseDensitySpec() with a signal-dependent source', () => {
  it('draws the zero-signal floor only when the signal\'s shot noise shows', () => {
    const plain = stageCurves()
    const series = (c: ReturnType<typeof stageCurves>): unknown[] =>
      [...new Set(((noiseDensitySpec(c, {labels: {}}).spec as {data: {values: {series: string}[]}}).data.values).map((v) => v.series))]
    expect(series(plain)).not.toContain(ZERO_SIGNAL_LABEL)
    const floor = plain.noiseTotal.map((v) => v / 2)
    expect(series({...plain, noiseTotalZeroSignal: floor})).toContain(ZERO_SIGNAL_LABEL)
  })
})
