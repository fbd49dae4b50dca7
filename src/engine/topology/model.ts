/**
 * What every topology file provides (DESIGN §4.1, §4.3): the DC terms of §4.1 as a function
 * of the resistor values, and its small-signal netlist. `index.ts` maps each `Topology` to
 * one of these, so a topology added without a model fails to type-check.
 */
import type {NetlistSpec, SpecElement} from '../netlist.js'
import {opampPoles} from '../opamp-model.js'
import type {DcKey, NoiseKey, StageInput} from '../types.js'

/** Keys of the stage's real resistors. */
export const RESISTOR_KEYS = ['rf', 'rg', 'rs', 'rcomp', 'rshunt', 'rp', 'rref', 'r1', 'r2', 'r3', 'riso'] as const
export type ResistorKey = (typeof RESISTOR_KEYS)[number]

/**
 * Resistor values for the DC terms, Ω: an absent series resistor (rf of a follower, rs,
 * rcomp) is 0; an absent shunt (rshunt, open) is Infinity.
 */
export type ResistorValues = Record<ResistorKey, number>

/** The DC terms of DESIGN §4.1. */
export interface TopologyTerms {
  /** Signed signal gain G: V/V, or V/A (Ω) for transimpedance. */
  gain: number
  /** DC noise gain NG, V/V. */
  noiseGain: number
  /** Effective gain-setting resistance Rg,eff, Ω; Infinity when open (follower, no rshunt). */
  rgEff: number
  /** DC resistance seen by the − input, Ω. */
  rn: number
  /** DC resistance seen by the + input, Ω. */
  rp: number
}

export interface TopologyModel {
  /** §4.1 terms for the given resistor values. */
  terms(r: ResistorValues): TopologyTerms
  /** DC contributor keys that apply (DESIGN §4.2, §6). */
  dcKeys: readonly DcKey[]
  /** Noise contributor keys that apply (DESIGN §4.3, §6). */
  noiseKeys: readonly NoiseKey[]
  /** The + input's common-mode voltages over the input range, V (for the cmrr term). */
  commonMode(input: StageInput): readonly number[]
  /** The small-signal circuit (DESIGN §4.3). */
  netlist(input: StageInput): NetlistSpec
}

/** R1 ∥ R2, Ω; an open (Infinity) branch drops out. */
export const parallel = (a: number, b: number): number => {
  if (a === Infinity) return b
  if (b === Infinity) return a
  return a + b === 0 ? 0 : (a * b) / (a + b)
}

/** Nominal resistor values of a stage (absent series = 0 Ω, open shunt = ∞). */
export function nominalResistors(input: StageInput): ResistorValues {
  return {
    rf: input.rf?.value ?? 0,
    rg: input.rg?.value ?? Infinity,
    rs: input.rs?.value ?? 0,
    rcomp: input.rcomp?.value ?? 0,
    rshunt: input.rshunt ?? Infinity,
    rp: input.rp?.value ?? 0,
    rref: input.rref?.value ?? 0,
    r1: input.r1?.value ?? 0,
    r2: input.r2?.value ?? 0,
    r3: input.r3?.value ?? 0,
    riso: input.riso?.value ?? 0
  }
}

/** Series element, 0 Ω (a wire) when absent. */
export const seriesR = (label: SpecElement['label'], value: number | undefined, a: SpecElement['a'], b: SpecElement['b']): SpecElement =>
  ({label, kind: 'r', a, b, value: value ?? 0})

/** A shunt resistor, stamped only when present (absent = open). */
export const shuntR = (label: SpecElement['label'], value: number | null | undefined, a: SpecElement['a'], b: SpecElement['b']): SpecElement[] =>
  value === null || value === undefined || value === Infinity ? [] : [{label, kind: 'r', a, b, value}]

/**
 * The output side of every topology (DESIGN §8.3): the op-amp's ideal source at `a` drives
 * the output pin `o` through rout; riso joins the pin to the load node `l`, where cload and
 * rload sit. rout 0 and no riso are wires, so without a load the three nodes are one.
 */
export function loadElements(input: StageInput, riso = input.riso?.value ?? 0): SpecElement[] {
  return [
    seriesR('rout', input.opamp.rout ?? 0, 'a', 'o'),
    seriesR('riso', riso, 'o', 'l'),
    {label: 'cload', kind: 'c', a: 'l', b: 'gnd', value: input.cload},
    ...shuntR('rload', input.rload, 'l', 'gnd')
  ]
}

/**
 * Elements every topology shares: cin-cm from each pin to ground, cin-diff between the pins,
 * cstray from the − pin to ground (DESIGN §4.3), cstray-plus from the + pin to ground
 * (§8.3), and rcomp ∥ ccomp into the + pin from `from`.
 */
export function commonElements(input: StageInput, from: SpecElement['a']): SpecElement[] {
  const op = input.opamp
  const els: SpecElement[] = [
    {label: 'cin-cm+', kind: 'c', a: 'p', b: 'gnd', value: op.cinCm},
    {label: 'cin-cm-', kind: 'c', a: 'm', b: 'gnd', value: op.cinCm},
    {label: 'cin-diff', kind: 'c', a: 'p', b: 'm', value: op.cinDiff},
    {label: 'cstray', kind: 'c', a: 'm', b: 'gnd', value: input.cstray},
    {label: 'cstray-plus', kind: 'c', a: 'p', b: 'gnd', value: input.cstrayPlus},
    seriesR('rcomp', input.rcomp?.value, from, 'p')
  ]
  // ccomp only bypasses a real rcomp; across a wire it is shorted (and an error upstream).
  if (input.rcomp && input.rcomp.value > 0) els.push({label: 'ccomp', kind: 'c', a: from, b: 'p', value: input.ccomp})
  return els
}

/** rf between − pin and output with cf across it; a wire when rf is absent or 0 Ω. */
export function feedbackElements(input: StageInput): SpecElement[] {
  const rf = input.rf?.value ?? 0
  if (rf === 0) return [{label: 'rf', kind: 'r', a: 'm', b: 'o', value: 0}]
  return [
    {label: 'rf', kind: 'r', a: 'm', b: 'o', value: rf},
    {label: 'cf', kind: 'c', a: 'm', b: 'o', value: input.cf}
  ]
}

/** The op-amp's pole model for a stage. */
export const stagePoles = (input: StageInput): NetlistSpec['opamp'] => opampPoles(input.opamp)

/** DC keys of all topologies but transimpedance (no source current). */
export const VOLTAGE_DC_KEYS: readonly DcKey[] = ['vos', 'vos-drift', 'ib', 'ios', 'cmrr', 'psrr', 'aol-gain', 'resistor-tolerance', 'resistor-tempco']
