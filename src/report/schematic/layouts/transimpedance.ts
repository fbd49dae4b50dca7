/**
 * Transimpedance stage, − input on top: the source current (into the − pin) with rshunt,
 * csource and cstray from the − pin to ground; rf (∥ cf) over the op-amp; + pin down through
 * rcomp (∥ ccomp) to the reference, or to ground when vref is 0 V.
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
    {key: 'rshunt', symbol: 'resistor', at: [70, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [70, 180], rotate: 90, with: 'rshunt'},
    {key: 'csource', symbol: 'capacitor', at: [120, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [120, 180], rotate: 90, with: 'csource'},
    {key: 'cstray', symbol: 'capacitor', at: [170, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [170, 180], rotate: 90, with: 'cstray'},
    ...feedbackAbove.parts,
    ...referenceBelow.parts
  ],
  wires: [
    {points: [[30, 140], [70, 140]]},
    {points: [[70, 140], [120, 140]]},
    {points: [[120, 140], [170, 140]]},
    {points: [[170, 140], [210, 140]]},
    ...feedbackAbove.wires,
    ...referenceBelow.wires
  ]
}
