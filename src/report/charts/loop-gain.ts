/**
 * Loop gain T(f) in two panels on one log frequency axis: |T| in dB above, its phase in
 * degrees below. A rule marks 0 dB (and −180° in the phase panel); the crossover gets a
 * vertical rule labelled "fc = 12.3 kHz" and the phase there is marked "PM = 61.2°", or the
 * magnitude panel says "no crossover" when the loop gain never falls through 1.
 *
 * Points with |T| ≤ 0 (no dB value), non-finite values or f ≤ 0 are dropped. Pure: returns a
 * spec that `src/report/vega.ts` renders.
 */
import type {TopLevelSpec} from 'vega-lite'
import type {Stability, StageCurves} from '../../engine/types.js'
import {CHART_CONFIG, CHART_WIDTH, FONT_SIZE, INK, PANEL_HEIGHT, TOTAL_STYLE} from './theme.js'
import {extent, frequencyAxis, plottablePoints, siTextExpr} from './scales.js'

/** Text shown when the loop gain never crosses 0 dB. */
export const NO_CROSSOVER_TEXT = 'no crossover'

/** Phase-axis tick step, degrees (doubled when the span is wide). */
const PHASE_STEP = 45

const REFERENCE_RULE = {type: 'rule' as const, color: INK.axis, strokeDash: [4, 3], strokeWidth: 0.9}
const MARKER_RULE = {type: 'rule' as const, color: INK.note, strokeWidth: 1}
const NOTE_TEXT = {type: 'text' as const, fontSize: FONT_SIZE.note, color: INK.note}

/**
 * Phase ticks at multiples of 45° (90° past a 360° span) covering [lo, hi]; callers include
 * −180° and 0° in the range, so both are always ticks.
 */
function phaseAxis([lo, hi]: [number, number]): {domain: [number, number]; ticks: number[]} {
  const step = hi - lo > 360 ? 2 * PHASE_STEP : PHASE_STEP
  const a = Math.floor(lo / step) * step
  const b = Math.max(Math.ceil(hi / step) * step, a + step)
  const ticks: number[] = []
  for (let v = a; v <= b; v += step) ticks.push(v)
  return {domain: [a, b], ticks}
}

/**
 * Spec of the loop-gain chart.
 *
 * @param curves
 *   The stage's curves: `frequency` (Hz), `loopGainMagnitude` (V/V), `loopGainPhase` (degrees, unwrapped).
 * @param stability
 *   Crossover (Hz) and phase margin (degrees), both null when there is no crossover.
 */
