/**
 * A layout plus the parts a stage has → a `Drawing`: each present part's symbol placed and
 * labelled, the wires and junctions whose conditions hold. Parts the stage lacks are not
 * drawn; a series part's place is then taken by the layout's `unless` wire.
 */
import {INAMP_PINS, OPAMP_PINS, placeSymbol, transformPoint} from './symbols.js'
import type {Condition, Drawing, DrawnPart, Layout, PartKey, Placement, Point, Primitive} from './types.js'

/** Label text of a present part: the first line (its key) is set bold. */
export interface PartLabel {
  lines: string[]
}

/** Text size of part labels, pt, and their line pitch. */
export const LABEL_SIZE = 7
const LINE_PITCH = 8.5
const GAP = 3

interface Box {
  left: number
  top: number
  right: number
  bottom: number
}

function boxOf(primitives: readonly Primitive[]): Box {
  const xs: number[] = []
  const ys: number[] = []
  for (const p of primitives) {
    if (p.kind === 'line' || p.kind === 'polygon') for (const [x, y] of p.points) { xs.push(x); ys.push(y) }
    else if (p.kind === 'rect') { xs.push(p.x, p.x + p.width); ys.push(p.y, p.y + p.height) }
    else if (p.kind === 'circle') { xs.push(p.cx - p.r, p.cx + p.r); ys.push(p.cy - p.r, p.cy + p.r) }
  }
  return {left: Math.min(...xs), top: Math.min(...ys), right: Math.max(...xs), bottom: Math.max(...ys)}
}

const text = (x: number, y: number, s: string, anchor: 'start' | 'middle' | 'end', bold: boolean): Primitive =>
  ({kind: 'text', x, y, text: s, anchor, size: LABEL_SIZE, bold})

function labelLines(lines: readonly string[], place: Placement, box: Box): Primitive[] {
  const vertical = place.rotate === 90 || place.rotate === 270
  const side = place.label ?? (vertical ? 'right' : 'above')
  const n = lines.length
  const midX = (box.left + box.right) / 2
  const midY = (box.top + box.bottom) / 2
  return lines.map((s, i) => {
    const bold = i === 0
    switch (side) {
      case 'above': return text(midX, box.top - GAP - LABEL_SIZE / 2 - (n - 1 - i) * LINE_PITCH, s, 'middle', bold)
      case 'below': return text(midX, box.bottom + GAP + LABEL_SIZE / 2 + i * LINE_PITCH, s, 'middle', bold)
      case 'right': return text(box.right + GAP, midY + (i - (n - 1) / 2) * LINE_PITCH, s, 'start', bold)
      case 'left': return text(box.left - GAP, midY + (i - (n - 1) / 2) * LINE_PITCH, s, 'end', bold)
    }
  })
}

/** The amplifier's name where the layout puts it, the supply rails at its supply leads. */
function amplifierLabels(symbol: 'opamp' | 'inamp', lines: readonly string[], at: Point, name: Point, supply: PartLabel | undefined): Primitive[] {
  const out: Primitive[] = lines.map((s, i) => text(name[0], name[1] + i * LINE_PITCH, s, 'start', i === 0))
  const [vpos, vneg] = supply?.lines ?? []
  const pins = symbol === 'opamp' ? OPAMP_PINS : INAMP_PINS
  const p = transformPoint(pins.vpos, at, 0)
  const m = transformPoint(pins.vneg, at, 0)
  if (vpos !== undefined) out.push(text(p[0] - GAP, p[1], vpos, 'end', false))
  if (vneg !== undefined) out.push(text(m[0] - GAP, m[1], vneg, 'end', false))
  return out
}

/** Margin kept around the drawn content, pt. */
const MARGIN = 6

/** Rough text extent (DejaVu Sans averages about 0.6 em a character); used only for cropping. */
function textBox(p: Extract<Primitive, {kind: 'text'}>): Box {
  const w = 0.6 * p.size * [...p.text].length
  const left = p.anchor === 'start' ? p.x : p.anchor === 'middle' ? p.x - w / 2 : p.x - w
  return {left, right: left + w, top: p.y - p.size / 2, bottom: p.y + p.size / 2}
}

const shift = (p: Primitive, dx: number, dy: number): Primitive => {
  const m = (q: Point): Point => [q[0] + dx, q[1] + dy]
  switch (p.kind) {
    case 'line': return {kind: 'line', points: p.points.map(m)}
    case 'polygon': return {...p, points: p.points.map(m)}
    case 'rect': return {...p, x: p.x + dx, y: p.y + dy}
    case 'circle': return {...p, cx: p.cx + dx, cy: p.cy + dy}
    case 'text': return {...p, x: p.x + dx, y: p.y + dy}
  }
}

