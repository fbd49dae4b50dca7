import {describe, expect, it} from 'vitest'
import {cumulativeRmsSpec} from '../../../src/report/charts/cumulative-rms.js'
import {renderChartSvg} from '../../../src/render/chart/vega.js'
import {FONTS, stageCurves, svgTexts} from './helpers.js'

const render = (curves = stageCurves()) => renderChartSvg(cumulativeRmsSpec(curves), FONTS)

describe('cumulativeRmsSpec()', () => {
  it('renders without warnings', async () => {
    expect((await render()).warnings).toEqual([])
  })

  it('titles both axes with units', async () => {
    const texts = svgTexts((await render()).svg).map((t) => t.text)
    expect(texts).toEqual(expect.arrayContaining(['Frequency', 'Cumulative output noise, rms (µV)']))
  })

  it('prints frequency ticks with their unit as engineers write them, the rms axis in µV', async () => {
    const texts = svgTexts((await render()).svg).map((t) => t.text)
    expect(texts).toEqual(expect.arrayContaining(['0.1 Hz', '1 Hz', '1 kHz', '10 kHz', '0', '2', '10']))
    expect(texts).not.toContain('100m')
    expect(texts).not.toContain('0µ')
  })

  it('prints the band total at the end of the curve', async () => {
    const curves = stageCurves()
    const total = curves.cumulativeRms[curves.cumulativeRms.length - 1] as number
    const expected = `${(total * 1e6).toPrecision(3)} µV rms`
    expect(svgTexts((await render(curves)).svg).map((t) => t.text)).toContain(expected)
  })

  it('drops frequencies a log axis cannot show instead of warning', async () => {
    const curves = stageCurves()
    curves.noiseFrequency = [0, ...curves.noiseFrequency.slice(1)]
    expect((await render(curves)).warnings).toEqual([])
  })
})
