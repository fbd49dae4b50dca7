/**
 * The figures of a report tree, ready to draw: each chart's vega-lite spec compiled to SVG
 * (./vega.ts) with its natural size in pt; a figure given as SVG is taken as it is. Both
 * renderers (src/render/pdf, src/render/markdown) draw from this; a caller that renders
 * several formats compiles once and passes the result to each.
 */
import type {Root, RootContent} from 'mdast'
import type {FigureNode, ReportDocument} from '../../report/types.js'
import {renderChartSvg, type ChartFonts} from './vega.js'

/** SVG user units (px, 96 per inch) to PDF points (72 per inch). */
const PX_TO_PT = 0.75

export interface DrawnFigure {
  svg: string
  /** Natural size, pt (0: unknown, the renderer chooses). */
  width: number
  height: number
}

export interface CompiledFigures {
  byNode: ReadonlyMap<FigureNode, DrawnFigure>
  /** Chart warnings, `chart “caption”: warning`, in document order. */
  warnings: string[]
}

function collect(nodes: readonly RootContent[], out: FigureNode[]): FigureNode[] {
  for (const n of nodes) {
    if (n.type === 'figure') out.push(n)
    else if ('children' in n && Array.isArray(n.children)) collect(n.children as RootContent[], out)
  }
  return out
}

/** The figure nodes of a document (body, then appendix), in document order. */
export const figuresOf = (doc: Pick<ReportDocument, 'body' | 'appendix'>): FigureNode[] =>
  [doc.body, doc.appendix].reduce<FigureNode[]>((out, root: Root) => collect(root.children, out), [])

/** Compile every figure of `doc`, one after the other (the same input gives the same SVG). */
export async function compileFigures(doc: Pick<ReportDocument, 'body' | 'appendix'>, fonts: ChartFonts): Promise<CompiledFigures> {
  const byNode = new Map<FigureNode, DrawnFigure>()
  const warnings: string[] = []
  for (const node of figuresOf(doc)) {
    if (node.chart === undefined) {
      byNode.set(node, {svg: node.svg ?? '', width: node.width ?? 0, height: node.height ?? 0})
      continue
    }
    const chart = await renderChartSvg(node.chart, fonts)
    for (const w of chart.warnings) warnings.push(`chart “${node.caption}”: ${w}`)
    byNode.set(node, {svg: chart.svg, width: chart.width * PX_TO_PT, height: chart.height * PX_TO_PT})
  }
  return {byNode, warnings}
}
