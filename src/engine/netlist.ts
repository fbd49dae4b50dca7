/**
 * Small-signal netlists: what a topology file describes and what the nodal solver reads.
 *
 * A topology writes a `NetlistSpec` with named nodes; `buildNetlist` merges the nodes joined
 * by wires (an absent or 0 Ω series resistor is a wire, exact rather than a tiny resistance),
 * numbers the rest (ground = 0) and drops elements shorted by a merge. Capacitors of 0 F are
 * dropped, except the one labelled `cf`, which stays (possibly 0 F) so that the Cf search of
 * `suggested-cf.ts` can change it in place.
 *
 * The output side (DESIGN §8.3): the op-amp's source drives node `a` (the ideal source),
 * `rout` joins it to the output pin `o` (a wire when rout is 0), the feedback network and
 * `riso` hang from `o`, and `cload`, `rload` sit at the load node `l` after riso (a wire
 * when riso is absent). Signal and noise outputs are taken at `l`.
 */
import type {OpampPoles} from './opamp-model.js'

/** Node names used by the topologies. */
export const NODE_NAMES = ['gnd', 'src', 'srcn', 'ref', 'x', 'y', 'p', 'm', 'a', 'o', 'l'] as const
export type NodeName = (typeof NODE_NAMES)[number]

/** Labels of the elements; resistor labels double as noise keys `r:<label>`. */
export type ElementLabel =
  | 'rf' | 'rg' | 'rs' | 'rcomp' | 'rshunt' | 'rp' | 'rref' | 'r1' | 'r2' | 'r3' | 'rout' | 'riso' | 'rload'
  | 'cf' | 'ccomp' | 'cin-cm+' | 'cin-cm-' | 'cin-diff' | 'cstray' | 'cstray-plus' | 'csource' | 'c1' | 'c2' | 'cload'

/** A two-terminal element as a topology writes it. */
export interface SpecElement {
  label: ElementLabel
  kind: 'r' | 'c'
  a: NodeName
  b: NodeName
  /** Ω for `r` (0 = wire), F for `c`. */
  value: number
}

/** A topology's small-signal circuit with named nodes. */
export interface NetlistSpec {
  elements: SpecElement[]
  /** Node pairs joined by a wire. */
  wires: [NodeName, NodeName][]
  /**
   * The signal source: a voltage at a node (to ground), or a current into a node. With
   * `minus`, a differential voltage: `node` at +½ and `minus` at −½ of the drive.
   */
  drive: {kind: 'voltage' | 'current'; node: NodeName; minus?: NodeName}
  /**
   * Ideal DC sources (vref and the like): each node is held at `volts` for the DC solve
   * (`dc/solve.ts`) and is an AC ground for the small-signal circuit (an ideal, noiseless
   * source). Absent = none.
   */
  dcSources?: {node: NodeName; volts: number}[]
  opamp: OpampPoles
}

/** A compiled element: conductance (S) or capacitance (F) between node indices. */
export interface NetElement {
  label: ElementLabel
  kind: 'g' | 'c'
  a: number
  b: number
  value: number
}

/**
 * A compiled netlist: node 0 is ground; + pin, − pin, the op-amp's ideal source (`out`), its
 * output pin and the load node (`probe`, where outputs are taken) are node indices.
 */
export interface Netlist {
  nodeCount: number
  elements: NetElement[]
  plus: number
  minus: number
  /** The node the op-amp's ideal source fixes (its source equation row). */
  out: number
  /** The op-amp's output pin (after rout). */
  pin: number
  /** The load node (after riso): signal and noise outputs. */
  probe: number
  /** `minus` is −1 for a single-ended drive. */
  drive: {kind: 'voltage' | 'current'; node: number; minus: number}
  /** Nodes held at a DC voltage (only when built with `keepDcSources`; else empty). */
  dcSources: {node: number; volts: number}[]
  opamp: OpampPoles
}

// Merge priority: ground, then the driven source nodes, then the op-amp's source, so that a
// merged node keeps the role that fixes its voltage.
// A DC source node ranks after the signal sources for the same reason.
const PRIORITY: Record<NodeName, number> = {gnd: 0, src: 1, srcn: 2, ref: 3, a: 4, o: 5, l: 6, p: 7, m: 8, x: 9, y: 10}

/**
 * Merge wired nodes, number the rest and compile the elements. For the small-signal circuit
 * (the default) the `dcSources` nodes are joined to ground; `keepDcSources` leaves them as
 * nodes of their own (the DC solve fixes their voltage).
 */
export function buildNetlist(spec: NetlistSpec, keepDcSources = false): Netlist {
  const parent = new Map<NodeName, NodeName>(NODE_NAMES.map((n) => [n, n]))
  const find = (n: NodeName): NodeName => {
    let r = n
    while (parent.get(r) !== r) r = parent.get(r) as NodeName
    return r
  }
  const join = (a: NodeName, b: NodeName): void => {
    const ra = find(a)
    const rb = find(b)
    if (ra === rb) return
    if (PRIORITY[ra] <= PRIORITY[rb]) parent.set(rb, ra)
    else parent.set(ra, rb)
  }
  for (const [a, b] of spec.wires) join(a, b)
  if (!keepDcSources) for (const d of spec.dcSources ?? []) join('gnd', d.node)
  for (const e of spec.elements) if (e.kind === 'r' && e.value === 0) join(e.a, e.b)

  const index = new Map<NodeName, number>([['gnd', 0]])
  const indexOf = (n: NodeName): number => {
    const r = find(n)
    let i = index.get(r)
    if (i === undefined) {
      i = index.size
      index.set(r, i)
    }
    return i
  }
  const plus = indexOf('p')
  const minus = indexOf('m')
  const out = indexOf('a')
  const pin = indexOf('o')
  const probe = indexOf('l')
  const drive = {kind: spec.drive.kind, node: indexOf(spec.drive.node), minus: spec.drive.minus === undefined ? -1 : indexOf(spec.drive.minus)}
  const dcSources = keepDcSources ? (spec.dcSources ?? []).map((d) => ({node: indexOf(d.node), volts: d.volts})) : []
  const elements: NetElement[] = []
  for (const e of spec.elements) {
    if (e.kind === 'r' && e.value === 0) continue
    if (e.kind === 'c' && e.value === 0 && e.label !== 'cf') continue
    const a = indexOf(e.a)
    const b = indexOf(e.b)
    if (a === b) continue
    elements.push({label: e.label, kind: e.kind === 'r' ? 'g' : 'c', a, b, value: e.kind === 'r' ? 1 / e.value : e.value})
  }
  return {nodeCount: index.size, elements, plus, minus, out, pin, probe, drive, dcSources, opamp: spec.opamp}
}
