/**
 * The one complex nodal solver (DESIGN §4.3, §4.4).
 *
 * Unknowns are the node voltages that no ideal source fixes. Each resistor and capacitor is
 * stamped as an admittance (G, or jωC) into Kirchhoff's current law rows (nodal analysis,
 * any circuits text). The op-amp is a voltage-controlled voltage source at the output,
 * Vo = A(f)·(V+ + en − V−); its KCL row only carries the source's own current, so that row
 * is replaced by the source equation, normalised by A: Vo/A − V+ + V− = en.
 *
 * Two modes share one netlist:
 * - `closed`: the signal source drives (1 V at its node, ±½ V at a differential pair, or 1 A
 *   into it) and the output at the load node (`probe`, DESIGN §8.3) is
 *   found through the adjoint: solving Mᵀ·y = e_probe once gives the output's response to a
 *   unit injection in every row (Vo = yᵀ·b), so every noise source's transfer comes from one
 *   solve per frequency (adjoint network method, common practice in circuit noise analysis).
 * - `loop`: the loop is broken at the op-amp's output source, which becomes an ideal 1 V
 *   test source; independent sources are zero and T(f) = −A(f)·(V+ − V−).
 *
 * The constant parts (G, C and the source rows) are stamped once per workspace; each
 * frequency only forms G + jωC and eliminates (`complex-solve.ts`) in preallocated split
 * re/im Float64Arrays: no allocation in the per-frequency path.
 */
import {solveInPlace} from './complex-solve.js'
import {openLoopGainInto} from './opamp-model.js'
import type {Netlist} from './netlist.js'

/** One mode's system, split as M(f) = G + jωC and b(f) = g + jωc, stamped once per netlist. */
interface ModeSystem {
  n: number
  /** Node → unknown index, −1 when the node's voltage is fixed. */
  index: Int32Array
  g: Float64Array
  c: Float64Array
  rhsG: Float64Array
  rhsC: Float64Array
}

/** Preallocated state for repeated solves of one netlist. */
export interface NodalWorkspace {
  readonly net: Netlist
  /** Element values (S or F), in netlist order; change capacitors through `setCapacitance`. */
  readonly value: Float64Array
  /** Voltage of each node where it is fixed, closed mode (the drive) and loop mode (the test source). */
  readonly closedFixed: Float64Array
  readonly loopFixed: Float64Array
  /** Closed mode, stored transposed (only Mᵀ is ever solved); rhs = the signal drive. */
  readonly closed: ModeSystem
  /** Loop mode; rhs = the 1 V test source at the output. */
  readonly loop: ModeSystem
  readonly mre: Float64Array
  readonly mim: Float64Array
  readonly bre: Float64Array
  readonly bim: Float64Array
  readonly scale: Float64Array
  /** Closed mode result: adjoint vector y, indexed by `closed.index`. */
  readonly yre: Float64Array
  readonly yim: Float64Array
  /** A(f) of the last solve: [re, im]. */
  readonly a: Float64Array
  /** Closed mode result: signal transfer H = Vo per unit drive. */
  hre: number
  him: number
  /** Loop mode result: T(f). */
  tre: number
  tim: number
}

function emptySystem(index: Int32Array, n: number): ModeSystem {
  return {n, index, g: new Float64Array(n * n), c: new Float64Array(n * n), rhsG: new Float64Array(n), rhsC: new Float64Array(n)}
}

/**
 * Stamp the element admittances of one mode (nodal analysis: +Y on both diagonals, −Y off
 * the diagonal; a neighbour at a fixed voltage moves Y·V to the right-hand side).
 * `skipRow` is a row that is not KCL (the op-amp's source equation), `fixed` the voltage of
 * every node (used where the node is fixed: the drive's +1 V, or ±½ V for a differential
 * drive, the loop's 1 V test source; 0 elsewhere), `transposed` stores Mᵀ.
 */
