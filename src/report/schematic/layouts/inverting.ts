/**
 * Inverting stage, − input on top: source → rs → rg → − pin, cstray to ground; rf (∥ cf,
 * above it) from the output back to the − pin over the op-amp; + pin down through rcomp
 * (∥ ccomp) to the reference, or to ground when vref is 0 V, with cstray-plus; the load
 * side (riso, cload, rload) right of the output node.
 */
import type {Layout} from '../types.js'
import {feedbackAbove, referenceBelow} from './shared.js'

export const invertingLayout: Layout = {
  width: 440,
  opampLabel: [294, 176],
  height: 330,
  parts: [
    {key: 'source', symbol: 'voltage-source', at: [30, 160], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [30, 200], rotate: 90, with: 'source'},
    {key: 'rs', symbol: 'resistor', at: [50, 140]},
    {key: 'rg', symbol: 'resistor', at: [100, 140]},
    {key: 'cstray', symbol: 'capacitor', at: [160, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [160, 180], rotate: 90, with: 'cstray'},
    ...feedbackAbove.parts,
    ...referenceBelow.parts
  ],
  wires: [
    {points: [[30, 160], [30, 140], [50, 140]]},
    {points: [[50, 140], [90, 140]], unless: 'rs'},
    {points: [[90, 140], [100, 140]]},
    {points: [[140, 140], [160, 140]]},
    {points: [[160, 140], [210, 140]]},
    ...feedbackAbove.wires,
    ...referenceBelow.wires
  ]
}
