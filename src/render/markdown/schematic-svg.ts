/**
 * A schematic `Drawing` as SVG text, for the Markdown report (and for tests that count
 * symbols). Each part is a `<g class="part" data-key="…" data-symbol="…">`; text uses the
 * charts' font family. Deterministic: numbers are rounded to 0.01 pt.
 */
import {CHART_FONT_FAMILY} from '../../report/charts/fonts.js'
import type {Drawing, Primitive} from '../../report/schematic/types.js'

const n = (x: number): string => String(Math.round(x * 100) / 100)

const escape = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')

function primitiveSvg(p: Primitive): string {
  switch (p.kind) {
    case 'line': return `<polyline points="${p.points.map(([x, y]) => `${n(x)},${n(y)}`).join(' ')}" fill="none"/>`
    case 'polygon': return `<polygon points="${p.points.map(([x, y]) => `${n(x)},${n(y)}`).join(' ')}" fill="${p.fill ? 'currentColor' : 'white'}"/>`
    case 'rect': return `<rect x="${n(p.x)}" y="${n(p.y)}" width="${n(p.width)}" height="${n(p.height)}" fill="white"/>`
    case 'circle': return `<circle cx="${n(p.cx)}" cy="${n(p.cy)}" r="${n(p.r)}" fill="${p.fill ? 'currentColor' : 'white'}"/>`
    case 'text': return `<text x="${n(p.x)}" y="${n(p.y)}" font-size="${n(p.size)}" text-anchor="${p.anchor}" dominant-baseline="central"` +
      `${p.bold ? ' font-weight="bold"' : ''} stroke="none" fill="currentColor">${escape(p.text)}</text>`
  }
}

/** The drawing as a standalone SVG document (pt as user units). */
export function drawingToSvg(d: Drawing): string {
  const lines = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(d.width)}pt" height="${n(d.height)}pt" viewBox="0 0 ${n(d.width)} ${n(d.height)}" ` +
      `color="#000000" stroke="currentColor" stroke-width="0.9" stroke-linecap="round" stroke-linejoin="round" font-family="${CHART_FONT_FAMILY}">`,
    ...d.parts.map((part) => `<g class="part" data-key="${escape(part.key)}" data-symbol="${part.symbol}">${part.primitives.map(primitiveSvg).join('')}</g>`),
    `<g class="wiring">${d.wiring.map(primitiveSvg).join('')}</g>`,
    `<g class="labels">${d.labels.map(primitiveSvg).join('')}</g>`,
    '</svg>'
  ]
  return `${lines.join('\n')}\n`
}