function stampElements(ws: NodalWorkspace, sys: ModeSystem, skipRow: number, fixed: Float64Array, transposed: boolean): void {
  const {n, index, g, c, rhsG, rhsC} = sys
  g.fill(0)
  c.fill(0)
  rhsG.fill(0)
  rhsC.fill(0)
  ws.net.elements.forEach((e, k) => {
    const m = e.kind === 'g' ? g : c
    const rhs = e.kind === 'g' ? rhsG : rhsC
    const y = ws.value[k]
    const ends: [number, number][] = [[e.a, e.b], [e.b, e.a]]
    for (const [self, other] of ends) {
      const i = index[self]
      if (i < 0 || i === skipRow) continue
      const j = index[other]
      m[i * n + i] += y
      if (j >= 0) m[transposed ? j * n + i : i * n + j] -= y
      else rhs[i] += y * fixed[other]
    }
  })
}

/** Restamp both modes after a value change. */
function stampAll(ws: NodalWorkspace): void {
  const net = ws.net
  const cl = ws.closed
  const io = cl.index[net.out]
  stampElements(ws, cl, io, ws.closedFixed, true)
  // Source equation row (Vo/A − V+ + V− = en): the ±1 entries are constant, 1/A is added per
  // frequency. Stored transposed, so row io's entries go down column io.
  const n = cl.n
  const ip = cl.index[net.plus]
  const im = cl.index[net.minus]
  if (ip >= 0) cl.g[ip * n + io] -= 1
  else cl.rhsG[io] += ws.closedFixed[net.plus]
  if (im >= 0) cl.g[im * n + io] += 1
  else cl.rhsG[io] -= ws.closedFixed[net.minus]
  if (net.drive.kind === 'current') {
    const id = cl.index[net.drive.node]
    if (id >= 0 && id !== io) cl.rhsG[id] += 1
  }
  stampElements(ws, ws.loop, -1, ws.loopFixed, false)
}

/** Allocate a workspace for a netlist and stamp its constant parts. */
export function createWorkspace(net: Netlist): NodalWorkspace {
  const nodes = net.nodeCount
  const closedIndex = new Int32Array(nodes).fill(-1)
  const loopIndex = new Int32Array(nodes).fill(-1)
  let closedCount = 0
  let loopCount = 0
  const voltageNode = net.drive.kind === 'voltage' ? net.drive.node : -1
  const voltageMinus = net.drive.kind === 'voltage' ? net.drive.minus : -1
  const closedFixed = new Float64Array(nodes)
  const loopFixed = new Float64Array(nodes)
  if (voltageNode > 0) closedFixed[voltageNode] = voltageMinus > 0 ? 0.5 : 1
  if (voltageMinus > 0) closedFixed[voltageMinus] = -0.5
  loopFixed[net.out] = 1
  for (let i = 1; i < nodes; i++) {
    const driven = i === voltageNode || i === voltageMinus
    if (!driven) closedIndex[i] = closedCount++
    if (!driven && i !== net.out) loopIndex[i] = loopCount++
  }
  const size = Math.max(closedCount, 1)
  const ws: NodalWorkspace = {
    net,
    value: Float64Array.from(net.elements, (e) => e.value),
    closedFixed,
    loopFixed,
    closed: emptySystem(closedIndex, closedCount),
    loop: emptySystem(loopIndex, loopCount),
    mre: new Float64Array(size * size),
    mim: new Float64Array(size * size),
    bre: new Float64Array(size),
    bim: new Float64Array(size),
    scale: new Float64Array(size),
    yre: new Float64Array(size),
    yim: new Float64Array(size),
    a: new Float64Array(2),
    hre: 0,
    him: 0,
    tre: 0,
    tim: 0
  }
  stampAll(ws)
  return ws
}

/** Change the capacitance of every element with this label, F (used by the Cf search). */
export function setCapacitance(ws: NodalWorkspace, label: string, farads: number): void {
  ws.net.elements.forEach((e, i) => {
    if (e.label === label && e.kind === 'c') ws.value[i] = farads
  })
  stampAll(ws)
}

