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
 * - `closed`: the signal source drives (1 V at its node, or 1 A into it) and the output is
 *   found through the adjoint: solving Mᵀ·y = e_out once gives the output's response to a
 *   unit injection in every row (Vo = yᵀ·b), so every noise source's transfer comes from one
 *   solve per frequency (adjoint network method, common practice in circuit noise analysis).
 * - `loop`: the loop is broken at the op-amp's output source, which becomes an ideal 1 V
 *   test source; independent sources are zero and T(f) = −A(f)·(V+ − V−).
 *
 * Elimination is Gaussian with scaled partial pivoting on split re/im Float64Arrays,
 * allocated once per workspace: no allocation in the per-frequency path.
 */
import {openLoopGainInto} from './opamp-model.js'
import type {Netlist} from './netlist.js'

/** Preallocated state for repeated solves of one netlist. */
export interface NodalWorkspace {
  readonly net: Netlist
  /** Element arrays (capacitor values may be changed in place through `setCapacitance`). */
  readonly kind: Uint8Array
  readonly ea: Int32Array
  readonly eb: Int32Array
  readonly value: Float64Array
  /** Closed mode: node → unknown index, −1 when fixed (ground, voltage-driven source). */
  readonly closedIndex: Int32Array
  readonly closedCount: number
  /** Loop mode: node → unknown index, −1 when fixed (ground, source, output). */
  readonly loopIndex: Int32Array
  readonly loopCount: number
  readonly mre: Float64Array
  readonly mim: Float64Array
  readonly bre: Float64Array
  readonly bim: Float64Array
  readonly scale: Float64Array
  /** Closed mode result: adjoint vector y (length closedCount). */
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

/** Allocate a workspace for a netlist. */
export function createWorkspace(net: Netlist): NodalWorkspace {
  const n = net.nodeCount
  const closedIndex = new Int32Array(n).fill(-1)
  const loopIndex = new Int32Array(n).fill(-1)
  let closedCount = 0
  let loopCount = 0
  const voltageNode = net.drive.kind === 'voltage' ? net.drive.node : -1
  for (let i = 1; i < n; i++) {
    if (i !== voltageNode) closedIndex[i] = closedCount++
    if (i !== voltageNode && i !== net.out) loopIndex[i] = loopCount++
  }
  const size = Math.max(closedCount, 1)
  const els = net.elements
  return {
    net,
    kind: Uint8Array.from(els, (e) => (e.kind === 'g' ? 0 : 1)),
    ea: Int32Array.from(els, (e) => e.a),
    eb: Int32Array.from(els, (e) => e.b),
    value: Float64Array.from(els, (e) => e.value),
    closedIndex,
    closedCount,
    loopIndex,
    loopCount,
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
}

/** Change the capacitance of every element with this label, F (used by the Cf search). */
export function setCapacitance(ws: NodalWorkspace, label: string, farads: number): void {
  ws.net.elements.forEach((e, i) => {
    if (e.label === label && e.kind === 'c') ws.value[i] = farads
  })
}

/**
 * Closed-loop solve at f: fills ws.yre/ws.yim with the adjoint vector (Vo per unit injection
 * in each unknown's row; the output row's entry is Vo per volt of en) and ws.hre/ws.him with
 * the signal transfer (V/V, or V/A for a current drive).
 */
export function solveClosed(ws: NodalWorkspace, f: number): void {
  const n = ws.closedCount
  const idx = ws.closedIndex
  const {mre, mim, bre, bim} = ws
  const net = ws.net
  const w = 2 * Math.PI * f
  const io = idx[net.out]
  const src = net.drive.kind === 'voltage' ? net.drive.node : -1
  mre.fill(0, 0, n * n)
  mim.fill(0, 0, n * n)
  bre.fill(0, 0, n)
  bim.fill(0, 0, n)
  // Stamp admittances into KCL rows (the output row is the source equation, not KCL).
  // Signal RHS of the driven source goes into bre/bim; it is dotted with y after the solve.
  for (let e = 0; e < ws.value.length; e++) {
    const yr = ws.kind[e] === 0 ? ws.value[e] : 0
    const yi = ws.kind[e] === 0 ? 0 : w * ws.value[e]
    const a = ws.ea[e]
    const b = ws.eb[e]
    const ia = idx[a]
    const ib = idx[b]
    if (ia >= 0 && ia !== io) {
      mre[ia * n + ia] += yr
      mim[ia * n + ia] += yi
      if (ib >= 0) {
        mre[ia * n + ib] -= yr
        mim[ia * n + ib] -= yi
      } else if (b === src) {
        bre[ia] += yr
        bim[ia] += yi
      }
    }
    if (ib >= 0 && ib !== io) {
      mre[ib * n + ib] += yr
      mim[ib * n + ib] += yi
      if (ia >= 0) {
        mre[ib * n + ia] -= yr
        mim[ib * n + ia] -= yi
      } else if (a === src) {
        bre[ib] += yr
        bim[ib] += yi
      }
    }
  }
  // Source equation: Vo/A − V+ + V− = en.
  openLoopGainInto(net.opamp, f, ws.a)
  const ar = ws.a[0]
  const ai = ws.a[1]
  const ad = ar * ar + ai * ai
  mre[io * n + io] += ar / ad
  mim[io * n + io] += -ai / ad
  const ip = idx[net.plus]
  const im = idx[net.minus]
  if (ip >= 0) mre[io * n + ip] -= 1
  else if (net.plus === src) bre[io] += 1
  if (im >= 0) mre[io * n + im] += 1
  else if (net.minus === src) bre[io] -= 1
  if (net.drive.kind === 'current') {
    const id = idx[net.drive.node]
    if (id >= 0 && id !== io) bre[id] += 1
  }
  // Keep the signal RHS in y's buffers while the matrix is transposed and solved.
  const {yre, yim} = ws
  for (let i = 0; i < n; i++) {
    yre[i] = bre[i]
    yim[i] = bim[i]
  }
  transposeInPlace(n, mre, mim)
  bre.fill(0, 0, n)
  bim.fill(0, 0, n)
  bre[io] = 1
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
  const n = ws.loopCount
  const idx = ws.loopIndex
  const {mre, mim, bre, bim} = ws
  const net = ws.net
  const w = 2 * Math.PI * f
  const out = net.out
  mre.fill(0, 0, n * n)
  mim.fill(0, 0, n * n)
  bre.fill(0, 0, n)
  bim.fill(0, 0, n)
  for (let e = 0; e < ws.value.length; e++) {
    const yr = ws.kind[e] === 0 ? ws.value[e] : 0
    const yi = ws.kind[e] === 0 ? 0 : w * ws.value[e]
    const a = ws.ea[e]
    const b = ws.eb[e]
    const ia = idx[a]
    const ib = idx[b]
    if (ia >= 0) {
      mre[ia * n + ia] += yr
      mim[ia * n + ia] += yi
      if (ib >= 0) {
        mre[ia * n + ib] -= yr
        mim[ia * n + ib] -= yi
      } else if (b === out) {
        bre[ia] += yr
        bim[ia] += yi
      }
    }
    if (ib >= 0) {
      mre[ib * n + ib] += yr
      mim[ib * n + ib] += yi
      if (ia >= 0) {
        mre[ib * n + ia] -= yr
        mim[ib * n + ia] -= yi
      } else if (a === out) {
        bre[ib] += yr
        bim[ib] += yi
      }
    }
  }
  if (n > 0) solveInPlace(n, mre, mim, bre, bim, ws.scale)
  const vpr = voltageOf(net.plus, idx, out, bre)
  const vpi = voltageOf(net.plus, idx, out, bim, 0)
  const vmr = voltageOf(net.minus, idx, out, bre)
  const vmi = voltageOf(net.minus, idx, out, bim, 0)
  openLoopGainInto(net.opamp, f, ws.a)
  const dr = vpr - vmr
  const di = vpi - vmi
  ws.tre = -(ws.a[0] * dr - ws.a[1] * di)
  ws.tim = -(ws.a[0] * di + ws.a[1] * dr)
}

// Loop mode: a fixed node is ground or the (zeroed) source at 0 V, or the output at the test value.
function voltageOf(node: number, idx: Int32Array, out: number, x: Float64Array, outValue = 1): number {
  const i = idx[node]
  if (i >= 0) return x[i]
  return node === out ? outValue : 0
}

/** Transpose an n×n split complex matrix in place. */
export function transposeInPlace(n: number, re: Float64Array, im: Float64Array): void {
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const a = i * n + j
      const b = j * n + i
      let t = re[a]
      re[a] = re[b]
      re[b] = t
      t = im[a]
      im[a] = im[b]
      im[b] = t
    }
  }
}

