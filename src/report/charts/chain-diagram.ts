/**
 * The block diagram of a chain as a drawing: the input's range at the left, each stage a
 * labelled box (id, topology, gain) joined by arrows in signal order, the converter as the
 * last box (name, bits, range), the range at every node printed under its arrow (a second
 * row when neighbours would touch). Box widths follow their text (estimated: no font file is
 * read here), and the text shrinks when a long chain would not fit. Laid out
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
/** Extra height, px, when the node ranges need a second row. */
const SECOND_ROW = 14
const Y = {top: 26, bottom: 6, mid: 16} as const
const SIZE = {title: FONT_SIZE.label, line: FONT_SIZE.label - 1, node: FONT_SIZE.label - 1.5} as const

/**
 * A text's width, px, estimated without the fonts (the spec builder reads no file): DejaVu
 * Sans averages about 0.6 em a character, its bold about 0.68 em — generous for the digits,
 * units and ids these boxes carry.
 */
const estimate = (text: string, size: number, bold = false): number => [...text].length * size * (bold ? 0.68 : 0.6)

/** px → frame units (the frame is 0 … 100 across CHART_WIDTH). */
const units = (px: number): number => (px * 100) / CHART_WIDTH

/**
 * Box widths from their text, the lead (input arrow) sized to its label when there is room,
 * and a font scale below 1 when even the tightest layout is wider than the chart.
 */
function layout(d: ChainDiagramInput): {left: number; gap: number; widths: number[]; scale: number} {
  const n = d.boxes.length
  const pad = 10
  const need = d.boxes.map((b) => Math.max(estimate(b.title, SIZE.title, true), estimate(b.lines[0], SIZE.line), estimate(b.lines[1], SIZE.line)) + pad)
  const minGap = 16
  const minLead = 30
  const fullLead = Math.max(minLead, estimate(d.inputLabel, SIZE.node) + 8)
  const margin = 5
  const boxesPx = need.reduce((a, b) => a + b, 0)
  const fixed = (lead: number): number => lead + minGap * (n - 1) + margin
  const lead = fixed(fullLead) + boxesPx <= CHART_WIDTH ? fullLead : minLead
  const room = CHART_WIDTH - fixed(lead)
  const scale = Math.min(1, room / boxesPx)
  // Spare room: gaps up to 40 px first, then the boxes, evenly.
  let spare = Math.max(0, room - boxesPx)
  const gap = n > 1 ? minGap + Math.min(spare / (n - 1), 40 - minGap) : minGap
  spare -= (gap - minGap) * (n - 1)
  const widths = need.map((w) => w * scale + spare / n)
  return {left: units(lead), gap: units(gap), widths: widths.map(units), scale}
}

export function chainDiagramSpec(d: ChainDiagramInput): TopLevelSpec {
  const {left, gap, widths, scale: fontScale} = layout(d)
  let next = left
  const boxes = d.boxes.map((b, i) => {
    const box = {x: next, x2: next + widths[i]!, y: Y.bottom, y2: Y.top, cx: next + widths[i]! / 2, ...b, stroke: b.converter ? 1.8 : 1}
    next = box.x2 + gap
    return box
  })
  const arrows = [{x: 1, x2: left - 0.4, label: d.inputLabel, lx: 1, align: 'left'},
    ...boxes.slice(0, -1).map((b, i) => ({x: b.x2, x2: boxes[i + 1]!.x - 0.4, label: d.nodeLabels[i] ?? '', lx: (b.x2 + boxes[i + 1]!.x) / 2, align: 'center'}))]
  // Range labels under the arrows (the input's left-aligned from the left edge); a label that
  // would run into the one before it drops to a second row.
  const nodeSize = SIZE.node * Math.max(fontScale, 0.85)
  const spans = arrows.map((a) => {
    const w = units(estimate(a.label, nodeSize))
    return a.align === 'left' ? {from: a.lx, to: a.lx + w} : {from: a.lx - w / 2, to: a.lx + w / 2}
  })
  const row = spans.map(() => 0)
  for (let i = 1; i < spans.length; i++) if (row[i - 1] === 0 && spans[i]!.from < spans[i - 1]!.to + units(6)) row[i] = 1
  const twoRows = row.includes(1)
  // The frame's y runs 0 … 36 over HEIGHT; a second row adds SECOND_ROW px below 0.
  const below = twoRows ? (SECOND_ROW / HEIGHT) * 36 : 0
  const labels = arrows.map((a, i) => ({x: a.lx, y: row[i] === 0 ? 4 : 4 - below, t: a.label, align: a.align}))
  const scale = {x: {domain: [0, 100], nice: false, zero: false}, y: {domain: [-below, 36], nice: false, zero: false}}
  // Every layer states its own x and y (same frame, same scales): no field is inherited.
  const at = {x: {field: 'x', type: 'quantitative' as const, scale: scale.x, axis: null}, y: {field: 'y', type: 'quantitative' as const, scale: scale.y, axis: null}}
  const text = (field: string, y: number, weight: 'bold' | 'normal', size: number) => ({
    data: {values: boxes.map((b) => ({x: b.cx, y, t: field === 'title' ? b.title : field === 'l1' ? b.lines[0] : b.lines[1]}))},
    mark: {type: 'text' as const, align: 'center' as const, baseline: 'middle' as const, fontWeight: weight, fontSize: size * fontScale, color: INK.text},
    encoding: {...at, text: {field: 't', type: 'nominal' as const}}
  })
  const rangeText = (align: 'left' | 'center') => ({
    data: {values: labels.filter((l) => l.align === align)},
    mark: {type: 'text' as const, align, baseline: 'top' as const, fontSize: nodeSize, color: INK.axis},
    encoding: {...at, text: {field: 't', type: 'nominal' as const}}
  })
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: {...CHART_CONFIG, view: {stroke: null}},
    width: CHART_WIDTH,
    height: HEIGHT + (twoRows ? SECOND_ROW : 0),
    layer: [
      {
        data: {values: boxes},
        mark: {type: 'rect', fill: '#f4f6f9', stroke: INK.text, cornerRadius: 2},
        encoding: {...at, x2: {field: 'x2'}, y2: {field: 'y2'}, strokeWidth: {field: 'stroke', type: 'quantitative', scale: null}}
      },
      text('title', 21, 'bold', SIZE.title),
      text('l1', 15, 'normal', SIZE.line),
      text('l2', 10, 'normal', SIZE.line),
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
      rangeText('center'),
      rangeText('left')
    ]
  }
}
