/**
 * The DC solve: one function of (input value, resistor values) for every topology (DESIGN
 * §4.2, §4.6, §8). Every DC figure of the engine — Vout,ideal and the reference term, the
 * resistor, `aol-gain`, `vos`, bias-current and `idark` terms, the input pins' common mode and
 * the op-amp's output current — comes from a real nodal solve of the topology's own netlist,
 * never from a per-topology gain formula.
 *
 * The circuit is the small-signal netlist of the topology (`TopologyModel.netlist`) read at
 * DC: capacitors open, resistors as conductances (optionally moved to a corner), the signal
 * drive as a voltage at its node or a current into it, every `dcSources` entry (vref …) as an
 * ideal source at its node, bias currents drawn out of the pins, vos in series with the +
 * input, and the op-amp as Vo = A·(V+ + vos − V−) with A = Infinity for the ideal op-amp
 * (V+ + vos = V−). Modified nodal analysis (any circuits text): unknowns are the free node
 * voltages plus the op-amp's output current; KCL rows, one source-equation row.
 *
 * How a new topology uses it (DESIGN §8): write its netlist in `topology/<name>.ts` with the
 * `NetlistSpec` of `netlist.ts` — resistors labelled (a label is what a corner moves), the
 * drive, any DC reference as `dcSources: [{node, volts}]` — and nothing else: `dcAnalysis`
 * (`budget.ts`) then finds every term through `solveStageDc`, and the limits (`limits.ts`)
 * read the pins and the output current from the same solution. A new resistor to move at the
 * corners needs its key in `RESISTOR_KEYS` (`topology/model.ts`) and in the stage's
 * `nominalResistors`; resistors with other labels keep their netlist value.
 */
import {buildNetlist, type Netlist, type NetlistSpec} from '../netlist.js'
import {nominalResistors, topologyModel} from '../topology/index.js'
import type {StageInput} from '../types.js'

/** The sources of one DC solve. Everything not given is zero (A: ideal). */
export interface DcExcitation {
  /** Signal: V at the drive node, or A into it (transimpedance); for a differential drive V+ − V−. */
  input?: number
  /** Common-mode voltage of a differential drive, V: the legs sit at cm ± input/2 (DESIGN §8.1). */
  inputCm?: number
  /** Include the netlist's `dcSources` (vref …) at their values; false = zeroed. Default true. */
  references?: boolean
  /** Offset voltage in series with the + input, V. */
  vos?: number
  /** Current drawn out of the network into the + pin, A. */
  ibPlus?: number
  /** Current drawn out of the network into the − pin, A. */
  ibMinus?: number
  /** Open-loop DC gain, V/V; Infinity (default) = ideal op-amp. */
  aol?: number
}

/** A DC operating point. */
export interface DcSolution {
  /** Output voltage at the load node (after riso, DESIGN §8.3), V. */
  vout: number
  /** Voltage at the op-amp's output pin (after rout; the swing limit's), V. */
  vpin: number
  /** + pin and − pin voltages, V. */
  vplus: number
  vminus: number
  /** Current out of the op-amp's output pin into the network (feedback and load), A. */
  iout: number
}

/** Resistor values by element label, Ω; a label not listed keeps its netlist value. */
export type DcResistors = Readonly<Partial<Record<string, number>>>

/**
 * Solve a netlist at DC (see module header). Resistors of 0 Ω stay wires and absent ones
 * absent; an override is applied only to a resistor present with a non-zero value.
 */
export const solveDc = (spec: NetlistSpec, resistors: DcResistors, ex: DcExcitation = {}): DcSolution =>
  solveCompiled(buildNetlist(spec, true), resistors, ex)

/**
 * Solve a compiled DC netlist (built with `keepDcSources`) with resistors moved by label.
 * The compiled netlist keeps exactly the resistors present with a non-zero value, so moving
 * their conductances here is the same as moving them in the spec and compiling again.
 */
