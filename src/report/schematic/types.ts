/**
 * Schematics as drawing data (DESIGN §8.9): what a layout is (placed symbols and wires on a
 * grid, written by hand per topology) and what the report tree carries (a `Drawing`: plain
 * vector primitives that `src/render` draws with pdfkit and the Markdown writer as SVG).
 *
 * Coordinates are points (1/72 in), y downwards, origin at the drawing's top left.
 */

export type Point = readonly [number, number]

/** Text anchor along x; the text is centred vertically on its y. */
export type Anchor = 'start' | 'middle' | 'end'

/** One vector primitive. Strokes share one width and colour; fills are the stroke colour. */
export type Primitive =
  | {kind: 'line'; points: readonly Point[]}
  | {kind: 'rect'; x: number; y: number; width: number; height: number}
  | {kind: 'circle'; cx: number; cy: number; r: number; fill: boolean}
  | {kind: 'polygon'; points: readonly Point[]; fill: boolean}
  | {kind: 'text'; x: number; y: number; text: string; anchor: Anchor; size: number; bold: boolean}

/** The symbols of our set (IEC 60617 shapes; see `symbols.ts`). */
export const SYMBOL_NAMES = [
  'resistor', 'capacitor', 'opamp', 'inamp', 'voltage-source', 'current-source', 'ground', 'terminal'
] as const
export type SymbolName = (typeof SYMBOL_NAMES)[number]

/** Quarter turns, clockwise on the page: 90 runs a two-terminal part downwards from `at`. */
export type Rotation = 0 | 90 | 180 | 270

/**
 * What a placed part stands for: a netlist element by its label (`rf`, `csource`, …), or
 * one of the stage's surroundings. A layout may name labels a stage does not have: those
 * parts are simply absent.
 */
export type PartKey = string

/** One part key, or several of which any one will do. */
export type Condition = PartKey | readonly PartKey[]

/** Where a part's label goes, relative to its symbol. */
export type LabelSide = 'above' | 'below' | 'left' | 'right'

/** A symbol placed in a layout. */
export interface Placement {
  key: PartKey
  symbol: SymbolName
  /** Where the symbol's origin (its first pin) goes. */
  at: Point
  /** Default 0: two-terminal symbols run left to right from `at`. */
  rotate?: Rotation
  /** Op-amp only: the + input on top (default: the − input on top). */
  plusOnTop?: boolean
  /** Default: above for horizontal parts, right for vertical ones. */
  label?: LabelSide
  /**
   * A symbol that belongs to another part (the ground under rg): drawn, unlabelled, when that
   * part is present. Without it the placement is drawn when its own key is present.
   */
  with?: PartKey
  /** Drawn only while none of these parts is present (the ground that replaces an absent reference). */
  unless?: Condition
  /** Drawn only while one of these parts is present (the output terminal placed after a load). */
  when?: Condition
  /** Drawn only while every one of these parts is present (rload moved out past cload). */
  whenAll?: readonly PartKey[]
}


/**
 * A wire as a polyline. `when` draws it only if that part (or any of those parts) is
 * present, `unless` only if it is (they are all) absent: the wire that takes the place of an
 * absent series part.
 */
export interface Wire {
  points: readonly Point[]
  when?: Condition
  unless?: Condition
  /** Drawn only if every one of these parts is present. */
  whenAll?: readonly PartKey[]
}

/**
 * A topology's drawing, laid out by hand. Junction dots are not written: they are drawn
 * wherever three or more wire ends and pins meet in the resolved drawing.
 */
export interface Layout {
  width: number
  height: number
  /** Where the amplifier's name starts (its first line, left-aligned; further lines below). */
  opampLabel: Point
  parts: readonly Placement[]
  wires: readonly Wire[]
}

/** One drawn part: its key (for tests and SVG ids), symbol and primitives. */
export interface DrawnPart {
  key: PartKey
  symbol: SymbolName
  primitives: Primitive[]
  /** Pins that end no lead of the symbol's own (the op-amp's inputs and output). */
  pins: Point[]
}

/** A stage's schematic, resolved: every primitive in drawing coordinates. */
export interface Drawing {
  width: number
  height: number
  /** Parts present in the stage, one per netlist component and surrounding. */
  parts: DrawnPart[]
  /** Wires, junction dots and labels. */
  wiring: Primitive[]
  labels: Primitive[]
}
