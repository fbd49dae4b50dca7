/**
 * Charts of one stage: figure nodes carrying the vega-lite specs of src/report/charts with
 * their data (the renderers compile them).
 */
import type {StageEvaluation} from '../../evaluate/index.js'
import type {ReportContext} from '../context.js'
import type {FigureNode} from '../types.js'
import {cumulativeRmsSpec, dcBarsSpec, loopGainSpec, noiseDensitySpec, responseSpec} from '../charts/index.js'
import {coincidingCurves} from '../charts/noise-density.js'
import {dcPresent, noisePresent} from '../present.js'
import {DC_LABELS, NOISE_LABELS} from '../../results/labels.js'
import type {TopLevelSpec} from 'vega-lite'

const figure = (ctx: ReportContext, chart: TopLevelSpec, caption: string): FigureNode =>
  ({type: 'figure', number: ++ctx.figure, caption, chart})

export const dcFigure = (ctx: ReportContext, ev: StageEvaluation): FigureNode =>
  figure(ctx, dcBarsSpec({...ev.result.dc, contributors: ev.result.dc.contributors.filter((c) => dcPresent(ev.input, c.key))}, {labels: DC_LABELS}),
    `DC error contributors of stage ${ev.input.id}, output-referred, largest first`)

export function noiseFigures(ctx: ReportContext, ev: StageEvaluation): FigureNode[] {
  const density = noiseDensitySpec(ev.result.curves, {labels: NOISE_LABELS})
  // Only contributors that apply to this topology are worth naming as "not drawn".
  // …and that come from a part the circuit has: an absent part is neither drawn nor named.
  const applies = new Set(ev.result.noise.contributors.map((c) => c.key).filter((k) => noisePresent(ev.input, k)))
  const omittedKeys = density.omitted.filter((k) => applies.has(k))
  const omitted = omittedKeys.length > 0
    ? ` (not drawn, below 0.1 % of the total everywhere: ${omittedKeys.map((k) => NOISE_LABELS[k]).join('; ')})`
    : ''
  const drawn = [...applies].filter((k) => !density.omitted.includes(k))
  const name = (k: string): string => (k === 'total' ? 'the total' : NOISE_LABELS[k as keyof typeof NOISE_LABELS])
  const pairs = coincidingCurves(ev.result.curves, drawn)
  const coincide = pairs.length > 0
    ? `; ${pairs.map(([a, b]) => `${name(a)} and ${name(b)}`).join(', ')} coincide (within 2 %), so one line hides the other`
    : ''
  return [
    figure(ctx, density.spec, `Output noise density of stage ${ev.input.id} by contributor, and total${omitted}${coincide}`),
    figure(ctx, cumulativeRmsSpec(ev.result.curves),
      `Cumulative output noise rms of stage ${ev.input.id} from the band's lower edge`)
  ]
}

export const loopFigure = (ctx: ReportContext, ev: StageEvaluation): FigureNode =>
  figure(ctx, loopGainSpec(ev.result.curves, ev.result.stability),
    `Loop gain of stage ${ev.input.id}: magnitude and phase, crossover and phase margin marked`)

/** The low-pass response chart (DESIGN §8.4); null for other topologies. */
export const responseFigure = (ctx: ReportContext, ev: StageEvaluation): FigureNode | null =>
  ev.result.filter === null
    ? null
    : figure(ctx, responseSpec(ev.result.curves, ev.result.filter),
      `Signal response of stage ${ev.input.id}: magnitude and phase of H(f)/H(0), f0 marked`)
