/**
 * Output noise density, log-log: one line per contributor and the total as a thicker black
 * line, V/√Hz against Hz over the noise band.
 *
 * A contributor is left out when it is zero everywhere or stays below `minShare` of the
 * total at every frequency; the keys left out are returned so the caption can name them.
 * Points that a log axis cannot show (zero, negative, non-finite) are dropped from each line.
 * Pure: returns a spec that `src/report/vega.ts` renders.
 */
import type {TopLevelSpec} from 'vega-lite'
import {NOISE_KEYS, type NoiseKey, type StageCurves} from '../../engine/types.js'
import {CHART_CONFIG, CHART_HEIGHT, CHART_WIDTH, CONTRIBUTOR_WIDTH, NOISE_STYLES, TOTAL_STYLE, type LineStyle} from './theme.js'
import {SI_AXIS_FORMAT, decadeDomain, extent, logFrequencyX, logTicks, plottablePoints, type Point} from './scales.js'

export interface NoiseDensityOptions {
  /** Readable name of each contributor key (e.g. `r:rf` → "Rf thermal"); the key itself when absent. */
  labels: Record<string, string>
  /**
   * Smallest share of the total density (V/√Hz ratio) a contributor must reach at some
   * frequency to be drawn (optional; default 1e-3).
   */
  minShare?: number
}

export interface NoiseDensityChart {
  spec: TopLevelSpec
  /** Contributor keys not drawn (zero, or under `minShare` of the total everywhere), in `NOISE_KEYS` order. */
  omitted: NoiseKey[]
}

/** Legend entry of the total line. */
export const TOTAL_LABEL = 'Total'

/** Legend entry of the noise floor (total without the signal's shot noise, DESIGN §4.3). */
export const ZERO_SIGNAL_LABEL = 'Total at zero signal'

const DEFAULT_MIN_SHARE = 1e-3

const LINE = {type: 'line', clip: true, strokeCap: 'butt', strokeJoin: 'round'} as const

/** The legend's total symbol is drawn as thick as the total line. */
const TOTAL_SYMBOL_WIDTH = `datum.label === ${JSON.stringify(TOTAL_LABEL)} ? ${TOTAL_STYLE.width} : ${CONTRIBUTOR_WIDTH}`

/** One legend for colour and dash together, under the plot. */
const legend = {
  title: null,
  orient: 'bottom',
  direction: 'horizontal',
  columns: 3,
  symbolType: 'stroke',
  // A 30 px line sample (vega's stroke symbol is √size long): long enough to tell the dash patterns apart.
  symbolSize: 900,
  columnPadding: 16,
  rowPadding: 4,
  labelOffset: 7,
  encode: {symbols: {update: {strokeWidth: {signal: TOTAL_SYMBOL_WIDTH}}}}
} as const

/** True when `density` reaches `minShare` of `total` at some frequency. */
function significant(density: readonly number[], total: readonly number[], minShare: number): boolean {
  return density.some((d, i) => {
    const t = total[i] as number
    return Number.isFinite(d) && d > 0 && (!(t > 0) || d >= minShare * t)
  })
}

/** Curves within this ratio of each other at every frequency are drawn on top of each other. */
const COINCIDE_RATIO = 1.02

/**
 * Pairs of drawn curves (contributors, or a contributor and the total) that coincide: within
 * 2 % of each other at every frequency, so that one hides the other on the chart and the
 * caption must say so.
 */
export function coincidingCurves(curves: StageCurves, drawn: readonly NoiseKey[]): [NoiseKey | 'total', NoiseKey | 'total'][] {
  const series: [NoiseKey | 'total', readonly number[]][] = [...drawn.map((k): [NoiseKey, readonly number[]] => [k, curves.noiseDensity[k] ?? []]), ['total', curves.noiseTotal]]
  const same = (a: readonly number[], b: readonly number[]): boolean =>
    a.length > 0 && a.length === b.length && a.every((x, i) => {
      const y = b[i] as number
      return x > 0 && y > 0 && Math.max(x / y, y / x) <= COINCIDE_RATIO
    })
  const out: [NoiseKey | 'total', NoiseKey | 'total'][] = []
  for (let i = 0; i < series.length; i++) {
    for (let j = i + 1; j < series.length; j++) {
      const [ka, a] = series[i]!
      const [kb, b] = series[j]!
      if (same(a, b)) out.push([ka, kb])
    }
  }
  return out
}

/**
 * Spec of the noise-density chart.
 *
 * @param curves
 *   The stage's curves: `noiseFrequency` (Hz), `noiseDensity` per key and `noiseTotal` (V/√Hz).
 * @param opts
 *   Labels of the contributor keys, and the share under which a contributor is left out.
 */
export function noiseDensitySpec(curves: StageCurves, opts: NoiseDensityOptions): NoiseDensityChart {
  const minShare = opts.minShare ?? DEFAULT_MIN_SHARE
  const f = curves.noiseFrequency
  const omitted: NoiseKey[] = []
  const series: {label: string; style: LineStyle; total: boolean; points: Point[]}[] = []
  for (const key of NOISE_KEYS) {
    const density = curves.noiseDensity[key] ?? []
    if (!significant(density, curves.noiseTotal, minShare)) {
      omitted.push(key)
      continue
    }
    series.push({label: opts.labels[key] ?? key, style: NOISE_STYLES[key], total: false, points: plottablePoints(f, density, true)})
  }
  const totalPoints = plottablePoints(f, curves.noiseTotal, true)
  // The floor, drawn only where the signal's own shot noise shows: dashed in the total's ink.
  const floor = curves.noiseTotalZeroSignal ?? curves.noiseTotal
  if (floor.some((v, i) => Math.abs(v - (curves.noiseTotal[i] as number)) > minShare * (curves.noiseTotal[i] as number))) {
    series.push({label: ZERO_SIGNAL_LABEL, style: {...TOTAL_STYLE, dash: [6, 3], width: CONTRIBUTOR_WIDTH}, total: false, points: plottablePoints(f, floor, true)})
  }
  series.push({label: TOTAL_LABEL, style: TOTAL_STYLE, total: true, points: totalPoints})

  const all = series.flatMap((s) => s.points)
  const xDomain = extent(totalPoints.map((p) => p.x), 'noise total')
  const yDomain = decadeDomain(extent(all.map((p) => p.y), 'noise density'))
  const labels = series.map((s) => s.label)

  return {
    omitted,
    spec: {
      $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
      config: CHART_CONFIG,
      width: CHART_WIDTH,
      height: CHART_HEIGHT,
      data: {values: series.flatMap((s) => s.points.map((p) => ({series: s.label, total: s.total, f: p.x, v: p.y})))},
      encoding: {
        x: logFrequencyX(xDomain),
        y: {
          field: 'v',
          type: 'quantitative',
          scale: {type: 'log', domain: yDomain, nice: false},
          axis: {title: 'Output noise density (V/√Hz)', format: SI_AXIS_FORMAT, values: logTicks(yDomain), grid: true}
        },
        color: {field: 'series', type: 'nominal', scale: {domain: labels, range: series.map((s) => s.style.colour)}, legend},
        strokeDash: {field: 'series', type: 'nominal', scale: {domain: labels, range: series.map((s) => s.style.dash)}, legend}
      },
      // Two layers on shared scales so that the total is drawn last, on top of the contributors.
      layer: [
        {transform: [{filter: '!datum.total'}], mark: {...LINE, strokeWidth: CONTRIBUTOR_WIDTH}},
        {transform: [{filter: 'datum.total'}], mark: {...LINE, strokeWidth: TOTAL_STYLE.width}}
      ]
    }
  }
}
