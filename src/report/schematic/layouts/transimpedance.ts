/**
 * Transimpedance stage, − input on top: the source current (into the − pin) with rshunt,
 * csource and cstray from the − pin to ground; rf (∥ cf) over the op-amp; + pin down through
 * rcomp (∥ ccomp) to the reference, or to ground when vref is 0 V, with cstray-plus; the
 * load side (riso, cload, rload) right of the output node.
 */
import type {Layout} from '../types.js'
import {feedbackAbove, referenceBelow} from './shared.js'

export const transimpedanceLayout: Layout = {
  width: 440,
  opampLabel: [294, 176],
  height: 330,
  parts: [
    {key: 'source', symbol: 'current-source', at: [30, 140], rotate: 90, label: 'left'},
    {key: 'gnd', symbol: 'ground', at: [30, 180], rotate: 90, with: 'source'},
    {key: 'rshunt', symbol: 'resistor', at: [65, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [65, 180], rotate: 90, with: 'rshunt'},
    {key: 'csource', symbol: 'capacitor', at: [112, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [112, 180], rotate: 90, with: 'csource'},
    {key: 'cstray', symbol: 'capacitor', at: [165, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [165, 180], rotate: 90, with: 'cstray'},
    ...feedbackAbove.parts,
    ...referenceBelow.parts
  ],
  wires: [
    {points: [[30, 140], [65, 140]]},
    {points: [[65, 140], [112, 140]]},
    {points: [[112, 140], [165, 140]]},
    {points: [[165, 140], [210, 140]]},
    ...feedbackAbove.wires,
    ...referenceBelow.wires
  ]
}
