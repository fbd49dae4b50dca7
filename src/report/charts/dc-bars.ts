/**
 * The DC error budget as horizontal bars: one bar per contributor, output-referred
 * magnitude in volts, largest at the top, each bar labelled with its value.
 *
 * Every contributor of the budget is kept, zeros included (a bar of length 0 and the label
 * "0 V"), so the chart lists the same rows as the budget table. Pure: returns a spec that
 * `src/report/vega.ts` renders.
 */
import type {TopLevelSpec} from 'vega-lite'
import type {DcBudget} from '../../engine/types.js'
import {CHART_CONFIG, CHART_OUTER_WIDTH, FONT_SIZE, INK} from './theme.js'
import {prefixedAxis, siTextExpr} from './scales.js'

export interface DcBarsOptions {
  /** Readable name of each contributor key (e.g. `vos` → "Offset voltage"); the key itself when absent. */
  labels: Record<string, string>
  /** x-axis title (optional; default "Output-referred error (V)"). */
  axisTitle?: string
}

/** Height of one bar's band, px. */
const ROW_HEIGHT = 20

/** Head-room right of the longest bar for its value label, as a fraction of the longest bar. */
const LABEL_ROOM = 0.22

/** x-axis maximum when every contributor is zero, V (any positive value keeps the axis valid). */
const EMPTY_MAX = 1e-6

/**
 * Spec of the DC error bar chart.
 *
 * @param dc
 *   The stage's DC budget; `contributors[].output` is a magnitude, V (a negative value is
 *   drawn as its magnitude, a non-finite one as 0).
 * @param opts
 *   Labels of the contributor keys.
 */
export function dcBarsSpec(dc: {contributors: DcBudget['contributors'] | readonly {key: string; output: number}[]}, opts: DcBarsOptions): TopLevelSpec {
  const rows = dc.contributors
    .map((c, index) => ({
      key: c.key,
      label: opts.labels[c.key] ?? c.key,
      output: Number.isFinite(c.output) ? Math.abs(c.output) : 0,
      index
    }))
    // Largest first; ties keep the budget's order.
    .sort((a, b) => b.output - a.output || a.index - b.index)
  const largest = rows.reduce((m, r) => Math.max(m, r.output), 0)
  const xMax = largest > 0 ? largest * (1 + LABEL_ROOM) : EMPTY_MAX

  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: CHART_CONFIG,
    // The plot takes what the labels leave of the whole width (labels vary by language and key).
    width: CHART_OUTER_WIDTH,
    autosize: {type: 'fit-x', contains: 'padding'},
    height: Math.max(rows.length, 1) * ROW_HEIGHT,
    data: {values: rows.map(({key, label, output}) => ({key, label, output}))},
    transform: [{calculate: siTextExpr('datum.output', 'V'), as: 'valueText'}],
    encoding: {
      y: {
        field: 'label',
        type: 'nominal',
        sort: rows.map((r) => r.label),
        axis: {title: null, labelPadding: 5, ticks: false, domain: false},
        scale: {paddingInner: 0.3, paddingOuter: 0.15}
      },
      x: {
        field: 'output',
        type: 'quantitative',
        scale: {domain: [0, xMax], nice: false, zero: true},
        axis: {...prefixedAxis(opts.axisTitle ?? 'Output-referred error', 'V', largest), grid: true, tickCount: 6}
      }
    },
    layer: [
      {mark: {type: 'bar', color: INK.bar}},
      {
        mark: {type: 'text', align: 'left', baseline: 'middle', dx: 4, fontSize: FONT_SIZE.label, color: INK.text},
        encoding: {text: {field: 'valueText', type: 'nominal'}}
      }
    ]
  }
}
