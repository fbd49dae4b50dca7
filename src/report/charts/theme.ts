/**
 * The look shared by every chart: vega-lite config (font, sizes, greys), the chart size that
 * fits an A4 content width, and the line styles of the noise contributors.
 *
 * Every builder in this folder puts `CHART_CONFIG` on its spec. Styles are keyed by contributor
 * so a given source keeps its colour and dash in every stage of a report; lines differ by dash
 * and colour both, never by colour alone.
 */
import type {Config} from 'vega-lite'
import type {NoiseKey} from '../../engine/types.js'
import {CHART_FONT_FAMILY} from './fonts.js'

/** Plot-area width, px (the SVG adds axes and legend; the PDF scales it to the column). */
export const CHART_WIDTH = 460
/**
 * Whole-chart width of charts whose plot width depends on their labels (the DC bars), px:
 * about what the fixed-plot charts come to with their axes, so that text prints at the same
 * size in every figure once each is scaled to the column.
 */
export const CHART_OUTER_WIDTH = 530
/** Plot-area height of a single-panel chart, px. */
export const CHART_HEIGHT = 220
/** Plot-area height of each loop-gain panel, px. */
export const PANEL_HEIGHT = 150

/** Ink colours. */
export const INK = {text: '#1a1a1a', axis: '#4d4d4d', grid: '#dcdcdc', total: '#000000', bar: '#2f5d8a', note: '#7a2e2e'} as const

/** Font sizes, px. */
export const FONT_SIZE = {label: 9.5, title: 10.5, note: 10} as const

/** vega-lite config of every chart: DejaVu Sans throughout, SI number format on axes. */
export const CHART_CONFIG: Config = {
  font: CHART_FONT_FAMILY,
  background: 'white',
  padding: 6,
  view: {stroke: INK.axis, strokeWidth: 0.8},
  axis: {
    labelFont: CHART_FONT_FAMILY,
    titleFont: CHART_FONT_FAMILY,
    labelFontSize: FONT_SIZE.label,
    titleFontSize: FONT_SIZE.title,
    titleFontWeight: 'normal',
    labelColor: INK.text,
    titleColor: INK.text,
    domainColor: INK.axis,
    tickColor: INK.axis,
    gridColor: INK.grid,
    gridWidth: 0.6,
    labelFlush: false,
    labelOverlap: true,
    // No limits anywhere: vega's SVG renderer would truncate with an estimated width, and a
    // report never cuts a label.
    labelLimit: 0,
    titlePadding: 6
  },
  legend: {
    labelFont: CHART_FONT_FAMILY,
    titleFont: CHART_FONT_FAMILY,
    labelFontSize: FONT_SIZE.label,
    titleFontSize: FONT_SIZE.title,
    labelColor: INK.text,
    labelLimit: 0,
    titleLimit: 0,
    symbolSize: 300,
    symbolStrokeWidth: 1.6
  },
  text: {font: CHART_FONT_FAMILY, fontSize: FONT_SIZE.note, color: INK.text},
  title: {font: CHART_FONT_FAMILY, fontSize: 11, limit: 0}
}

/** One line style: colour, SVG dash array (empty = solid) and width, px. */
export interface LineStyle {
  colour: string
  dash: number[]
  width: number
}

/** Stroke width of every contributor line, px. */
export const CONTRIBUTOR_WIDTH = 1.4

/** The style of each noise contributor's density line (all dashed; solid is the total's). */
export const NOISE_STYLES: Record<NoiseKey, LineStyle> = {
  en: {colour: '#1f5fa8', dash: [9, 3], width: CONTRIBUTOR_WIDTH},
  'en-in': {colour: '#1f5fa8', dash: [9, 3], width: CONTRIBUTOR_WIDTH},
  'en-out': {colour: '#7d3fa6', dash: [3, 3], width: CONTRIBUTOR_WIDTH},
  'in+': {colour: '#c2561a', dash: [5, 3], width: CONTRIBUTOR_WIDTH},
  'in-': {colour: '#d08a00', dash: [2, 2], width: CONTRIBUTOR_WIDTH},
  'r:rf': {colour: '#2b8a47', dash: [8, 3, 2, 3], width: CONTRIBUTOR_WIDTH},
  'r:rg': {colour: '#7d3fa6', dash: [4, 2, 1, 2, 1, 2], width: CONTRIBUTOR_WIDTH},
  'r:rs': {colour: '#0e8c8c', dash: [12, 4], width: CONTRIBUTOR_WIDTH},
  'r:rcomp': {colour: '#a3234d', dash: [1, 3], width: CONTRIBUTOR_WIDTH},
  'r:rshunt': {colour: '#6b5a2a', dash: [6, 2, 2, 2, 2, 2], width: CONTRIBUTOR_WIDTH},
  // The §8 topologies' resistors reuse the palette: no stage has more than eight contributors.
  'r:rp': {colour: '#0e8c8c', dash: [3, 2], width: CONTRIBUTOR_WIDTH},
  'r:rref': {colour: '#a3234d', dash: [10, 2, 2, 2], width: CONTRIBUTOR_WIDTH},
  'r:r1': {colour: '#2b8a47', dash: [3, 2], width: CONTRIBUTOR_WIDTH},
  'r:r2': {colour: '#7d3fa6', dash: [10, 3], width: CONTRIBUTOR_WIDTH},
  'r:r3': {colour: '#0e8c8c', dash: [6, 3, 1, 3], width: CONTRIBUTOR_WIDTH},
  'r:riso': {colour: '#6b5a2a', dash: [2, 4], width: CONTRIBUTOR_WIDTH},
  'r:rload': {colour: '#5a6b7d', dash: [5, 1], width: CONTRIBUTOR_WIDTH},
  shot: {colour: '#5a6b7d', dash: [12, 3, 3, 3], width: CONTRIBUTOR_WIDTH},
  'shot-signal': {colour: '#b0306a', dash: [3, 2, 8, 2], width: CONTRIBUTOR_WIDTH}
}

/** The style of the total noise line: black, the only solid line, thicker than any contributor. */
export const TOTAL_STYLE: LineStyle = {colour: INK.total, dash: [], width: 2.4}
