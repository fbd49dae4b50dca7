import {describe, expect, it} from 'vitest'
import type {TopLevelSpec} from 'vega-lite'
import * as charts from '../../../src/report/charts/index.js'
import {renderChartSvg} from '../../../src/render/chart/vega.js'
import {FONTS, dcBudget, stability, stageCurves} from './helpers.js'

const SPECS: [string, () => TopLevelSpec][] = [
  ['dc bars', () => charts.dcBarsSpec(dcBudget(), {labels: {}})],
  ['noise density', () => charts.noiseDensitySpec(stageCurves(), {labels: {}}).spec],
  ['cumulative rms', () => charts.cumulativeRmsSpec(stageCurves())],
  ['loop gain', () => charts.loopGainSpec(stageCurves(), stability())],
  ['yield histogram', () => charts.yieldHistogramSpec({top: 2e-3, counts: [5, 40, 30, 10, 4, 1, 0, 0], limits: [{label: 'output-error', value: 1.5e-3}], worstCase: 1.9e-3})],
  ['variance shares', () => charts.varianceSharesSpec([{label: 'Offset voltage (vos)', share: 0.7}, {label: 'rf tolerance', share: 0.3}])],
  ['loop gain without crossover', () => charts.loopGainSpec(stageCurves(), {...stability(), crossover: null, phaseMargin: null})]
]

describe('chart SVG', () => {
  it.each(SPECS)('%s: contains no NaN or Infinity', async (_, spec) => {
    const {svg} = await renderChartSvg(spec(), FONTS)
    expect(svg).not.toMatch(/NaN|Infinity/)
  })

  it.each(SPECS)('%s: names only DejaVu Sans as font family', async (_, spec) => {
    const {svg} = await renderChartSvg(spec(), FONTS)
    expect(new Set([...svg.matchAll(/font-family="([^"]*)"/g)].map((m) => m[1]))).toEqual(new Set(['DejaVu Sans']))
  })

  it.each(SPECS)('%s: is the same string on a second render', async (_, spec) => {
    const a = await renderChartSvg(spec(), FONTS)
    const b = await renderChartSvg(spec(), FONTS)
    expect(b.svg).toBe(a.svg)
  })

  it.each(SPECS)('%s: is about 530 px wide, to print text near 9 pt on an A4 column', async (_, spec) => {
    const {width} = await renderChartSvg(spec(), FONTS)
    expect(width).toBeGreaterThan(480)
    expect(width).toBeLessThan(600)
  })
})

describe('src/report/charts', () => {
  it('exposes the public api', () => {
    expect(Object.keys(charts).sort()).toEqual([
      'CHART_CONFIG', 'CHART_FONT_FAMILY', 'CHART_WIDTH', 'NOISE_STYLES', 'NO_CROSSOVER_TEXT', 'TOTAL_LABEL', 'TOTAL_STYLE',
      'chainDiagramSpec', 'chainNoiseDensitySpec', 'cumulativeRmsSpec', 'dcBarsSpec', 'faceOfWeight', 'hasGlyphs', 'loopGainSpec',
      'measureText', 'noiseDensitySpec', 'responseSpec', 'stageStyle', 'stagesUnderTotal', 'varianceSharesSpec', 'yieldHistogramSpec'
    ])
  })
})
