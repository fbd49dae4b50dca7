/**
 * An independent reference solver for the engine's checks: modified nodal analysis written
 * here with mathjs complex matrices and `lusolve` (Source: a general-purpose maths library
 * from the package registry, DESIGN §7), and the stage circuits of DESIGN §4.3 written out by
 * hand from the design text. It shares no code with src/engine: wires are 0 V sources, the
 * op-amp is a VCVS with its own branch current, and each source is solved on its own
 * (direct, not adjoint).
 */
import {add as mAdd, complex, divide, lusolve, matrix, multiply, subtract, unaryMinus, type Complex} from 'mathjs'

const cadd = (a: Complex, b: Complex): Complex => mAdd(a, b) as Complex
const csub = (a: Complex, b: Complex): Complex => subtract(a, b) as Complex
const cmulm = (a: Complex, b: Complex | number): Complex => multiply(a, b) as Complex
const cneg = (a: Complex): Complex => unaryMinus(a) as Complex
import type {StageInput} from '../../src/engine/index.js'

type Node = string

interface RefCircuit {
  /** Passive elements: resistance (Ω) or capacitance (F). */
  r: [Node, Node, number, string][]
  c: [Node, Node, number][]
  /** Wires (0 V sources). */
  wires: [Node, Node][]
}

/**
 * The stage's circuit per DESIGN §4.3, §8.1, §8.3 and §8.4, nodes named; ground is 'gnd'.
 * The op-amp's source sits at 'a'; rout joins it to the output pin 'o', riso the pin to the
 * load node 'l' (the output), where cload and rload are.
 */
export function referenceCircuit(s: StageInput): RefCircuit {
  const r: RefCircuit['r'] = []
  const c: RefCircuit['c'] = []
  const wires: RefCircuit['wires'] = []
  const series = (a: Node, b: Node, v: number | undefined, label: string): void => {
    if (v === undefined || v === 0) wires.push([a, b])
    else r.push([a, b, v, label])
  }
  const op = s.opamp
  c.push(['p', 'gnd', op.cinCm], ['m', 'gnd', op.cinCm], ['p', 'm', op.cinDiff], ['m', 'gnd', s.cstray], ['p', 'gnd', s.cstrayPlus])
  series('a', 'o', op.rout ?? 0, 'rout')
  series('o', 'l', s.riso?.value, 'riso')
  c.push(['l', 'gnd', s.cload])
  if (s.rload !== null) r.push(['l', 'gnd', s.rload, 'rload'])
  const rf = s.rf?.value
  if (s.topology !== 'lowpass-mfb') {
    if (rf === undefined || rf === 0) wires.push(['m', 'o'])
    else {
      r.push(['m', 'o', rf, 'rf'])
      c.push(['m', 'o', s.cf])
    }
  }
  // Inverting, transimpedance and MFB: the + pin returns to the vref source ('ref', 0 V unless excited).
  const plusFrom = s.topology === 'noninverting' || s.topology === 'follower' ? 'x' : s.topology === 'difference' || s.topology === 'lowpass-sallen-key' ? null : 'ref'
  if (plusFrom !== null) {
    series(plusFrom, 'p', s.rcomp?.value, 'rcomp')
    if (s.rcomp) c.push([plusFrom, 'p', s.ccomp])
  }
  switch (s.topology) {
    case 'noninverting':
      series('src', 'x', s.rs?.value, 'rs')
      if (s.rg) r.push(['m', 'gnd', s.rg.value, 'rg'])
      break
    case 'follower':
      series('src', 'x', s.rs?.value, 'rs')
      break
    case 'inverting':
      series('src', 'x', s.rs?.value, 'rs')
      series('x', 'm', s.rg?.value, 'rg')
      break
    case 'transimpedance':
      if (s.rshunt !== null) r.push(['m', 'gnd', s.rshunt, 'rshunt'])
      c.push(['m', 'gnd', s.csource])
      break
    case 'difference':
      // §8.1: + leg src → rs → rp → + pin, rref to the reference (AC ground); − leg srcn → rs → rg → − pin.
      series('src', 'xp', s.rs?.value, 'rs')
      series('xp', 'p', s.rp?.value, 'rp')
      if (s.rref) r.push(['p', 'ref', s.rref.value, 'rref'])
      series('srcn', 'xn', s.rs?.value, 'rs')
      series('xn', 'm', s.rg?.value, 'rg')
      break
    case 'lowpass-sallen-key':
      // §8.4: src → r1 → a1 → r2 → + pin; c1 a1 → output pin; c2 + pin → ground.
      series('src', 'a1', s.r1?.value, 'r1')
      series('a1', 'p', s.r2?.value, 'r2')
      c.push(['a1', 'o', s.c1?.value ?? 0], ['p', 'gnd', s.c2?.value ?? 0])
      if (s.rg) r.push(['m', 'gnd', s.rg.value, 'rg'])
      break
    case 'lowpass-mfb':
      // §8.4: src → r1 → a1; r2 a1 → output pin; r3 a1 → − pin; c1 − pin → output pin; c2 a1 → ground.
      series('src', 'a1', s.r1?.value, 'r1')
      series('a1', 'o', s.r2?.value, 'r2')
      series('a1', 'm', s.r3?.value, 'r3')
      c.push(['m', 'o', s.c1?.value ?? 0], ['a1', 'gnd', s.c2?.value ?? 0])
      break
  }
  return {r, c, wires}
}

