/**
 * A chain chart or drawing as a figure node carrying its vega-lite spec (the renderers
 * compile it, as for the stage charts).
 */
import type {TopLevelSpec} from 'vega-lite'
import type {ReportContext} from '../context.js'
import type {FigureNode} from '../types.js'

export const chainFigure = (ctx: ReportContext, chart: TopLevelSpec, caption: string): FigureNode =>
  ({type: 'figure', number: ++ctx.figure, caption, chart})
