/**
 * The symbol set of our schematics, after IEC 60617 (shapes from memory of the standard's
 * graphical symbols for diagrams): rectangle resistor, two-plate capacitor, triangle
 * amplifier (the instrumentation amplifier a taller triangle with its gain-resistor pins and
 * reference lead), circle sources (a line along the conductors for a voltage source, across
 * them for a current source), a three-bar ground and an open-circle terminal.
 *
 * Each symbol is drawn in local coordinates with its first pin at the origin; two-terminal
 * symbols run along +x and end at `(length, 0)`. `placeSymbol` turns and moves a symbol
 * into drawing coordinates. Text inside symbols (the op-amp's pin marks, the source's +)
 * keeps its upright position on the page whatever the rotation.
 */
import type {Point, Primitive, Rotation, SymbolName} from './types.js'

/** Length of every two-terminal symbol, pt. */
export const PART_LENGTH = 40

/** Op-amp pins relative to its origin (the upper input). */
export const OPAMP_PINS = {upper: [0, 0], lower: [0, 30], out: [60, 15], vpos: [20, -20], vneg: [20, 50]} as const

/**
 * Instrumentation-amplifier pins relative to its origin (the − input): the gain-resistor pins
 * between the inputs on the left edge, the reference lead down from the lower edge.
 */
export const INAMP_PINS = {
  upper: [0, 0], lower: [0, 80], rgTop: [0, 20], rgBottom: [0, 60], out: [100, 40], vpos: [40, -25], vneg: [40, 105], ref: [70, 105]
} as const

/** Size of the text inside symbols, pt. */
const MARK_SIZE = 8

const line = (...points: Point[]): Primitive => ({kind: 'line', points})
const mark = (x: number, y: number, text: string): Primitive => ({kind: 'text', x, y, text, anchor: 'middle', size: MARK_SIZE, bold: false})

function twoTerminal(body: Primitive[], bodyStart: number, bodyEnd: number): Primitive[] {
  return [line([0, 0], [bodyStart, 0]), ...body, line([bodyEnd, 0], [PART_LENGTH, 0])]
}

/** A symbol's primitives in local coordinates. */
export function symbolPrimitives(symbol: SymbolName, plusOnTop = false): Primitive[] {
  switch (symbol) {
    case 'resistor':
      return twoTerminal([{kind: 'rect', x: 10, y: -4, width: 20, height: 8}], 10, 30)
    case 'capacitor':
      return twoTerminal([line([17, -8], [17, 8]), line([23, -8], [23, 8])], 17, 23)
    case 'voltage-source':
      return twoTerminal([{kind: 'circle', cx: 20, cy: 0, r: 10, fill: false}, line([10, 0], [30, 0]), mark(6, -9, '+')], 10, 30)
    case 'current-source':
      // Current leaves at the first pin (the arrow points at it).
      return twoTerminal([{kind: 'circle', cx: 20, cy: 0, r: 10, fill: false}, line([20, -10], [20, 10]),
        line([27, -16], [15, -16]), {kind: 'polygon', points: [[12, -16], [17, -18.5], [17, -13.5]], fill: true}], 10, 30)
    case 'ground':
      return [line([0, 0], [6, 0]), line([6, -8], [6, 8]), line([9, -5], [9, 5]), line([12, -2], [12, 2])]
    case 'terminal':
      return [{kind: 'circle', cx: 0, cy: 0, r: 2.5, fill: false}]
    case 'opamp': {
      const [upper, lower] = plusOnTop ? ['+', '−'] : ['−', '+']
      return [
        {kind: 'polygon', points: [[0, -15], [0, 45], [60, 15]], fill: false},
        line([20, -5], OPAMP_PINS.vpos), line([20, 35], OPAMP_PINS.vneg),
        mark(7, 0, upper), mark(7, 30, lower)
      ]
    }
    case 'inamp':
      // Edges: upper y = −20 + 0.6x, lower y = 100 − 0.6x.
      return [
        {kind: 'polygon', points: [[0, -20], [0, 100], [100, 40]], fill: false},
        line([40, 4], INAMP_PINS.vpos), line([40, 76], INAMP_PINS.vneg), line([70, 58], INAMP_PINS.ref),
        mark(7, 0, '−'), mark(7, 80, '+'), mark(60, 48, 'ref')
      ]
  }
}

/** A point turned by `rotate` about the origin, then moved to `at`. */
export function transformPoint(p: Point, at: Point, rotate: Rotation): Point {
  const [x, y] = p
  const [dx, dy] = rotate === 0 ? [x, y] : rotate === 90 ? [-y, x] : rotate === 180 ? [-x, -y] : [y, -x]
  return [at[0] + dx, at[1] + dy]
}

/** A local primitive in drawing coordinates; text moves but stays upright. */
export function transformPrimitive(p: Primitive, at: Point, rotate: Rotation): Primitive {
  const t = (q: Point): Point => transformPoint(q, at, rotate)
  switch (p.kind) {
    case 'line': return {kind: 'line', points: p.points.map(t)}
    case 'polygon': return {kind: 'polygon', points: p.points.map(t), fill: p.fill}
    case 'circle': {
      const [cx, cy] = t([p.cx, p.cy])
      return {kind: 'circle', cx, cy, r: p.r, fill: p.fill}
    }
    case 'rect': {
      const [x1, y1] = t([p.x, p.y])
      const [x2, y2] = t([p.x + p.width, p.y + p.height])
      return {kind: 'rect', x: Math.min(x1, x2), y: Math.min(y1, y2), width: Math.abs(x2 - x1), height: Math.abs(y2 - y1)}
    }
    case 'text': {
      const [x, y] = t([p.x, p.y])
      return {...p, x, y}
    }
  }
}

/** A symbol's primitives placed in the drawing. */
export function placeSymbol(symbol: SymbolName, at: Point, rotate: Rotation = 0, plusOnTop = false): Primitive[] {
  return symbolPrimitives(symbol, plusOnTop).map((p) => transformPrimitive(p, at, rotate))
}
