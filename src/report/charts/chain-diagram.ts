/**
 * The block diagram of a chain as a drawing: the input's range at the left, each stage a
 * labelled box (id, topology, gain) joined by arrows in signal order, the converter as the
 * last box (name, bits, range), the range at every node printed under its arrow. Laid out
 * as data in a fixed 0 … 100 × 0 … 36 frame and drawn with vega-lite rect, rule, point and
 * text marks, so it goes through the same renderer, fonts and determinism as the charts.
 */
import type {TopLevelSpec} from 'vega-lite'
import {CHART_CONFIG, CHART_WIDTH, FONT_SIZE, INK} from './theme.js'

export interface DiagramBox {
  /** First line (bold): the id. */
  title: string
  /** Second and third lines. */
  lines: [string, string]
  /** True for the converter (drawn with a heavier outline). */
  converter: boolean
}

export interface ChainDiagramInput {
  /** Text at the chain's input (its range). */
  inputLabel: string
  boxes: DiagramBox[]
  /** Range text under each arrow after a box (one per box but the last). */
  nodeLabels: string[]
}

const HEIGHT = 110
const Y = {top: 26, bottom: 6, mid: 16} as const

export function chainDiagramSpec(d: ChainDiagramInput): TopLevelSpec {
  const n = d.boxes.length
  const left = 19
  const gap = n > 4 ? 5 : 7
  const width = (100 - left - gap * (n - 1) - 1) / n
  const boxes = d.boxes.map((b, i) => {
    const x = left + i * (width + gap)
    return {x, x2: x + width, y: Y.bottom, y2: Y.top, cx: x + width / 2, ...b, stroke: b.converter ? 1.8 : 1}
  })
  const arrows = [{x: 1, x2: left - 0.4, label: d.inputLabel, lx: 1, align: 'left'},
    ...boxes.slice(0, -1).map((b, i) => ({x: b.x2, x2: boxes[i + 1]!.x - 0.4, label: d.nodeLabels[i] ?? '', lx: (b.x2 + boxes[i + 1]!.x) / 2, align: 'center'}))]
  const scale = {x: {domain: [0, 100], nice: false, zero: false}, y: {domain: [0, 36], nice: false, zero: false}}
  // Every layer states its own x and y (same frame, same scales): no field is inherited.
  const at = {x: {field: 'x', type: 'quantitative' as const, scale: scale.x, axis: null}, y: {field: 'y', type: 'quantitative' as const, scale: scale.y, axis: null}}
  const text = (field: string, y: number, weight: 'bold' | 'normal', size: number) => ({
    data: {values: boxes.map((b) => ({x: b.cx, y, t: field === 'title' ? b.title : field === 'l1' ? b.lines[0] : b.lines[1]}))},
    mark: {type: 'text' as const, align: 'center' as const, baseline: 'middle' as const, fontWeight: weight, fontSize: size, color: INK.text},
    encoding: {...at, text: {field: 't', type: 'nominal' as const}}
  })
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: {...CHART_CONFIG, view: {stroke: null}},
    width: CHART_WIDTH,
    height: HEIGHT,
    layer: [
      {
        data: {values: boxes},
        mark: {type: 'rect', fill: '#f4f6f9', stroke: INK.text, cornerRadius: 2},
        encoding: {...at, x2: {field: 'x2'}, y2: {field: 'y2'}, strokeWidth: {field: 'stroke', type: 'quantitative', scale: null}}
      },
      text('title', 21, 'bold', FONT_SIZE.label),
      text('l1', 15, 'normal', FONT_SIZE.label - 1),
      text('l2', 10, 'normal', FONT_SIZE.label - 1),
      {
        data: {values: arrows.map((a) => ({x: a.x, x2: a.x2, y: Y.mid}))},
        mark: {type: 'rule', color: INK.text, strokeWidth: 1},
        encoding: {...at, x2: {field: 'x2'}}
      },
      {
        data: {values: arrows.map((a) => ({x: a.x2, y: Y.mid}))},
        mark: {type: 'point', shape: 'triangle-right', filled: true, size: 40, color: INK.text, opacity: 1},
        encoding: at
      },
      {
        data: {values: arrows.filter((a) => a.align === 'center').map((a) => ({x: a.lx, y: 4, t: a.label}))},
        mark: {type: 'text', align: 'center', baseline: 'top', fontSize: FONT_SIZE.label - 1.5, color: INK.axis},
        encoding: {...at, text: {field: 't', type: 'nominal'}}
      },
      {
        data: {values: [{x: 1, y: 19, t: d.inputLabel}]},
        mark: {type: 'text', align: 'left', baseline: 'bottom', fontSize: FONT_SIZE.label - 1.5, color: INK.axis},
        encoding: {...at, text: {field: 't', type: 'nominal'}}
      }
    ]
  }
}
