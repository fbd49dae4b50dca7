/**
 * The signal response H(f) of a low-pass stage (DESIGN §8.4) in two panels on one log
 * frequency axis: |H/H(0)| in dB above, the phase of H/H(0) below, with f0 marked (where the
 * phase passes −90°) and labelled "f0 = 1 kHz, Q = 0.71". Pure: returns a vega-lite spec.
 */
import type {TopLevelSpec} from 'vega-lite'
import type {FilterFigures, StageCurves} from '../../engine/types.js'
import {CHART_CONFIG, CHART_WIDTH, FONT_SIZE, INK, PANEL_HEIGHT, TOTAL_STYLE} from './theme.js'
import {SI_AXIS_FORMAT, extent, logTicks, plottablePoints, siTextExpr} from './scales.js'

const REFERENCE_RULE = {type: 'rule' as const, color: INK.axis, strokeDash: [4, 3], strokeWidth: 0.9}
const MARKER_RULE = {type: 'rule' as const, color: INK.note, strokeWidth: 1}
const NOTE_TEXT = {type: 'text' as const, fontSize: FONT_SIZE.note, color: INK.note}

/**
 * Spec of the response chart.
 * @param curves
 *   `frequency` (Hz), `closedLoopMagnitude` (V/V), `closedLoopPhase` (degrees, unwrapped).
 */
export function responseSpec(curves: StageCurves, filter: FilterFigures): TopLevelSpec {
  const h0 = Math.abs(filter.passbandGain)
  const phase0 = curves.closedLoopPhase[0] ?? 0
  const magnitude = plottablePoints(curves.frequency, curves.closedLoopMagnitude.map((m) => m / h0), true)
  const phase = plottablePoints(curves.frequency, curves.closedLoopPhase.map((p) => p - phase0), false)
  const xDomain = extent([...magnitude, ...phase].map((p) => p.x), 'response curve')
  const marked = filter.f0 !== null && Number.isFinite(filter.f0) ? filter.f0 : null
  const x = (axis: {title: string | null; labels: boolean}) => ({
    field: 'f',
    type: 'quantitative' as const,
    scale: {type: 'log' as const, domain: xDomain, nice: false},
    axis: {...axis, format: SI_AXIS_FORMAT, values: logTicks(xDomain), grid: true}
  })
  const f0Rule = marked === null ? [] : [{data: {values: [{f: marked}]}, mark: MARKER_RULE, encoding: {x: {field: 'f', type: 'quantitative' as const}}}]
  const label = marked === null
    ? []
    : [{
        data: {values: [{f: marked, q: filter.q ?? 0}]},
        transform: [{calculate: `'f0 = ' + ${siTextExpr('datum.f', 'Hz')} + ', Q = ' + format(datum.q, '.3')`, as: 'text'}],
        mark: {...NOTE_TEXT, align: 'left' as const, baseline: 'top' as const, dx: 4},
        encoding: {x: {field: 'f', type: 'quantitative' as const}, y: {value: 6}, text: {field: 'text', type: 'nominal' as const}}
      }]
  const line = {type: 'line' as const, color: TOTAL_STYLE.colour, strokeWidth: 1.6, clip: true}
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: CHART_CONFIG,
    spacing: 8,
    resolve: {scale: {x: 'shared'}},
    vconcat: [
      {
        width: CHART_WIDTH,
        height: PANEL_HEIGHT,
        layer: [
          {
            data: {values: magnitude.map((p) => ({f: p.x, db: 20 * Math.log10(p.y)}))},
            mark: line,
            encoding: {x: x({title: null, labels: false}), y: {field: 'db', type: 'quantitative' as const, scale: {nice: true}, axis: {title: '|H/H(0)| (dB)', grid: true, tickCount: 5}}}
          },
          {data: {values: [{db: -3}]}, mark: REFERENCE_RULE, encoding: {y: {field: 'db', type: 'quantitative' as const}}},
          ...f0Rule,
          ...label
        ]
      },
      {
        width: CHART_WIDTH,
        height: PANEL_HEIGHT,
        layer: [
          {
            data: {values: phase.map((p) => ({f: p.x, deg: p.y}))},
            mark: line,
            encoding: {x: x({title: 'Frequency (Hz)', labels: true}), y: {field: 'deg', type: 'quantitative' as const, scale: {nice: true}, axis: {title: 'Phase of H/H(0) (°)', grid: true, tickCount: 5}}}
          },
          {data: {values: [{deg: -90}]}, mark: REFERENCE_RULE, encoding: {y: {field: 'deg', type: 'quantitative' as const}}},
          ...f0Rule
        ]
      }
    ]
  }
}