/** A(f) per DESIGN §4.3, written from the formula. */
export function referenceA(s: StageInput, f: number): Complex {
  const op = s.opamp
  const phi = (op.pmUnity * Math.PI) / 180
  const fp1 = op.gbw / op.aol
  const p1 = complex(1, f / fp1)
  const p2 = op.pmUnity >= 90 ? complex(1, 0) : complex(1, f / (op.gbw * Math.sin(phi) * Math.tan(phi)))
  return divide(complex(op.aol, 0), cmulm(p1, p2)) as Complex
}

/** Excitation: a voltage at 'src' (V), vref at 'ref' (V), currents into nodes (A), en at the op-amp's input (V). */
export interface Excitation {
  vsrc?: number
  vref?: number
  currents?: [into: Node, from: Node, amps: number][]
  en?: number
  /** Node to read (default 'l', the load node: the stage output of DESIGN §8.3). */
  at?: Node
}

/** Solve the circuit at f (Hz; 0 for DC) and return the output voltage. */
export function referenceOutput(s: StageInput, f: number, ex: Excitation): Complex {
  const circ = referenceCircuit(s)
  const w = 2 * Math.PI * f
  const names = new Set<Node>(['p', 'm', 'a', 'o', 'l'])
  for (const [a, b] of [...circ.r, ...circ.c, ...circ.wires]) {
    names.add(a)
    names.add(b)
  }
  const hasSrc = s.topology !== 'transimpedance'
  const differential = s.topology === 'difference'
  if (hasSrc) names.add('src')
  if (differential) names.add('srcn')
  names.delete('gnd')
  const nodes = [...names]
  const at = (n: Node): number => (n === 'gnd' ? -1 : nodes.indexOf(n))
  // Unknowns: node voltages, then one branch current per voltage source (wires, src, VCVS).
  const vsrcs: {p: Node; n: Node; value: Complex; vcvs?: boolean}[] = circ.wires.map(([a, b]) => ({p: a, n: b, value: complex(0, 0)}))
  // A difference stage's drive is differential: vsrc/2 on the + leg, −vsrc/2 on the − leg.
  if (hasSrc) vsrcs.push({p: 'src', n: 'gnd', value: complex(differential ? (ex.vsrc ?? 0) / 2 : ex.vsrc ?? 0, 0)})
  if (differential) vsrcs.push({p: 'srcn', n: 'gnd', value: complex(-(ex.vsrc ?? 0) / 2, 0)})
  if (names.has('ref')) vsrcs.push({p: 'ref', n: 'gnd', value: complex(ex.vref ?? 0, 0)})
  vsrcs.push({p: 'a', n: 'gnd', value: complex(0, 0), vcvs: true})
  const size = nodes.length + vsrcs.length
  const m: Complex[][] = Array.from({length: size}, () => Array.from({length: size}, () => complex(0, 0)))
  const rhs: Complex[] = Array.from({length: size}, () => complex(0, 0))
  const add = (i: number, j: number, v: Complex): void => {
    if (i >= 0 && j >= 0) m[i][j] = cadd(m[i][j], v)
  }
  const admit = (a: Node, b: Node, y: Complex): void => {
    add(at(a), at(a), y)
    add(at(b), at(b), y)
    add(at(a), at(b), cneg(y))
    add(at(b), at(a), cneg(y))
  }
  for (const [a, b, R] of circ.r) admit(a, b, complex(1 / R, 0))
  for (const [a, b, C] of circ.c) admit(a, b, complex(0, w * C))
  for (const [into, from, amps] of ex.currents ?? []) {
    if (at(into) >= 0) rhs[at(into)] = cadd(rhs[at(into)], complex(amps, 0))
    if (at(from) >= 0) rhs[at(from)] = csub(rhs[at(from)], complex(amps, 0))
  }
  const a = referenceA(s, f)
  vsrcs.forEach((v, k) => {
    const row = nodes.length + k
    // Branch current leaves node p into the source.
    add(at(v.p), row, complex(1, 0))
    add(at(v.n), row, complex(-1, 0))
    add(row, at(v.p), complex(1, 0))
    add(row, at(v.n), complex(-1, 0))
    if (v.vcvs) {
      // Vo − A·(V+ − V−) = A·en
      add(row, at('p'), cneg(a))
      add(row, at('m'), a)
      rhs[row] = cmulm(a, ex.en ?? 0)
    } else rhs[row] = v.value
  })
  const x = lusolve(matrix(m), matrix(rhs)).toArray() as unknown as Complex[][]
  // lusolve returns plain numbers when the right-hand side is all zero.
  const v = x[at(ex.at ?? 'l')][0] as Complex | number
  return typeof v === 'number' ? complex(v, 0) : v
}

/** Magnitude of a mathjs complex value. */
export const mag = (z: Complex): number => Math.hypot(z.re, z.im)