/**
 * Solve M·x = b in place (Gaussian elimination with scaled partial pivoting; Golub & Van
 * Loan, Matrix Computations, §3.4). M is destroyed; the solution replaces b.
 * A singular matrix yields non-finite values, which the callers never produce: every node of
 * a topology has a resistive path to a fixed node.
 */
export function solveInPlace(n: number, re: Float64Array, im: Float64Array, bre: Float64Array, bim: Float64Array, scale: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = 0
    for (let j = 0; j < n; j++) s = Math.max(s, Math.abs(re[i * n + j]) + Math.abs(im[i * n + j]))
    scale[i] = s > 0 ? 1 / s : 1
  }
  for (let k = 0; k < n; k++) {
    let p = k
    let best = -1
    for (let i = k; i < n; i++) {
      const v = (Math.abs(re[i * n + k]) + Math.abs(im[i * n + k])) * scale[i]
      if (v > best) {
        best = v
        p = i
      }
    }
    if (p !== k) {
      for (let j = k; j < n; j++) {
        const a = k * n + j
        const b = p * n + j
        let t = re[a]
        re[a] = re[b]
        re[b] = t
        t = im[a]
        im[a] = im[b]
        im[b] = t
      }
      let t = bre[k]
      bre[k] = bre[p]
      bre[p] = t
      t = bim[k]
      bim[k] = bim[p]
      bim[p] = t
      t = scale[k]
      scale[k] = scale[p]
      scale[p] = t
    }
    const pr = re[k * n + k]
    const pi = im[k * n + k]
    const pd = pr * pr + pi * pi
    for (let i = k + 1; i < n; i++) {
      const xr = re[i * n + k]
      const xi = im[i * n + k]
      if (xr === 0 && xi === 0) continue
      // factor = M[i][k] / M[k][k]
      const fr = (xr * pr + xi * pi) / pd
      const fi = (xi * pr - xr * pi) / pd
      for (let j = k + 1; j < n; j++) {
        const ur = re[k * n + j]
        const ui = im[k * n + j]
        re[i * n + j] -= fr * ur - fi * ui
        im[i * n + j] -= fr * ui + fi * ur
      }
      bre[i] -= fr * bre[k] - fi * bim[k]
      bim[i] -= fr * bim[k] + fi * bre[k]
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    let sr = bre[k]
    let si = bim[k]
    for (let j = k + 1; j < n; j++) {
      const ur = re[k * n + j]
      const ui = im[k * n + j]
      sr -= ur * bre[j] - ui * bim[j]
      si -= ur * bim[j] + ui * bre[j]
    }
    const pr = re[k * n + k]
    const pi = im[k * n + k]
    const pd = pr * pr + pi * pi
    bre[k] = (sr * pr + si * pi) / pd
    bim[k] = (si * pr - sr * pi) / pd
  }
}
