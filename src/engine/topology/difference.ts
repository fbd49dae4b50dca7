/**
 * Four-resistor difference amplifier (DESIGN §8.1): source + → rs → rp → + pin, rref from
 * the + pin to the reference node (vref, AC ground); source − → rs → rg → − pin, rf (∥ cf)
 * from the output pin to the − pin. The signal is the differential voltage: the + source
 * at +½ and the − source at −½ of it.
 *
 * The terms below are the §8.1 definitions at given resistor values (G the differential
 * gain, NG = 1 + rf/Rg'); they are not used for any figure the DC nodal solve gives.
 */
import type {TopologyModel} from './model.js'
import {commonElements, feedbackElements, loadElements, parallel, seriesR, stagePoles, VOLTAGE_DC_KEYS} from './model.js'
import type {StageInput} from '../types.js'

/** Fraction of V+ reaching the + pin, with Rp' = rp + rs (an absent rref is open). */
const plusDivider = (rp: number, rref: number): number => (rref === 0 ? 1 : rref / (rp + rref))

/** The + pin's DC voltage for a leg voltage v+ and the reference (the divider of §8.1). */
export function differencePlusPin(input: StageInput, vPlus: number): number {
  const rp = (input.rp?.value ?? 0) + (input.rs?.value ?? 0)
  const k = plusDivider(rp, input.rref?.value ?? 0)
  return vPlus * k + input.vref * (1 - k)
}

export const difference: TopologyModel = {
  terms: (r) => {
    const rgEff = r.rg + r.rs
    const rpEff = r.rp + r.rs
    const ng = 1 + r.rf / rgEff
    const a = plusDivider(rpEff, r.rref) * ng
    const b = r.rf / rgEff
    return {gain: (a + b) / 2, noiseGain: ng, rgEff, rn: parallel(r.rf, rgEff), rp: r.rref === 0 ? rpEff : parallel(rpEff, r.rref)}
  },
  dcKeys: VOLTAGE_DC_KEYS,
  noiseKeys: ['en', 'in+', 'in-', 'r:rf', 'r:rg', 'r:rp', 'r:rref', 'r:rs'],
  // The + pin over both ends of the differential and the common-mode range (§8.1).
  commonMode: (input) => {
    const out: number[] = []
    for (const vd of input.input) for (const vcm of input.inputCm) out.push(differencePlusPin(input, vcm + vd / 2))
    return out
  },
  netlist: (input) => ({
    elements: [
      seriesR('rs', input.rs?.value, 'src', 'x'),
      seriesR('rp', input.rp?.value, 'x', 'p'),
      ...(input.rref ? [{label: 'rref' as const, kind: 'r' as const, a: 'p' as const, b: 'ref' as const, value: input.rref.value}] : []),
      seriesR('rs', input.rs?.value, 'srcn', 'y'),
      seriesR('rg', input.rg?.value, 'y', 'm'),
      ...commonElements(input, 'p'),
      ...feedbackElements(input),
      ...loadElements(input)
    ],
    wires: [],
    drive: {kind: 'voltage', node: 'src', minus: 'srcn'},
    dcSources: [{node: 'ref', volts: input.vref}],
    opamp: stagePoles(input)
  })
}
