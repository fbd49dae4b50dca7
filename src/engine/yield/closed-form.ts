/**
 * The ideal op-amp's DC output in closed form, per topology (DESIGN §8.7): the DC nodal
 * solution of `dc/solve.ts` written out once by hand, as a function of the resistor values
 * and of the sources it is linear in — the signal (and a differential stage's common mode),
 * the reference vref, vos in series with the + input and the bias currents drawn out of the
 * pins. The Monte Carlo evaluates it for every trial's drawn resistors; the tests check it
 * against the nodal solve for random resistor draws and sources.
 *
 * Derivation (ideal op-amp: V− = V+ + vos; KCL at the − pin; capacitors open at DC; rout
 * inside the loop drops out; riso into rload divides the output pin's voltage by
 * rload/(riso + rload)):
 *
 *   noninverting, follower:  V+ = x − ib+·(rs + rcomp);  Vo = V−·(1 + rf/rg) + ib−·rf   (rg open: 1)
 *   lowpass-sallen-key:      V+ = x − ib+·(r1 + r2);     Vo = V−·(1 + rf/rg) + ib−·rf
 *   inverting:               V+ = vref − ib+·rcomp;      Vo = V−·(1 + rf/Rg') − x·rf/Rg' + ib−·rf, Rg' = rs + rg
 *   transimpedance:          V+ = vref − ib+·rcomp;      Vo = V−·(1 + rf/rshunt) + rf·(ib− − x)   (x: current into the − pin)
 *   difference:              V+ = (v+·rref + vref·Rp' − ib+·Rp'·rref)/(Rp' + rref), Rp' = rs + rp, v± = cm ± x/2;
 *                            Vo = V−·(1 + rf/Rg') − v−·rf/Rg' + ib−·rf
 *   lowpass-mfb:             V+ = vref − ib+·rcomp;      Va = V− + ib−·r3 (c1 open: r3 carries ib−);
 *                            Vo = Va·(1 + r2/r1) − x·r2/r1 + ib−·r2
 *
 * `instrumentation` has no netlist (its DC terms are the formulas of §8.2), so it has no
 * closed form here: the Monte Carlo reports it as unavailable.
 */
import {RESISTOR_KEYS, type ResistorKey} from '../topology/index.js'
import type {StageInput, Topology} from '../types.js'

/** Index of each resistor key in the value arrays the closed forms read. */
export const R_INDEX = Object.fromEntries(RESISTOR_KEYS.map((k, i) => [k, i])) as Record<ResistorKey, number>

const RF = R_INDEX.rf
const RG = R_INDEX.rg
const RS = R_INDEX.rs
const RCOMP = R_INDEX.rcomp
const RSHUNT = R_INDEX.rshunt
const RP = R_INDEX.rp
const RREF = R_INDEX.rref
const R1 = R_INDEX.r1
const R2 = R_INDEX.r2
const R3 = R_INDEX.r3
const RISO = R_INDEX.riso

/**
 * The load-node output of an ideal op-amp for resistor values `r` (indexed by `R_INDEX`; an
 * absent series resistor 0 Ω, an absent shunt Infinity) and the sources, V.
 */
export type ClosedForm = (r: Float64Array, x: number, cm: number, vref: number, vos: number, ibPlus: number, ibMinus: number) => number

/** rf/rg with an open rg (Infinity) giving 0. */
const ratio = (a: number, b: number): number => (b === Infinity ? 0 : a / b)

type PinForm = (r: Float64Array, x: number, cm: number, vref: number, vos: number, ibP: number, ibM: number) => number

const PIN_FORMS: Record<Exclude<Topology, 'instrumentation'>, PinForm> = {
  noninverting: (r, x, _cm, _vref, vos, ibP, ibM) => (x - ibP * ((r[RS] as number) + (r[RCOMP] as number)) + vos) * (1 + ratio(r[RF] as number, r[RG] as number)) + ibM * (r[RF] as number),
  follower: (r, x, _cm, _vref, vos, ibP, ibM) => x - ibP * ((r[RS] as number) + (r[RCOMP] as number)) + vos + ibM * (r[RF] as number),
  'lowpass-sallen-key': (r, x, _cm, _vref, vos, ibP, ibM) =>
    (x - ibP * ((r[R1] as number) + (r[R2] as number)) + vos) * (1 + ratio(r[RF] as number, r[RG] as number)) + ibM * (r[RF] as number),
  inverting: (r, x, _cm, vref, vos, ibP, ibM) => {
    const k = (r[RF] as number) / ((r[RS] as number) + (r[RG] as number))
    return (vref - ibP * (r[RCOMP] as number) + vos) * (1 + k) - x * k + ibM * (r[RF] as number)
  },
  transimpedance: (r, x, _cm, vref, vos, ibP, ibM) =>
    (vref - ibP * (r[RCOMP] as number) + vos) * (1 + ratio(r[RF] as number, r[RSHUNT] as number)) + (r[RF] as number) * (ibM - x),
  difference: (r, x, cm, vref, vos, ibP, ibM) => {
    const rp = (r[RS] as number) + (r[RP] as number)
    const rref = r[RREF] as number
    const vp = cm + x / 2
    const plus = (vp * rref + vref * rp - ibP * rp * rref) / (rp + rref)
    const k = (r[RF] as number) / ((r[RS] as number) + (r[RG] as number))
    return (plus + vos) * (1 + k) - (cm - x / 2) * k + ibM * (r[RF] as number)
  },
  'lowpass-mfb': (r, x, _cm, vref, vos, ibP, ibM) => {
    const k = (r[R2] as number) / (r[R1] as number)
    const va = vref - ibP * (r[RCOMP] as number) + vos + ibM * (r[R3] as number)
    return va * (1 + k) - x * k + ibM * (r[R2] as number)
  }
}