export function loopGainSpec(curves: StageCurves, stability: Stability): TopLevelSpec {
  const magnitude = plottablePoints(curves.frequency, curves.loopGainMagnitude, true)
  const phase = plottablePoints(curves.frequency, curves.loopGainPhase, false)
  const xDomain = extent([...magnitude, ...phase].map((p) => p.x), 'loop-gain curve')
  const phaseRange = extent([...phase.map((p) => p.y), -180, 0], 'loop-gain phase')
  const {domain: phaseDomain, ticks: phaseTicks} = phaseAxis(phaseRange)
  const {crossover: fc, phaseMargin: pm} = stability
  const marked = fc !== null && Number.isFinite(fc) && fc > 0 ? fc : null

  const x = (axis: {title: string | null; labels: boolean}) => ({
    field: 'f',
    type: 'quantitative' as const,
    scale: {type: 'log' as const, domain: xDomain, nice: false},
    axis: frequencyAxis(xDomain, axis.title, axis.labels)
  })
  // Marker labels sit beside the fc rule, on the side with room, so they stay inside the frame.
  const onRight = marked === null || Math.log(marked / xDomain[0]) / Math.log(xDomain[1] / xDomain[0]) < 0.65
  const beside = onRight ? {align: 'left' as const, dx: 4} : {align: 'right' as const, dx: -4}
  // Headroom above the |T| trace for the fc label: the dB axis runs 20 % of the span past the peak.
  const dbValues = magnitude.map((p) => 20 * Math.log10(p.y))
  const [dbLo, dbHi] = extent([...dbValues, 0], 'loop-gain magnitude')
  const dbStep = 20
  const dbDomain: [number, number] = [Math.floor(dbLo / dbStep) * dbStep, Math.ceil((dbHi + 0.2 * (dbHi - dbLo)) / dbStep) * dbStep]
  const fcRule = marked === null ? [] : [{data: {values: [{f: marked}]}, mark: MARKER_RULE, encoding: {x: {field: 'f', type: 'quantitative' as const}}}]
  // Each layer names its own x: a layer without frequencies (the 0 dB and −180° rules) must
  // not inherit the log x field, or its rows would be filtered out as invalid.
  const xTop = x({title: null, labels: false})
  const xBottom = x({title: 'Frequency (Hz)', labels: true})

  const magnitudePanel = {
    width: CHART_WIDTH,
    height: PANEL_HEIGHT,
    layer: [
      {
        data: {values: magnitude.map((p) => ({f: p.x, db: 20 * Math.log10(p.y)}))},
        mark: {type: 'line' as const, color: TOTAL_STYLE.colour, strokeWidth: 1.6, clip: true},
        encoding: {
          x: xTop,
          y: {field: 'db', type: 'quantitative' as const, scale: {domain: dbDomain, nice: false}, axis: {title: 'Loop gain |T| (dB)', grid: true, tickCount: 5}}
        }
      },
      {data: {values: [{db: 0}]}, mark: REFERENCE_RULE, encoding: {y: {field: 'db', type: 'quantitative' as const}}},
      ...fcRule,
      marked === null
        ? {
            data: {values: [{text: NO_CROSSOVER_TEXT}]},
            mark: {...NOTE_TEXT, align: 'right' as const, baseline: 'top' as const},
            encoding: {x: {value: CHART_WIDTH - 6}, y: {value: 6}, text: {field: 'text', type: 'nominal' as const}}
          }
        : {
            data: {values: [{f: marked}]},
            transform: [{calculate: `'fc = ' + ${siTextExpr('datum.f', 'Hz')}`, as: 'text'}],
            mark: {...NOTE_TEXT, ...beside, baseline: 'top' as const},
            encoding: {x: {field: 'f', type: 'quantitative' as const}, y: {value: 6}, text: {field: 'text', type: 'nominal' as const}}
          }
    ]
  }

  const pmMarker =
    marked === null || pm === null || !Number.isFinite(pm)
      ? []
      : [
          {
            data: {values: [{f: marked, deg: pm - 180, pm}]},
            transform: [{calculate: "'PM = ' + format(datum.pm, '.1f') + '°'", as: 'text'}],
            layer: [
              {mark: {type: 'point' as const, shape: 'circle' as const, filled: true, size: 30, color: INK.note}},
              {
                // At the top of the panel beside the fc rule: right of the crossover the phase
                // has fallen, so the curve stays clear of the label.
                mark: {...NOTE_TEXT, ...beside, baseline: 'top' as const},
                encoding: {y: {value: 6}, text: {field: 'text', type: 'nominal' as const}}
              }
            ],
            encoding: {x: {field: 'f', type: 'quantitative' as const}, y: {field: 'deg', type: 'quantitative' as const}}
          }
        ]

  const phasePanel = {
    width: CHART_WIDTH,
    height: PANEL_HEIGHT,
    layer: [
      {
        data: {values: phase.map((p) => ({f: p.x, deg: p.y}))},
        mark: {type: 'line' as const, color: TOTAL_STYLE.colour, strokeWidth: 1.6, clip: true},
        encoding: {
          x: xBottom,
          y: {
            field: 'deg',
            type: 'quantitative' as const,
            scale: {domain: phaseDomain, nice: false},
            axis: {title: 'Phase of T (°)', values: phaseTicks, grid: true}
          }
        }
      },
      {data: {values: [{deg: -180}]}, mark: REFERENCE_RULE, encoding: {y: {field: 'deg', type: 'quantitative' as const}}},
      ...fcRule,
      ...pmMarker
    ]
  }

  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: CHART_CONFIG,
    spacing: 8,
    resolve: {scale: {x: 'shared'}},
    vconcat: [magnitudePanel, phasePanel]
  }
}
