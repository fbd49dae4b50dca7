/**
 * Cumulative output noise: the rms integrated from the band's low edge up to each frequency,
 * linear volts against log frequency, with the band's total printed at the end of the curve.
 *
 * A linear y axis shows where in the band the noise accumulates (a steep rise is the region
 * that dominates). Frequencies that a log axis cannot show (≤ 0, non-finite) are dropped.
 * Pure: returns a spec that `src/report/vega.ts` renders.
 */
import type {TopLevelSpec} from 'vega-lite'
import type {StageCurves} from '../../engine/types.js'
import {CHART_CONFIG, CHART_HEIGHT, CHART_WIDTH, FONT_SIZE, INK, TOTAL_STYLE} from './theme.js'
import {extent, logFrequencyX, plottablePoints, prefixedAxis, siTextExpr} from './scales.js'

/**
 * Spec of the cumulative-rms chart.
 *
 * @param curves
 *   The stage's curves: `noiseFrequency` (Hz) and `cumulativeRms` (V) on it.
 */
export function cumulativeRmsSpec(curves: Pick<StageCurves, 'noiseFrequency' | 'cumulativeRms'>, opts: {axisTitle?: string} = {}): TopLevelSpec {
  const points = plottablePoints(curves.noiseFrequency, curves.cumulativeRms, false)
  const xDomain = extent(points.map((p) => p.x), 'cumulative rms curve')
  const last = points[points.length - 1] as {x: number; y: number}

  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: CHART_CONFIG,
    width: CHART_WIDTH,
    height: CHART_HEIGHT,
    encoding: {
      x: logFrequencyX(xDomain),
      y: {
        field: 'rms',
        type: 'quantitative',
        scale: {zero: true, nice: true},
        axis: {...prefixedAxis(opts.axisTitle ?? 'Cumulative output noise, rms', 'V', Math.max(0, extent(points.map((p) => p.y), 'cumulative rms')[1])), grid: true, tickCount: 6}
      }
    },
    layer: [
      {
        data: {values: points.map((p) => ({f: p.x, rms: p.y}))},
        mark: {type: 'line', color: TOTAL_STYLE.colour, strokeWidth: 1.8, clip: true}
      },
      {
        data: {values: [{f: last.x, rms: last.y}]},
        transform: [{calculate: `${siTextExpr('datum.rms', 'V')} + ' rms'`, as: 'text'}],
        layer: [
          {mark: {type: 'point', shape: 'circle', filled: true, size: 28, color: INK.total}},
          {
            mark: {type: 'text', align: 'right', baseline: 'bottom', dx: -4, dy: -5, fontSize: FONT_SIZE.note, color: INK.text},
            encoding: {text: {field: 'text', type: 'nominal'}}
          }
        ]
      }
    ]
  }
}
