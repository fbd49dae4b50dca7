/**
 * Pieces the layouts share: the feedback network over an op-amp with the − input on top, the
 * + input's path down to the reference, the output side with its load (DESIGN §8.3), and the
 * differential source with its common mode (§8.1, §8.2).
 */
import type {Placement, Point, Wire} from '../types.js'

export interface Piece {
  parts: readonly Placement[]
  wires: readonly Wire[]
}

/** The parts of the load side: any one of them moves the output terminal out past them. */
const LOAD: readonly string[] = ['riso', 'cload', 'rload']
const SHUNT_LOAD: readonly string[] = ['cload', 'rload']

/**
 * The output side from node `f` (where the feedback meets the op-amp's output wire),
 * rightwards: riso in series, then cload and rload down to ground, then the output terminal.
 * Without them the terminal sits close to `f`; after riso alone, just past it; rload alone
 * takes cload's place.
 */
export function loadPiece(f: Point, riso = true): Piece {
  const [x, y] = f
  // Without a place for riso (an in-amp stage takes none) the shunt parts move up to f.
  const sx = riso ? x + 55 : x
  const lx = sx + 15
  const rx = lx + 45
  const both = ['cload', 'rload']
  const parts: Placement[] = [
    {key: 'cload', symbol: 'capacitor', at: [lx, y], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [lx, y + 40], rotate: 90, with: 'cload'},
    {key: 'rload', symbol: 'resistor', at: [lx, y], rotate: 90, unless: 'cload'},
    {key: 'rload', symbol: 'resistor', at: [rx, y], rotate: 90, whenAll: both},
    {key: 'gnd', symbol: 'ground', at: [lx, y + 40], rotate: 90, with: 'rload', unless: 'cload'},
    {key: 'gnd', symbol: 'ground', at: [rx, y + 40], rotate: 90, with: 'rload', whenAll: both},
    {key: 'out', symbol: 'terminal', at: [x + 50, y], unless: LOAD},
    {key: 'out', symbol: 'terminal', at: [lx + 30, y], when: 'cload', unless: 'rload'},
    {key: 'out', symbol: 'terminal', at: [lx + 30, y], when: 'rload', unless: 'cload'},
    {key: 'out', symbol: 'terminal', at: [rx + 30, y], whenAll: both}
  ]
  const wires: Wire[] = [
    {points: [[x, y], [x + 47.5, y]], unless: LOAD},
    {points: [[sx, y], [lx, y]], when: SHUNT_LOAD},
    {points: [[lx, y], [lx + 27.5, y]], when: 'cload', unless: 'rload'},
    {points: [[lx, y], [lx + 27.5, y]], when: 'rload', unless: 'cload'},
    {points: [[lx, y], [rx, y]], whenAll: both},
    {points: [[rx, y], [rx + 27.5, y]], whenAll: both}
  ]
  if (riso) {
    parts.push(
      {key: 'riso', symbol: 'resistor', at: [x + 15, y]},
      {key: 'out', symbol: 'terminal', at: [x + 85, y], when: 'riso', unless: SHUNT_LOAD})
    wires.push(
      {points: [[x, y], [x + 15, y]], when: LOAD},
      {points: [[x + 15, y], [x + 55, y]], when: SHUNT_LOAD, unless: 'riso'},
      {points: [[x + 55, y], [x + 82.5, y]], when: 'riso', unless: SHUNT_LOAD})
  }
  return {parts, wires}
}

/**
 * The feedback network over an op-amp at (250, 140) with the − input on top: node F at
 * (210, 140) on the − row, rf (∥ cf, above it) back from the output node at (330, 155),
 * and the load side from there.
 */
export const feedbackAbove: Piece = {
  parts: [
    {key: 'opamp', symbol: 'opamp', at: [250, 140]},
    {key: 'rf', symbol: 'resistor', at: [250, 80], label: 'below'},
    {key: 'cf', symbol: 'capacitor', at: [250, 50]},
    ...loadPiece([330, 155]).parts
  ],
  wires: [
    {points: [[210, 140], [250, 140]]},
    {points: [[210, 140], [210, 80], [250, 80]]},
    {points: [[250, 80], [290, 80]], unless: 'rf'},
    {points: [[290, 80], [330, 80]]},
    {points: [[330, 80], [330, 155]]},
    {points: [[210, 80], [210, 50], [250, 50]], when: 'cf'},
    {points: [[290, 50], [330, 50], [330, 80]], when: 'cf'},
    {points: [[310, 155], [330, 155]]},
    ...loadPiece([330, 155]).wires
  ]
}

/**
 * The + input (op-amp at (250, 140)) down to node P at (230, 200): cstray-plus from P to
 * ground on the left, rcomp (∥ ccomp on the right) down to the reference source, or to
 * ground when vref is 0 V; P itself grounded when there is neither.
 */
export const referenceBelow: Piece = {
  parts: [
    {key: 'rcomp', symbol: 'resistor', at: [230, 200], rotate: 90, label: 'left'},
    {key: 'ccomp', symbol: 'capacitor', at: [280, 200], rotate: 90},
    {key: 'cstray-plus', symbol: 'capacitor', at: [180, 200], rotate: 90, label: 'left'},
    {key: 'gnd', symbol: 'ground', at: [180, 240], rotate: 90, with: 'cstray-plus'},
    {key: 'vref', symbol: 'voltage-source', at: [230, 240], rotate: 90, label: 'left'},
    {key: 'gnd', symbol: 'ground', at: [230, 280], rotate: 90, with: 'vref'},
    {key: 'gnd', symbol: 'ground', at: [230, 240], rotate: 90, with: 'rcomp', unless: 'vref'},
    {key: 'gnd', symbol: 'ground', at: [230, 200], rotate: 90, with: 'opamp', unless: ['rcomp', 'vref']}
  ],
  wires: [
    {points: [[250, 170], [230, 170]]},
    {points: [[230, 170], [230, 200]]},
    {points: [[230, 200], [230, 240]], when: 'vref', unless: 'rcomp'},
    {points: [[230, 200], [280, 200]], when: 'ccomp'},
    {points: [[280, 240], [230, 240]], when: 'ccomp'},
    {points: [[230, 200], [180, 200]], when: 'cstray-plus'}
  ]
}

/**
 * A differential source (DESIGN §8.1): two halves of vd in series on a column at `x`, from
 * the − leg at `top` down to the + leg at `bottom` (+ towards the + leg), and the common
 * mode vcm from their midpoint to ground on the left (a ground there when vcm is 0 V).
 */
export function differentialSource(x: number, top: number, bottom: number): Piece {
  const mid = (top + bottom) / 2
  const cx = x - 30
  return {
    parts: [
      {key: 'source', symbol: 'voltage-source', at: [x, mid], rotate: 270},
      {key: 'source-half', symbol: 'voltage-source', at: [x, bottom], rotate: 270},
      {key: 'vcm', symbol: 'voltage-source', at: [cx, mid], rotate: 90, label: 'left'},
      {key: 'gnd', symbol: 'ground', at: [cx, mid + 40], rotate: 90, with: 'vcm'},
      {key: 'gnd', symbol: 'ground', at: [cx, mid], rotate: 90, with: 'source', unless: 'vcm'}
    ],
    wires: [
      {points: [[x, mid], [cx, mid]]}
    ]
  }
}
