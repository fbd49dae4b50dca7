/**
 * A chain's cascaded output noise density, log-log: one line per stage (its part after the
 * later stages' gain) and the total as the thick black line, V/√Hz at the converter input
 * against Hz over the chain's band. Styles are taken in stage order from the contributor
 * styles, so lines differ by dash and colour both. Pure: returns a spec.
 */
import type {TopLevelSpec} from 'vega-lite'
import type {ChainCurves} from '../../engine/chain/types.js'
import type {NoiseKey} from '../../engine/types.js'
import {CHART_CONFIG, CHART_HEIGHT, CHART_WIDTH, CONTRIBUTOR_WIDTH, NOISE_STYLES, TOTAL_STYLE, type LineStyle} from './theme.js'
import {SI_AXIS_FORMAT, decadeDomain, extent, logFrequencyX, logTicks, plottablePoints, type Point} from './scales.js'
import {TOTAL_LABEL} from './noise-density.js'

const LINE = {type: 'line', clip: true, strokeCap: 'butt', strokeJoin: 'round'} as const

/**
 * The contributor styles a chain's stages take, in order: each a colour of its own (the
 * contributor table repeats colours between keys that never share a stage, such as en and en-in).
 */
const STAGE_STYLE_KEYS: readonly NoiseKey[] = ['en', 'in+', 'r:rf', 'en-out', 'r:rs', 'in-', 'r:rcomp', 'r:rshunt', 'r:rload', 'shot-signal']

/** Stage k's line style: a colour and dash of its own, round again after ten. */
export const stageStyle = (k: number): LineStyle => NOISE_STYLES[STAGE_STYLE_KEYS[k % STAGE_STYLE_KEYS.length]!]

/** The 2 % of the stage charts: a stage line closer than this to the total lies under it. */
const COINCIDE_RATIO = 1.02

/** Stages whose part is the total within 2 % across the band (their line lies under the total's). */
export function stagesUnderTotal(curves: ChainCurves, stages: readonly string[]): string[] {
  return stages.filter((_, k) => {
    const a = curves.stageDensity[k] ?? []
    return a.length > 0 && a.length === curves.total.length &&
      a.every((x, i) => {
        const y = curves.total[i]!
        return x > 0 && y > 0 && Math.max(x / y, y / x) <= COINCIDE_RATIO
      })
  })
}

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
