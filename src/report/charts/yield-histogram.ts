/**
 * The Monte Carlo's error histogram (DESIGN §8.7): the share of trials in each equal bin of
 * the error, with each requirement's limit as a solid line and the worst-case bound as a
 * dashed line, each labelled. Pure: returns a vega-lite spec with its data.
 */
import type {TopLevelSpec} from 'vega-lite'
import {CHART_CONFIG, CHART_HEIGHT, CHART_OUTER_WIDTH, FONT_SIZE, INK} from './theme.js'
import {prefixedAxis, siTextExpr} from './scales.js'

export interface YieldHistogramInput {
  /** The bins cover [0, top], V. */
  top: number
  counts: readonly number[]
  /** Requirement limits on the same error, V, each with its label. */
  limits: readonly {label: string; value: number}[]
  /** The worst-case bound of the error, V. */
  worstCase: number
}

export function yieldHistogramSpec(h: YieldHistogramInput, axisTitle = 'DC error at the output, largest over the input range and temperature'): TopLevelSpec {
  const n = h.counts.reduce((a, b) => a + b, 0)
  const width = h.counts.length > 0 ? h.top / h.counts.length : 0
  const bins = h.counts.map((c, i) => ({lo: i * width, hi: (i + 1) * width, zero: 0, share: n > 0 ? (100 * c) / n : 0}))
  const peak = Math.max(...bins.map((b) => b.share), 1e-9)
  // The labels stand above the plot frame, one row per mark (13 px apart, the rightmost line
  // lowest), each ending at its line: a label then never lies across another mark's line.
  const marks = [
    ...h.limits.map((l) => ({x: l.value, text: `${l.label} `, kind: 'limit'})),
    {x: h.worstCase, text: 'worst case ', kind: 'worst'}
  ].sort((a, b) => b.x - a.x).map((m, i) => ({...m, ypix: -4 - 13 * i}))
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: CHART_CONFIG,
    width: CHART_OUTER_WIDTH,
    autosize: {type: 'fit-x', contains: 'padding'},
    height: CHART_HEIGHT,
    layer: [
      {
        data: {values: bins},
        mark: {type: 'bar', color: INK.bar, binSpacing: 0},
        encoding: {
          x: {field: 'lo', type: 'quantitative', scale: {domain: [0, h.top], nice: false, zero: true}, axis: {...prefixedAxis(axisTitle, 'V', h.top), grid: true, tickCount: 8}},
          x2: {field: 'hi'},
          y2: {field: 'zero'},
          y: {field: 'share', type: 'quantitative', scale: {domain: [0, peak * 1.08], nice: false}, axis: {title: 'Share of trials (%)', grid: true, tickCount: 5, format: '~g'}}
        }
      },
      {
        data: {values: marks},
        transform: [{calculate: `datum.text + ${siTextExpr('datum.x', 'V')}`, as: 'label'}],
        layer: [
          // Solid limit lines, a dashed worst-case line (pdfkit refuses a zero-length dash, so two layers).
          {
            transform: [{filter: "datum.kind === 'limit'"}],
            mark: {type: 'rule', strokeWidth: 1.2, color: INK.note},
            encoding: {x: {field: 'x', type: 'quantitative'}}
          },
          {
            transform: [{filter: "datum.kind === 'worst'"}],
            mark: {type: 'rule', strokeWidth: 1.2, color: INK.axis, strokeDash: [5, 3]},
            encoding: {x: {field: 'x', type: 'quantitative'}}
          },
          {
            mark: {type: 'text', align: 'right', baseline: 'bottom', dx: 2, angle: 0, fontSize: FONT_SIZE.label, color: INK.text},
            encoding: {
              x: {field: 'x', type: 'quantitative'},
              y: {field: 'ypix', type: 'quantitative', scale: null},
              text: {field: 'label', type: 'nominal'}
            }
          }
        ]
      }
    ]
  }
}
