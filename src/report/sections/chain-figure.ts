/**
 * A chain chart or drawing rendered to a figure node (the same path as the stage charts).
 */
import type {TopLevelSpec} from 'vega-lite'
import type {ReportContext} from '../context.js'
import type {FigureNode} from '../types.js'
import {renderChartSvg} from '../vega.js'

const PX_TO_PT = 0.75

export async function chainFigure(ctx: ReportContext, spec: TopLevelSpec, caption: string): Promise<FigureNode> {
  const chart = await renderChartSvg(spec, ctx.fonts)
  for (const w of chart.warnings) ctx.warnings.push(`chart “${caption}”: ${w}`)
  return {type: 'figure', number: ++ctx.figure, caption, svg: chart.svg, width: chart.width * PX_TO_PT, height: chart.height * PX_TO_PT}
}