/** Change the resistance of every resistor with this label, Ω > 0 (used by the riso search). */
export function setResistance(ws: NodalWorkspace, label: string, ohms: number): void {
  ws.net.elements.forEach((e, i) => {
    if (e.label === label && e.kind === 'g') ws.value[i] = 1 / ohms
  })
  stampAll(ws)
}

/** Fill mre/mim with G + jωC and bre/bim with g + jωc of a mode. */
function load(ws: NodalWorkspace, sys: ModeSystem, w: number): void {
  const {mre, mim, bre, bim} = ws
  const {n, g, c, rhsG, rhsC} = sys
  for (let i = 0; i < n * n; i++) {
    mre[i] = g[i]
    mim[i] = w * c[i]
  }
  for (let i = 0; i < n; i++) {
    bre[i] = rhsG[i]
    bim[i] = w * rhsC[i]
  }
}

/**
 * Closed-loop solve at f: fills ws.yre/ws.yim with the adjoint vector (Vo per unit injection
 * in each unknown's row; the output row's entry is Vo per volt of en) and ws.hre/ws.him with
 * the signal transfer (V/V, or V/A for a current drive).
 */
export function solveClosed(ws: NodalWorkspace, f: number): void {
  const sys = ws.closed
  const n = sys.n
  const io = sys.index[ws.net.out]
  const probe = sys.index[ws.net.probe]
  const {mre, mim, bre, bim, yre, yim} = ws
  load(ws, sys, 2 * Math.PI * f)
  openLoopGainInto(ws.net.opamp, f, ws.a)
  const ar = ws.a[0]
  const ai = ws.a[1]
  const ad = ar * ar + ai * ai
  mre[io * n + io] += ar / ad
  mim[io * n + io] -= ai / ad
  // Keep the signal RHS in y's buffers; solve Mᵀ·y = e_out in b's.
  for (let i = 0; i < n; i++) {
    yre[i] = bre[i]
    yim[i] = bim[i]
    bre[i] = 0
    bim[i] = 0
  }
  bre[probe] = 1
  solveInPlace(n, mre, mim, bre, bim, ws.scale)
  let hr = 0
  let hi = 0
  for (let i = 0; i < n; i++) {
    hr += bre[i] * yre[i] - bim[i] * yim[i]
    hi += bre[i] * yim[i] + bim[i] * yre[i]
    yre[i] = bre[i]
    yim[i] = bim[i]
  }
  ws.hre = hr
  ws.him = hi
}

/** Loop-gain solve at f: the output source replaced by a 1 V test source; fills ws.tre/ws.tim. */
export function solveLoop(ws: NodalWorkspace, f: number): void {
  const sys = ws.loop
  const n = sys.n
  const net = ws.net
  load(ws, sys, 2 * Math.PI * f)
  if (n > 0) solveInPlace(n, ws.mre, ws.mim, ws.bre, ws.bim, ws.scale)
  const idx = sys.index
  const out = net.out
  const vpr = voltageOf(net.plus, idx, out, ws.bre, 1)
  const vpi = voltageOf(net.plus, idx, out, ws.bim, 0)
  const vmr = voltageOf(net.minus, idx, out, ws.bre, 1)
  const vmi = voltageOf(net.minus, idx, out, ws.bim, 0)
  openLoopGainInto(net.opamp, f, ws.a)
  const dr = vpr - vmr
  const di = vpi - vmi
  ws.tre = -(ws.a[0] * dr - ws.a[1] * di)
  ws.tim = -(ws.a[0] * di + ws.a[1] * dr)
}

// Loop mode: a fixed node is ground or the (zeroed) source at 0 V, or the output at the test value.
function voltageOf(node: number, idx: Int32Array, out: number, x: Float64Array, outValue: number): number {
  const i = idx[node]
  if (i >= 0) return x[i]
  return node === out ? outValue : 0
}
