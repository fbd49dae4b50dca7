/**
 * Charts of one stage: vega-lite specs from src/report/charts rendered to SVG figure nodes.
 */
import type {StageEvaluation} from '../../evaluate/index.js'
import type {ReportContext} from '../context.js'
import type {FigureNode} from '../types.js'
import {cumulativeRmsSpec, dcBarsSpec, loopGainSpec, noiseDensitySpec, responseSpec} from '../charts/index.js'
import {renderChartSvg} from '../vega.js'
import {DC_LABELS, NOISE_LABELS} from '../../results/labels.js'
import type {TopLevelSpec} from 'vega-lite'

/** SVG user units (px, 96 per inch) to PDF points (72 per inch). */
const PX_TO_PT = 0.75

async function figure(ctx: ReportContext, spec: TopLevelSpec, caption: string): Promise<FigureNode> {
  const chart = await renderChartSvg(spec, ctx.fonts)
  for (const w of chart.warnings) ctx.warnings.push(`chart “${caption}”: ${w}`)
  return {type: 'figure', number: ++ctx.figure, caption, svg: chart.svg, width: chart.width * PX_TO_PT, height: chart.height * PX_TO_PT}
}

export const dcFigure = (ctx: ReportContext, ev: StageEvaluation): Promise<FigureNode> =>
  figure(ctx, dcBarsSpec(ev.result.dc, {labels: DC_LABELS}),
    `DC error contributors of stage ${ev.input.id}, output-referred, largest first`)

export async function noiseFigures(ctx: ReportContext, ev: StageEvaluation): Promise<FigureNode[]> {
  const density = noiseDensitySpec(ev.result.curves, {labels: NOISE_LABELS})
  // Only contributors that apply to this topology are worth naming as "not drawn".
  const applies = new Set(ev.result.noise.contributors.map((c) => c.key))
  const omittedKeys = density.omitted.filter((k) => applies.has(k))
  const omitted = omittedKeys.length > 0
    ? ` (not drawn, below 0.1 % of the total everywhere: ${omittedKeys.map((k) => NOISE_LABELS[k]).join('; ')})`
    : ''
  return [
    await figure(ctx, density.spec, `Output noise density of stage ${ev.input.id} by contributor, and total${omitted}`),
    await figure(ctx, cumulativeRmsSpec(ev.result.curves),
      `Cumulative output noise rms of stage ${ev.input.id} from the band's lower edge`)
  ]
}

export const loopFigure = (ctx: ReportContext, ev: StageEvaluation): Promise<FigureNode> =>
  figure(ctx, loopGainSpec(ev.result.curves, ev.result.stability),
    `Loop gain of stage ${ev.input.id}: magnitude and phase, crossover and phase margin marked`)

/** The low-pass response chart (DESIGN §8.4); null for other topologies. */
export const responseFigure = async (ctx: ReportContext, ev: StageEvaluation): Promise<FigureNode | null> =>
  ev.result.filter === null
    ? null
    : figure(ctx, responseSpec(ev.result.curves, ev.result.filter),
      `Signal response of stage ${ev.input.id}: magnitude and phase of H(f)/H(0), f0 marked`)