/**
 * The drawing trimmed to what is drawn (a layout leaves room for parts a stage may not
 * have), with a small margin.
 */
function cropped(d: Drawing): Drawing {
  const all = [...d.parts.flatMap((p) => p.primitives), ...d.wiring, ...d.labels]
  const boxes = all.map((p) => (p.kind === 'text' ? textBox(p) : boxOf([p])))
  const left = Math.min(...boxes.map((b) => b.left)) - MARGIN
  const top = Math.min(...boxes.map((b) => b.top)) - MARGIN
  const right = Math.max(...boxes.map((b) => b.right)) + MARGIN
  const bottom = Math.max(...boxes.map((b) => b.bottom)) + MARGIN
  const dx = -left
  const dy = -top
  return {
    width: right - left,
    height: bottom - top,
    parts: d.parts.map((p) => ({...p, primitives: p.primitives.map((q) => shift(q, dx, dy)), pins: p.pins.map((q): Point => [q[0] + dx, q[1] + dy])})),
    wiring: d.wiring.map((q) => shift(q, dx, dy)),
    labels: d.labels.map((q) => shift(q, dx, dy))
  }
}

/** Dots where three or more segment ends (wires, part leads, op-amp pins) meet. */
function junctions(parts: readonly DrawnPart[], wiring: readonly Primitive[]): Primitive[] {
  const ends = new Map<string, {at: Point; n: number}>()
  const add = (at: Point): void => {
    const key = `${Math.round(at[0] * 10)},${Math.round(at[1] * 10)}`
    const e = ends.get(key)
    if (e === undefined) ends.set(key, {at, n: 1})
    else e.n += 1
  }
  const segments = (p: Primitive): void => {
    if (p.kind !== 'line') return
    for (let i = 1; i < p.points.length; i++) {
      add(p.points[i - 1] as Point)
      add(p.points[i] as Point)
    }
  }
  wiring.forEach(segments)
  for (const part of parts) {
    part.primitives.forEach(segments)
    part.pins.forEach(add)
  }
  return [...ends.values()].filter((e) => e.n >= 3).map((e) => ({kind: 'circle', cx: e.at[0], cy: e.at[1], r: 1.8, fill: true}))
}

/**
 * Resolve a layout for the parts present. `labels` holds one entry per present part key;
 * the key `supply` (two lines: positive rail, negative rail) labels the op-amp's leads.
 */
export function drawLayout(layout: Layout, labels: ReadonlyMap<PartKey, PartLabel>): Drawing {
  const present = (c: Condition | undefined): boolean =>
    c === undefined || (typeof c === 'string' ? labels.has(c) : c.some((k) => labels.has(k)))
  const parts: DrawnPart[] = []
  const texts: Primitive[] = []
  for (const place of layout.parts) {
    const label = place.with === undefined ? labels.get(place.key) : labels.has(place.with) ? {lines: []} : undefined
    if (label === undefined || (place.unless !== undefined && present(place.unless))) continue
    if (place.when !== undefined && !present(place.when)) continue
    if (place.whenAll !== undefined && !place.whenAll.every((k) => labels.has(k))) continue
    const primitives = placeSymbol(place.symbol, place.at, place.rotate ?? 0, place.plusOnTop ?? false)
    // The amplifier's inputs, output and gain pins sit on its outline, not on a lead: each is one wire end.
    const outline = place.symbol === 'opamp' ? [OPAMP_PINS.upper, OPAMP_PINS.lower, OPAMP_PINS.out]
      : place.symbol === 'inamp' ? [INAMP_PINS.upper, INAMP_PINS.lower, INAMP_PINS.rgTop, INAMP_PINS.rgBottom, INAMP_PINS.out] : []
    const pins = outline.map((p) => transformPoint(p, place.at, 0))
    parts.push({key: place.key, symbol: place.symbol, primitives, pins})
    if (place.symbol === 'opamp' || place.symbol === 'inamp') texts.push(...amplifierLabels(place.symbol, label.lines, place.at, layout.opampLabel, labels.get('supply')))
    else if (place.symbol !== 'ground' && label.lines.length > 0) texts.push(...labelLines(label.lines, place, boxOf(primitives.filter((p) => p.kind !== 'text'))))
  }
  const wiring: Primitive[] = []
  for (const w of layout.wires) {
    if (!present(w.when)) continue
    if (w.unless !== undefined && present(w.unless)) continue
    if (w.whenAll !== undefined && !w.whenAll.every((k) => labels.has(k))) continue
    wiring.push({kind: 'line', points: w.points})
  }
  wiring.push(...junctions(parts, wiring))
  return cropped({width: layout.width, height: layout.height, parts, wiring, labels: texts})
}