function solveCompiled(net: Netlist, resistors: DcResistors, ex: DcExcitation): DcSolution {
  const refs = ex.references ?? true
  const fixed = new Map<number, number>([[0, 0]])
  for (const d of net.dcSources) fixed.set(d.node, refs ? d.volts : 0)
  if (net.drive.kind === 'voltage' && net.drive.minus < 0) fixed.set(net.drive.node, ex.input ?? 0)
  if (net.drive.kind === 'voltage' && net.drive.minus >= 0) {
    fixed.set(net.drive.node, (ex.inputCm ?? 0) + (ex.input ?? 0) / 2)
    fixed.set(net.drive.minus, (ex.inputCm ?? 0) - (ex.input ?? 0) / 2)
  }
  const index = new Int32Array(net.nodeCount).fill(-1)
  let n = 0
  for (let i = 1; i < net.nodeCount; i++) if (!fixed.has(i)) index[i] = n++
  const io = n // the op-amp's output current
  const size = n + 1
  const m = new Float64Array(size * size)
  const b = new Float64Array(size)
  const kcl = (node: number, other: number, g: number): void => {
    const i = index[node]
    if (i < 0) return
    m[i * size + i] += g
    const j = index[other]
    if (j >= 0) m[i * size + j] -= g
    else b[i] += g * (fixed.get(other) ?? 0)
  }
  for (const e of net.elements) {
    if (e.kind !== 'g') continue
    const v = resistors[e.label]
    const g = v !== undefined && Number.isFinite(v) && v > 0 ? 1 / v : e.value
    kcl(e.a, e.b, g)
    kcl(e.b, e.a, g)
  }
  const inject = (node: number, amps: number): void => {
    const i = index[node]
    if (i >= 0) b[i] += amps
  }
  if (net.drive.kind === 'current') inject(net.drive.node, ex.input ?? 0)
  inject(net.plus, -(ex.ibPlus ?? 0))
  inject(net.minus, -(ex.ibMinus ?? 0))
  // The output current enters KCL at the op-amp's source node (through rout to the pin).
  const iOut = index[net.out]
  if (iOut < 0) throw new RangeError('Unexpected fixed output node in the DC solve, expected the op-amp to drive it')
  m[iOut * size + io] -= 1
  // Source equation: Vo/A − V+ + V− = vos.
  const aol = ex.aol ?? Infinity
  const row = io * size
  const term = (node: number, coef: number): void => {
    const i = index[node]
    if (i >= 0) m[row + i] += coef
    else b[io] -= coef * (fixed.get(node) ?? 0)
  }
  if (Number.isFinite(aol)) term(net.out, 1 / aol)
  term(net.plus, -1)
  term(net.minus, 1)
  b[io] += ex.vos ?? 0
  const x = solveReal(size, m, b)
  const v = (node: number): number => (index[node] >= 0 ? x[index[node]] : fixed.get(node) ?? 0)
  return {vout: v(net.probe), vpin: v(net.pin), vplus: v(net.plus), vminus: v(net.minus), iout: x[io]}
}

/** Gaussian elimination with partial pivoting; a, b are overwritten. */
function solveReal(n: number, a: Float64Array, b: Float64Array): Float64Array {
  for (let k = 0; k < n; k++) {
    let p = k
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]) > Math.abs(a[p * n + k])) p = i
    if (a[p * n + k] === 0) throw new RangeError('Unexpected singular DC circuit, expected every node to have a DC path')
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]
        a[k * n + j] = a[p * n + j]
        a[p * n + j] = t
      }
      const t = b[k]
      b[k] = b[p]
      b[p] = t
    }
    for (let i = k + 1; i < n; i++) {
      const f = a[i * n + k] / a[k * n + k]
      if (f === 0) continue
      for (let j = k; j < n; j++) a[i * n + j] -= f * a[k * n + j]
      b[i] -= f * b[k]
    }
  }
  const x = new Float64Array(n)
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i]
    for (let j = i + 1; j < n; j++) s -= a[i * n + j] * x[j]
    x[i] = s / a[i * n + i]
  }
  return x
}

/**
 * The stage's DC circuit: its topology's netlist, plus `rload` from the output to ground
 * when the stage gives one and the netlist has no load of its own.
 */
export function stageDcCircuit(input: StageInput): NetlistSpec {
  const spec = topologyModel(input).netlist(input)
  if (input.rload === null || spec.elements.some((e) => e.label === 'rload')) return spec
  return {...spec, elements: [...spec.elements, {label: 'rload', kind: 'r', a: 'o', b: 'gnd', value: input.rload}]}
}

// The DC budget solves one stage a few hundred times (corners × input ends): its circuit is
// compiled once per StageInput object (inputs are never mutated; variants are new objects).
const compiledCircuits = new WeakMap<StageInput, Netlist>()

/** DC solve of a stage at the given resistor values (see `solveDc`). */
export function solveStageDc(input: StageInput, resistors: DcResistors, ex: DcExcitation = {}): DcSolution {
  let net = compiledCircuits.get(input)
  if (net === undefined) {
    net = buildNetlist(stageDcCircuit(input), true)
    compiledCircuits.set(input, net)
  }
  return solveCompiled(net, resistors, ex)
}

/** Vout,ideal(input, R) of DESIGN §4.2: the ideal op-amp's output, reference term included, V. */
export const idealOutput = (input: StageInput, signal: number, resistors: DcResistors): number =>
  solveStageDc(input, resistors, {input: signal}).vout

/**
 * The stage's signed signal gain G at DC, at the load node (DESIGN §8.3): from the ideal DC
 * solve (reference zeroed) for the topologies of DESIGN §8 and for any stage whose load
 * divides the output (riso into rload); else the §4.1 value, which the solve equals.
 */
export function signalGain(input: StageInput): number {
  const divided = input.riso !== null && input.rload !== null
  const modern = input.topology === 'difference' || input.topology === 'lowpass-sallen-key' || input.topology === 'lowpass-mfb'
  if (!divided && !modern) return topologyModel(input).terms(nominalResistors(input)).gain
  return solveStageDc(input, nominalResistors(input), {input: 1, references: false}).vout
}
