/**
 * Difference stage (DESIGN §8.1), − input on top: the differential source (two halves of vd
 * around the common mode vcm) drives the − leg rs → rg → − pin (cstray to ground) and the
 * + leg rs → rp → node P, which rises to the + pin; rref from P down to the reference (vref,
 * or ground at 0 V), cstray-plus from P to ground on the right; rf (∥ cf) over the op-amp.
 */
import type {Layout} from '../types.js'
import {differentialSource, feedbackAbove} from './shared.js'

const source = differentialSource(40, 140, 220)

export const differenceLayout: Layout = {
  width: 520,
  opampLabel: [294, 176],
  height: 340,
  parts: [
    ...source.parts,
    {key: 'rs', symbol: 'resistor', at: [50, 140]},
    {key: 'rg', symbol: 'resistor', at: [100, 140]},
    {key: 'cstray', symbol: 'capacitor', at: [160, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [160, 180], rotate: 90, with: 'cstray'},
    {key: 'rs', symbol: 'resistor', at: [50, 220], label: 'below'},
    {key: 'rp', symbol: 'resistor', at: [100, 220], label: 'below'},
    {key: 'rref', symbol: 'resistor', at: [230, 220], rotate: 90, label: 'left'},
    {key: 'vref', symbol: 'voltage-source', at: [230, 260], rotate: 90, label: 'left', when: 'rref'},
    {key: 'gnd', symbol: 'ground', at: [230, 300], rotate: 90, with: 'vref', when: 'rref'},
    {key: 'gnd', symbol: 'ground', at: [230, 260], rotate: 90, with: 'rref', unless: 'vref'},
    {key: 'cstray-plus', symbol: 'capacitor', at: [280, 220], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [280, 260], rotate: 90, with: 'cstray-plus'},
    ...feedbackAbove.parts
  ],
  wires: [
    ...source.wires,
    {points: [[40, 140], [50, 140]]},
    {points: [[50, 140], [90, 140]], unless: 'rs'},
    {points: [[90, 140], [100, 140]]},
    {points: [[100, 140], [140, 140]], unless: 'rg'},
    {points: [[140, 140], [160, 140]]},
    {points: [[160, 140], [210, 140]]},
    {points: [[40, 220], [50, 220]]},
    {points: [[50, 220], [90, 220]], unless: 'rs'},
    {points: [[90, 220], [100, 220]]},
    {points: [[100, 220], [140, 220]], unless: 'rp'},
    {points: [[140, 220], [230, 220]]},
    {points: [[230, 220], [230, 170], [250, 170]]},
    {points: [[230, 220], [280, 220]], when: 'cstray-plus'},
    ...feedbackAbove.wires
  ]
}
