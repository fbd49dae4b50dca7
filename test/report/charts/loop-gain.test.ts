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

  it('shows the frequency axis once, with decade ticks in Hz, kHz and MHz', async () => {
    const texts = await textsOf()
    expect(texts).toEqual(expect.arrayContaining(['1 Hz', '10 Hz', '1 kHz', '100 kHz', '1 MHz', '100 MHz']))
    expect(texts.filter((t) => t === '1 MHz')).toHaveLength(1)
  })

  it('ticks the phase axis at multiples of 45°, −180° and 0° among them', async () => {
    const spec = loopGainSpec(stageCurves(), stability()) as unknown as {vconcat: {layer: {encoding?: {y?: {axis?: {values?: number[]}}}}[]}[]}
    const ticks = spec.vconcat[1]!.layer[0]!.encoding!.y!.axis!.values!
    expect(ticks).toContain(-180)
    expect(ticks).toContain(0)
    for (const t of ticks) expect(Math.abs(t % 45)).toBe(0)
  })

  it('leaves headroom above the |T| trace for the marker labels', () => {
    const spec = loopGainSpec(stageCurves(), stability()) as unknown as {vconcat: {layer: {encoding?: {y?: {scale?: {domain?: [number, number]}}}}[]}[]}
    const [, hi] = spec.vconcat[0]!.layer[0]!.encoding!.y!.scale!.domain!
    const db = stageCurves().loopGainMagnitude.map((m) => 20 * Math.log10(m))
    const peak = Math.max(...db)
    const low = Math.min(...db, 0)
    expect(hi).toBeGreaterThanOrEqual(peak + 0.2 * (peak - low))
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
