/**
 * Chart rendering: a vega-lite spec (from `src/report/charts/`) → vega → SVG text, headless,
 * deterministic and with no access to files or the network.
 *
 *   TopLevelSpec ──vl.compile──▶ vega spec ──vega.parse + View(renderer 'none')──▶ toSVG()
 *
 * What this module guarantees:
 * - text is measured with the DejaVu advance widths of the fonts the caller passes, so the
 *   layout does not depend on whether a canvas package happens to be installed;
 * - the same spec and fonts give the same SVG string (SVG def ids reset, randomness seeded);
 * - the view's loader refuses every load: a spec with `data.url` is an error;
 * - every warning of vega-lite or vega is returned in `warnings` (a log scale given a zero is
 *   one of them); the caller decides whether to fail. vega errors and "Loading failed" throw.
 *
 * The text metric is installed on the vega-scenegraph copy that `vega` exports, which is the
 * one vega's layout uses; the SVG renderer's own copy would measure by estimate, but it only
 * measures to truncate text at a `limit`, and the chart config sets no limits (see
 * `charts/theme.ts`), so no text is cut.
 *
 * vega keeps its text metric and random source in module state: a render installs ours only
 * for the synchronous part of its run (see `renderNow`) and puts the previous ones back
 * before its first await, so renders may run at once and no state of ours outlives a call.
 * Placing the SVG in the PDF (px → pt, font mapping) is left to `src/render`.
 */
import * as vega from 'vega'
import * as vl from 'vega-lite'
import type {TopLevelSpec} from 'vega-lite'
import {faceOfWeight, measureText, type ChartFonts} from '../../report/charts/fonts.js'

export type {ChartFonts} from '../../report/charts/fonts.js'

/** A rendered chart. */
export interface ChartSvg {
  /** The SVG document text. */
  svg: string
  /** The SVG's own `width` attribute, px. */
  width: number
  /** The SVG's own `height` attribute, px. */
  height: number
  /** vega-lite and vega warnings, in the order they were logged; empty for a clean chart. */
  warnings: string[]
}

type Logger = NonNullable<vega.ViewOptions['logger']>

/** The part of a vega text item that the text metric reads. */
interface TextItem {
  fontSize?: number | string
  fontWeight?: number | string
  limit?: number
}

/** vega runtime exports that vega-typings does not declare. */
interface VegaRuntime {
  textMetrics: {width: (item: TextItem, text: unknown) => number}
  /** vega-statistics' current random source (a live binding). */
  random: () => number
  setRandom: (random: () => number) => void
  randomLCG: (seed: number) => () => number
}
// The names exist at runtime (vega 6 re-exports them from vega-scenegraph and vega-statistics).
const runtime = vega as unknown as VegaRuntime

const REFUSED = 'charts never load files or URLs'

/** A loader that refuses everything: we generate every spec ourselves and embed its data. */
const refusingLoader: vega.Loader = {
  load: (uri) => Promise.reject(new Error(`${REFUSED} (asked for ${uri})`)),
  sanitize: (uri) => Promise.reject(new Error(`${REFUSED} (asked for ${uri})`)),
  http: (uri) => Promise.reject(new Error(`${REFUSED} (asked for ${uri})`)),
  file: (filename) => Promise.reject(new Error(`${REFUSED} (asked for ${filename})`))
}

/** A logger that records messages instead of printing them. */
function collectingLogger(warnings: string[], errors: string[]): Logger {
  let level = vega.Warn
  const text = (args: unknown[]) => args.map((a) => (a instanceof Error ? a.message : String(a))).join(' ')
  const logger: Logger = {
    level(value?: number) {
      if (value === undefined) return level
      level = value
      return logger
    },
    error(...args: unknown[]) {
      errors.push(text(args))
      return logger
    },
    warn(...args: unknown[]) {
      warnings.push(text(args))
      return logger
    },
    info() {
      return logger
    },
    debug() {
      return logger
    }
  }
  return logger
}

/** vega's default font size when an item has none, px. */
const VEGA_DEFAULT_FONT_SIZE = 11

/**
 * vega's text metric on our fonts. Raw text is measured; when the item has a `limit`, the
 * width is capped at it, which is what vega's own truncation search expects of a metric.
 */
function textWidth(fonts: ChartFonts) {
  return (item: TextItem, text: unknown): number => {
    const line = text == null ? '' : String(text).trim()
    const size = item.fontSize == null ? VEGA_DEFAULT_FONT_SIZE : Number(item.fontSize) || 0
    const width = measureText(fonts, faceOfWeight(item.fontWeight), size, line)
    return item.limit !== undefined && item.limit > 0 ? Math.min(width, item.limit) : width
  }
}

