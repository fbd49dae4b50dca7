/**
 * Decorations drawn after their content, over the pages it took: the bar beside a block
 * quote or a long callout. Pages are buffered, so earlier pages can be revisited.
 */
import type {RenderContext} from './context.js'
import {lastPageIndex, maxY} from './pdfkit.js'

export interface Place {
  page: number
  y: number
}

/** A vertical bar at `x` from `start` to `end`, one segment per page. */
export function drawBar(ctx: RenderContext, start: Place, end: Place, x: number, width: number, colour: string): void {
  const {doc} = ctx
  const last = lastPageIndex(doc)
  const saved = {x: doc.x, y: doc.y}
  for (let p = start.page; p <= end.page; p++) {
    if (p !== last) doc.switchToPage(p)
    const top = p === start.page ? start.y : doc.page.margins.top
    const bottom = p === end.page ? end.y : maxY(doc)
    if (bottom > top) doc.save().rect(x, top, width, bottom - top).fill(colour).restore()
    if (p !== last) doc.switchToPage(last)
  }
  doc.x = saved.x
  doc.y = saved.y
}
