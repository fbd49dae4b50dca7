/**
 * The Monte Carlo's variance shares as ranked horizontal bars (DESIGN §8.7, "what to tighten
 * first"): each random variable's share of the error variance, largest at the top, each bar
 * labelled with its percentage. Pure: returns a vega-lite spec with its data.
 */
import type {TopLevelSpec} from 'vega-lite'
import {CHART_CONFIG, CHART_OUTER_WIDTH, FONT_SIZE, INK} from './theme.js'

const ROW_HEIGHT = 20

export function varianceSharesSpec(rows: readonly {label: string; share: number}[]): TopLevelSpec {
  const data = rows.map((r) => ({label: r.label, share: 100 * r.share, text: `${(100 * r.share).toFixed(1)} %`}))
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: CHART_CONFIG,
    width: CHART_OUTER_WIDTH,
    autosize: {type: 'fit-x', contains: 'padding'},
    height: Math.max(data.length, 1) * ROW_HEIGHT,
    data: {values: data},
    encoding: {
      y: {field: 'label', type: 'nominal', sort: data.map((d) => d.label), axis: {title: null, labelPadding: 5, ticks: false, domain: false}, scale: {paddingInner: 0.3, paddingOuter: 0.15}},
      x: {field: 'share', type: 'quantitative', scale: {domain: [0, 118], nice: false, zero: true}, axis: {title: 'Share of the error variance (%)', grid: true, values: [0, 20, 40, 60, 80, 100]}}
    },
    layer: [
      {mark: {type: 'bar', color: INK.bar}},
      {mark: {type: 'text', align: 'left', baseline: 'middle', dx: 4, fontSize: FONT_SIZE.label, color: INK.text}, encoding: {text: {field: 'text', type: 'nominal'}}}
    ]
  }
}