/**
 * The closed form of a stage, or null when its topology has none (instrumentation). The
 * output is taken at the load node: with `riso` and `rload` the pin's voltage times
 * rload/(riso + rload).
 */
export function closedFormOf(input: StageInput): ClosedForm | null {
  if (input.topology === 'instrumentation') return null
  const pin = PIN_FORMS[input.topology]
  const rload = input.rload
  if (rload === null || input.riso === null) return pin
  return (r, x, cm, vref, vos, ibP, ibM) => {
    const riso = r[RISO] as number
    return pin(r, x, cm, vref, vos, ibP, ibM) * (rload / (riso + rload))
  }
}

/**
 * The closed form at every input end of one resistor set, less each end's nominal, into `out`:
 * out[p] = form(r, xs[p], cms[p], vref, 0, 0, 0) − nominal[p]. The trial loop's resistor terms
 * (`model.ts`). The same operations in the same order as `PIN_FORMS` with vos = ibP = ibM = 0
 * (so the same bytes, signed zeros included: the zero sources stay in the arithmetic), only
 * what depends on the resistors alone computed once for all the ends. The tests check it
 * against the closed form for equal bytes.
 */
export type SignalForm = (r: Float64Array, xs: Float64Array, cms: Float64Array, vref: number, nominal: Float64Array, out: Float64Array) => void

/** The pin forms at the ends, each value times `load` (1 without riso and rload: x·1 is x, bytes unchanged). */
type PinSignalForm = (r: Float64Array, xs: Float64Array, cms: Float64Array, vref: number, nominal: Float64Array, out: Float64Array, load: number) => void

const SIGNAL_FORMS: Record<Exclude<Topology, 'instrumentation'>, PinSignalForm> = {
  noninverting: (r, xs, _cms, _vref, nominal, out, load) => {
    const bp = 0 * ((r[RS] as number) + (r[RCOMP] as number))
    const g = 1 + ratio(r[RF] as number, r[RG] as number)
    const bm = 0 * (r[RF] as number)
    for (let p = 0; p < out.length; p++) out[p] = ((((xs[p] as number) - bp + 0) * g + bm) * load) - (nominal[p] as number)
  },
  follower: (r, xs, _cms, _vref, nominal, out, load) => {
    const bp = 0 * ((r[RS] as number) + (r[RCOMP] as number))
    const bm = 0 * (r[RF] as number)
    for (let p = 0; p < out.length; p++) out[p] = (((xs[p] as number) - bp + 0 + bm) * load) - (nominal[p] as number)
  },
  'lowpass-sallen-key': (r, xs, _cms, _vref, nominal, out, load) => {
    const bp = 0 * ((r[R1] as number) + (r[R2] as number))
    const g = 1 + ratio(r[RF] as number, r[RG] as number)
    const bm = 0 * (r[RF] as number)
    for (let p = 0; p < out.length; p++) out[p] = ((((xs[p] as number) - bp + 0) * g + bm) * load) - (nominal[p] as number)
  },
  inverting: (r, xs, _cms, vref, nominal, out, load) => {
    const k = (r[RF] as number) / ((r[RS] as number) + (r[RG] as number))
    const a = (vref - 0 * (r[RCOMP] as number) + 0) * (1 + k)
    const bm = 0 * (r[RF] as number)
    for (let p = 0; p < out.length; p++) out[p] = ((a - (xs[p] as number) * k + bm) * load) - (nominal[p] as number)
  },
  transimpedance: (r, xs, _cms, vref, nominal, out, load) => {
    const a = (vref - 0 * (r[RCOMP] as number) + 0) * (1 + ratio(r[RF] as number, r[RSHUNT] as number))
    const rf = r[RF] as number
    for (let p = 0; p < out.length; p++) out[p] = ((a + rf * (0 - (xs[p] as number))) * load) - (nominal[p] as number)
  },
  difference: (r, xs, cms, vref, nominal, out, load) => {
    const rp = (r[RS] as number) + (r[RP] as number)
    const rref = r[RREF] as number
    const vrp = vref * rp
    const bq = 0 * rp * rref
    const den = rp + rref
    const k = (r[RF] as number) / ((r[RS] as number) + (r[RG] as number))
    const k1 = 1 + k
    const bm = 0 * (r[RF] as number)
    for (let p = 0; p < out.length; p++) {
      const x = xs[p] as number
      const cm = cms[p] as number
      const plus = ((cm + x / 2) * rref + vrp - bq) / den
      out[p] = (((plus + 0) * k1 - (cm - x / 2) * k + bm) * load) - (nominal[p] as number)
    }
  },
  'lowpass-mfb': (r, xs, _cms, vref, nominal, out, load) => {
    const k = (r[R2] as number) / (r[R1] as number)
    const a = (vref - 0 * (r[RCOMP] as number) + 0 + 0 * (r[R3] as number)) * (1 + k)
    const bm = 0 * (r[R2] as number)
    for (let p = 0; p < out.length; p++) out[p] = ((a - (xs[p] as number) * k + bm) * load) - (nominal[p] as number)
  }
}

/** The signal form of a stage (see `SignalForm`), or null when its topology has no closed form. */
export function signalFormOf(input: StageInput): SignalForm | null {
  if (input.topology === 'instrumentation') return null
  const pin = SIGNAL_FORMS[input.topology]
  const rload = input.rload
  if (rload === null || input.riso === null) return (r, xs, cms, vref, nominal, out) => pin(r, xs, cms, vref, nominal, out, 1)
  return (r, xs, cms, vref, nominal, out) => pin(r, xs, cms, vref, nominal, out, rload / ((r[RISO] as number) + rload))
}
