/**
 * A chain's cascaded output noise density, log-log: one line per stage (its part after the
 * later stages' gain) and the total as the thick black line, V/√Hz at the converter input
 * against Hz over the chain's band. Styles are taken in stage order from the contributor
 * styles, so lines differ by dash and colour both. Pure: returns a spec.
 */
import type {TopLevelSpec} from 'vega-lite'
import type {ChainCurves} from '../../engine/chain/types.js'
import {NOISE_KEYS} from '../../engine/types.js'
import {CHART_CONFIG, CHART_HEIGHT, CHART_WIDTH, CONTRIBUTOR_WIDTH, NOISE_STYLES, TOTAL_STYLE, type LineStyle} from './theme.js'
import {SI_AXIS_FORMAT, decadeDomain, extent, logFrequencyX, logTicks, plottablePoints, type Point} from './scales.js'
import {TOTAL_LABEL} from './noise-density.js'

const LINE = {type: 'line', clip: true, strokeCap: 'butt', strokeJoin: 'round'} as const

/** Stage k's line style: the contributor styles in order, round again after ten. */
export const stageStyle = (k: number): LineStyle => NOISE_STYLES[NOISE_KEYS[k % NOISE_KEYS.length]!]

/**
 * @param curves
 *   The chain's curves (`frequency`, `stageDensity` in stage order, `total`).
 * @param stages
 *   Stage ids, in the order of `stageDensity`.
 */
export function chainNoiseDensitySpec(curves: ChainCurves, stages: readonly string[]): TopLevelSpec {
  const f = curves.frequency
  const series: {label: string; style: LineStyle; total: boolean; points: Point[]}[] = stages.map((id, k) => ({
    label: `Stage ${id}`, style: stageStyle(k), total: false, points: plottablePoints(f, curves.stageDensity[k] ?? [], true)
  })).filter((s) => s.points.length > 0)
  const totalPoints = plottablePoints(f, curves.total, true)
  series.push({label: TOTAL_LABEL, style: TOTAL_STYLE, total: true, points: totalPoints})
  const xDomain = extent(totalPoints.map((p) => p.x), 'chain noise total')
  const yDomain = decadeDomain(extent(series.flatMap((s) => s.points.map((p) => p.y)), 'chain noise density'))
  const labels = series.map((s) => s.label)
  const legend = {title: null, orient: 'bottom', direction: 'horizontal', columns: 3, symbolType: 'stroke', symbolSize: 400, columnPadding: 16, rowPadding: 4, labelOffset: 7} as const
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: CHART_CONFIG,
    width: CHART_WIDTH,
    height: CHART_HEIGHT,
    data: {values: series.flatMap((s) => s.points.map((p) => ({series: s.label, total: s.total, f: p.x, v: p.y})))},
    encoding: {
      x: logFrequencyX(xDomain),
      y: {
        field: 'v', type: 'quantitative', scale: {type: 'log', domain: yDomain, nice: false},
        axis: {title: 'Noise density at the converter input (V/√Hz)', format: SI_AXIS_FORMAT, values: logTicks(yDomain), grid: true}
      },
      color: {field: 'series', type: 'nominal', scale: {domain: labels, range: series.map((s) => s.style.colour)}, legend},
      strokeDash: {field: 'series', type: 'nominal', scale: {domain: labels, range: series.map((s) => s.style.dash)}, legend}
    },
    layer: [
      {transform: [{filter: '!datum.total'}], mark: {...LINE, strokeWidth: CONTRIBUTOR_WIDTH}},
      {transform: [{filter: 'datum.total'}], mark: {...LINE, strokeWidth: TOTAL_STYLE.width}}
    ]
  }
}
