import {describe, expect, it} from 'vitest'
import {loopGainSpec, NO_CROSSOVER_TEXT} from '../../../src/report/charts/loop-gain.js'
import {renderChartSvg} from '../../../src/render/chart/vega.js'
import {FONTS, stability, stageCurves, svgTexts} from './helpers.js'

const textsOf = async (s = stability()) => svgTexts((await renderChartSvg(loopGainSpec(stageCurves(), s), FONTS)).svg).map((t) => t.text)

describe('loopGainSpec()', () => {
  it('renders without warnings', async () => {
    expect((await renderChartSvg(loopGainSpec(stageCurves(), stability()), FONTS)).warnings).toEqual([])
  })

  it('titles the magnitude, phase and frequency axes with units', async () => {
    expect(await textsOf()).toEqual(expect.arrayContaining(['Loop gain |T| (dB)', 'Phase of T (°)', 'Frequency (Hz)']))
  })

  it('shows the frequency axis once, with SI decade ticks', async () => {
    const texts = await textsOf()
    expect(texts).toEqual(expect.arrayContaining(['1', '10', '1k', '100k', '1M', '100M']))
    expect(texts.filter((t) => t === '1M')).toHaveLength(1)
  })

  it('labels the crossover with its frequency', async () => {
    const fc = stability().crossover as number
    expect(await textsOf()).toContain(`fc = ${(fc / 1e3).toPrecision(3)} kHz`)
  })

  it('labels the phase margin to 0.1°', async () => {
    const pm = stability().phaseMargin as number
    expect(await textsOf()).toContain(`PM = ${pm.toFixed(1)}°`)
  })

  it('prints negative phase ticks with the minus sign U+2212', async () => {
    expect(await textsOf()).toEqual(expect.arrayContaining(['\u221290', '\u2212180']))
  })

  it('says "no crossover" and marks nothing when there is none', async () => {
    const texts = await textsOf({...stability(), crossover: null, phaseMargin: null})
    expect(texts).toContain(NO_CROSSOVER_TEXT)
    expect(texts.some((t) => t.startsWith('fc =') || t.startsWith('PM ='))).toBe(false)
  })

  it('prints a negative phase margin with U+2212', async () => {
    expect(await textsOf({...stability(), phaseMargin: -12.34})).toContain('PM = \u221212.3°')
  })
})
