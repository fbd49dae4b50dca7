/**
 * The stage's noise sources, all uncorrelated (DESIGN §4.3).
 *
 * - en(f) = en·√(1 + fce/f), in series with the + input inside the pin capacitances;
 * - in(f) = in·√(1 + fci/f) from each input pin to ground, independently; for jfet and cmos
 *   inputs scaled by √(IB(T)/IB(25 °C)) at the noise temperature (shot noise of the gate
 *   leakage, i² = 2q·IB, common practice);
 * - thermal noise of every real resistor as a Norton current, i² = 4kT/R (Johnson–Nyquist);
 * - shot noise of the transimpedance source's dark current at the noise temperature,
 *   i² = 2q·Idark(Tn), and of the signal current at the largest |input|, i² = 2q·|Isig|
 *   (`shot-signal`) (Schottky's formula).
 * Densities are one-sided power spectral densities: V²/Hz or A²/Hz.
 */
import {BOLTZMANN, CELSIUS_TO_KELVIN, ELEMENTARY_CHARGE} from '../constants.js'
import {biasCurrentAt, darkCurrentAt, doublingInterval} from '../dc/bias.js'
import type {Netlist} from '../netlist.js'
import {topologyModel} from '../topology/index.js'
import type {NoiseKey, StageInput} from '../types.js'

/** One uncorrelated part of a contributor: a current into `into` returning from `from`. */
export interface NoisePart {
  into: number
  from: number
  /** White density: V²/Hz or A²/Hz. */
  white: number
}

/**
 * One noise contributor in a compiled netlist. Most have one part; a key that names several
 * resistors (the two `rs` legs of a difference stage) sums their powers.
 */
export interface NoiseSource {
  key: NoiseKey
  /** `voltage`: the op-amp's en; `current`: currents injected into node `into`, returning from `from`. */
  kind: 'voltage' | 'current'
  parts: NoisePart[]
  /** 1/f corner, Hz (0 = none): density = white·(1 + corner/f). */
  corner: number
}

/** Noise keys of the load elements (DESIGN §8.3), listed when the stage has the element. */
const LOAD_NOISE_KEYS = ['r:riso', 'r:rload'] as const

/** Noise temperature of a stage, K. */
export const noiseKelvin = (input: StageInput): number => input.noiseTemperature + CELSIUS_TO_KELVIN

/** Johnson–Nyquist current density of a resistor, A²/Hz: 4kT/R. */
export const thermalCurrentPsd = (resistance: number, kelvin: number): number => (4 * BOLTZMANN * kelvin) / resistance

/** Current-noise scale for FET/CMOS inputs at temperature T (°C): √(IB(T)/IB(25 °C)); 1 otherwise. */
export function currentNoiseScale(input: StageInput, t: number): number {
  const op = input.opamp
  if (op.inputType !== 'jfet' && op.inputType !== 'cmos') return 1
  if (doublingInterval(op) === null || op.ib === 0) return 1
  return Math.sqrt(biasCurrentAt(op, t) / op.ib)
}

/** The noise sources that apply to the stage's topology, one per contributor key, in key order. */
export function noiseSources(input: StageInput, net: Netlist): NoiseSource[] {
  const op = input.opamp
  const kelvin = noiseKelvin(input)
  const inScale = currentNoiseScale(input, input.noiseTemperature)
  const inPsd = (op.in * inScale) ** 2
  const resistor = (label: string): NoisePart[] =>
    // An absent or 0 Ω resistor is a wire and makes no noise.
    net.elements.filter((x) => x.label === label && x.kind === 'g').map((e) => ({into: e.a, from: e.b, white: thermalCurrentPsd(1 / e.value, kelvin)}))
  const keys: NoiseKey[] = [...topologyModel(input).noiseKeys]
  for (const k of LOAD_NOISE_KEYS) if (resistor(k.slice(2)).length > 0) keys.push(k)
  return keys.map((key): NoiseSource => {
    switch (key) {
      case 'en':
        return {key, kind: 'voltage', parts: [{into: net.out, from: 0, white: op.en ** 2}], corner: op.enCorner}
      case 'in+':
        return {key, kind: 'current', parts: [{into: net.plus, from: 0, white: inPsd}], corner: op.inCorner}
      case 'in-':
        return {key, kind: 'current', parts: [{into: net.minus, from: 0, white: inPsd}], corner: op.inCorner}
      case 'shot':
        return {key, kind: 'current', parts: [{into: net.drive.node, from: 0, white: 2 * ELEMENTARY_CHARGE * darkCurrentAt(input, input.noiseTemperature)}], corner: 0}
      case 'shot-signal': {
        const isig = Math.max(Math.abs(input.input[0]), Math.abs(input.input[1]))
        return {key, kind: 'current', parts: [{into: net.drive.node, from: 0, white: 2 * ELEMENTARY_CHARGE * isig}], corner: 0}
      }
      default: {
        const parts = resistor(key.slice(2))
        return {key, kind: 'current', parts: parts.length > 0 ? parts : [{into: 0, from: 0, white: 0}], corner: 0}
      }
    }
  })
}