/** Read a numeric attribute of the root `<svg>` element, px. */
function svgSize(svg: string, attribute: 'width' | 'height'): number {
  const root = /<svg\b[^>]*>/.exec(svg)?.[0] ?? ''
  const match = new RegExp(`\\s${attribute}="([0-9.]+)"`).exec(root)
  const value = match === null ? NaN : Number(match[1])
  if (!Number.isFinite(value)) throw new Error(`Unexpected SVG from vega: no numeric ${attribute} on <svg>`)
  return value
}

/**
 * Number the SVG's def ids (clip paths, gradients) from 1 in order of appearance. vega 6.2
 * installs two copies of vega-scenegraph (its own 5.1 and vega-view's 5.3), and
 * `vega.resetSVGDefIds()` only resets the first while the renderer counts with the second,
 * so the ids would otherwise grow from one render to the next.
 */
function renumberDefIds(svg: string): string {
  const ids = new Map<string, string>()
  return svg.replace(/(id="|url\(#)((?:clip|gradient_)\d+)/g, (_, lead: string, id: string) => {
    let next = ids.get(id)
    if (next === undefined) {
      next = `${id.startsWith('clip') ? 'clip' : 'gradient_'}${ids.size + 1}`
      ids.set(id, next)
    }
    return lead + next
  })
}

/** The view's dataflow clock: one more for every pulse it runs (vega-dataflow `stamp()`, public but not in vega-typings). */
const pulseStamp = (view: vega.View): number => (view as unknown as {stamp: () => number}).stamp()

/** Seed of vega's random source; any constant works, it only has to be fixed. */
const RANDOM_SEED = 1

async function renderNow(spec: TopLevelSpec, fonts: ChartFonts): Promise<ChartSvg> {
  const warnings: string[] = []
  const errors: string[] = []
  const vgSpec = vl.compile(spec, {logger: collectingLogger(warnings, errors)}).spec
  // vega's text metric and random source are vega's module state. They are ours only for
  // this synchronous section: the view is built and its dataflow run; vega measures text
  // (and would draw random numbers) while its operators run, which happens before
  // `runAsync` returns its promise for a spec with inline data. Both are put back before the
  // first await, so renders running at once cannot see each other's metric, and nothing of
  // ours outlives the call.
  const previousWidth = runtime.textMetrics.width
  const previousRandom = runtime.random
  let view: vega.View
  let running: Promise<unknown>
  let stamp: number
  runtime.textMetrics.width = textWidth(fonts)
  runtime.setRandom(runtime.randomLCG(RANDOM_SEED))
  try {
    view = new vega.View(vega.parse(vgSpec), {
      renderer: 'none',
      loader: refusingLoader,
      logger: collectingLogger(warnings, errors),
      logLevel: vega.Warn
    })
    running = view.runAsync()
    stamp = pulseStamp(view)
  } finally {
    runtime.textMetrics.width = previousWidth
    runtime.setRandom(previousRandom)
  }
  try {
    await running
    const failures = (): string[] => [...errors, ...warnings.filter((w) => w.startsWith('Loading failed') || w.startsWith('Data ingestion failed'))]
    if (failures().length > 0) throw new Error(`Chart rendering failed: ${failures().join('; ')}`)
    // A pulse after the synchronous section would have laid text out with vega's estimate:
    // refuse the chart rather than draw it wrong (none of our specs does this).
    if (pulseStamp(view) !== stamp) throw new Error('Chart rendering failed: vega ran this chart asynchronously, outside the DejaVu text metric')
    vega.resetSVGDefIds()
    const svg = renumberDefIds(await view.toSVG())
    if (failures().length > 0) throw new Error(`Chart rendering failed: ${failures().join('; ')}`)
    return {svg, width: svgSize(svg, 'width'), height: svgSize(svg, 'height'), warnings}
  } finally {
    view.finalize()
  }
}

/**
 * Render a vega-lite spec to SVG text.
 *
 * @param spec
 *   A spec with inline data only (`data.values`); any URL or file load is refused.
 * @param fonts
 *   Bytes of DejaVu Sans regular and bold, used to measure text for layout.
 * @returns
 *   The SVG, its size in px, and every warning logged. Rejects on a vega error or a refused load.
 */
export function renderChartSvg(spec: TopLevelSpec, fonts: ChartFonts): Promise<ChartSvg> {
  return renderNow(spec, fonts)
}
