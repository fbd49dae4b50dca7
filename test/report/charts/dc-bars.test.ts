import {describe, expect, it} from 'vitest'
import {dcBarsSpec} from '../../../src/report/charts/dc-bars.js'
import {renderChartSvg} from '../../../src/render/chart/vega.js'
import {FONTS, dcBudget, svgTexts} from './helpers.js'

const LABELS = {vos: 'Offset voltage', 'vos-drift': 'Offset drift', ib: 'Bias current', ios: 'Offset current',
  cmrr: 'Common-mode rejection', psrr: 'Supply rejection', 'aol-gain': 'Open-loop gain', 'resistor-tolerance': 'Resistor tolerance'}

const render = () => renderChartSvg(dcBarsSpec(dcBudget(), {labels: LABELS}), FONTS)

describe('dcBarsSpec()', () => {
  it('renders without warnings', async () => {
    expect((await render()).warnings).toEqual([])
  })

  it('titles the x axis in the prefix of its largest bar', async () => {
    expect(svgTexts((await render()).svg).map((t) => t.text)).toContain('Output-referred error (mV)')
  })

  it('keeps every contributor, the zero one included', async () => {
    const texts = svgTexts((await render()).svg).map((t) => t.text)
    for (const label of Object.values(LABELS)) expect(texts).toContain(label)
    expect(texts).toContain('0 V')
  })

  it('puts the largest contributor at the top and the zero one at the bottom', async () => {
    const texts = svgTexts((await render()).svg)
    const order = Object.values(LABELS)
      .map((label) => ({label, y: texts.find((t) => t.text === label)?.y ?? NaN}))
      .sort((a, b) => a.y - b.y)
      .map((r) => r.label)
    expect(order).toEqual(['Resistor tolerance', 'Bias current', 'Offset voltage', 'Open-loop gain',
      'Offset drift', 'Common-mode rejection', 'Supply rejection', 'Offset current'])
  })

  it('labels bar ends with an SI prefix and the volt', async () => {
    const texts = svgTexts((await render()).svg).map((t) => t.text)
    expect(texts).toEqual(expect.arrayContaining(['9 mV', '1.1 mV', '275 µV', '250 µV', '66 µV', '14 µV', '3.2 µV']))
  })

  it('prints tick labels as plain numbers in that prefix, zero as a plain 0', async () => {
    const texts = svgTexts((await render()).svg).map((t) => t.text)
    expect(texts).toEqual(expect.arrayContaining(['0', '2', '4', '10']))
    expect(texts).not.toContain('0m')
    expect(texts).not.toContain('2m')
  })

  it('falls back to the key when a label is missing', async () => {
    const chart = await renderChartSvg(dcBarsSpec(dcBudget(), {labels: {}}), FONTS)
    expect(svgTexts(chart.svg).map((t) => t.text)).toContain('resistor-tolerance')
  })

  it('draws a budget of zeros on a valid axis', async () => {
    const dc = {...dcBudget(), contributors: [{key: 'vos' as const, output: 0}, {key: 'ib' as const, output: 0}]}
    const chart = await renderChartSvg(dcBarsSpec(dc, {labels: LABELS}), FONTS)
    expect(chart.warnings).toEqual([])
    expect(svgTexts(chart.svg).filter((t) => t.text === '0 V')).toHaveLength(2)
  })

  it('fits the whole chart to one width whatever the label lengths', async () => {
    const long = {...LABELS, vos: 'Input offset voltage at 25 °C, maximum over the lot'}
    const a = await render()
    const b = await renderChartSvg(dcBarsSpec(dcBudget(), {labels: long}), FONTS)
    expect(b.width).toBe(a.width)
  })

  it('prints a long label whole, never cut with an ellipsis', async () => {
    const label = 'Input offset voltage at 25 °C, maximum over the production lot, referred to the output'
    const chart = await renderChartSvg(dcBarsSpec(dcBudget(), {labels: {...LABELS, vos: label}}), FONTS)
    expect(svgTexts(chart.svg).map((t) => t.text)).toContain(label)
    expect(chart.svg).not.toContain('\u2026')
  })
})
