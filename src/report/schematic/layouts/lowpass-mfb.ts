/**
 * Multiple-feedback low-pass stage (DESIGN §8.4), − input on top: source → r1 → node A,
 * c2 from A to ground, A → r3 → − pin (cstray to ground); from A up and over the op-amp, r2
 * to the output node; from the − pin up, c1 to the output node; the + pin down through
 * rcomp (∥ ccomp) to the reference, with cstray-plus; the load side right of the output.
 */
import type {Layout} from '../types.js'
import {loadPiece, referenceBelow} from './shared.js'

const load = loadPiece([330, 155])

export const lowpassMfbLayout: Layout = {
  width: 520,
  opampLabel: [294, 176],
  height: 330,
  parts: [
    {key: 'source', symbol: 'voltage-source', at: [30, 160], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [30, 200], rotate: 90, with: 'source'},
    {key: 'r1', symbol: 'resistor', at: [50, 140]},
    {key: 'c2', symbol: 'capacitor', at: [110, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [110, 180], rotate: 90, with: 'c2'},
    {key: 'r3', symbol: 'resistor', at: [130, 140]},
    {key: 'cstray', symbol: 'capacitor', at: [190, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [190, 180], rotate: 90, with: 'cstray'},
    {key: 'r2', symbol: 'resistor', at: [250, 40]},
    {key: 'c1', symbol: 'capacitor', at: [250, 80]},
    {key: 'opamp', symbol: 'opamp', at: [250, 140]},
    ...referenceBelow.parts,
    ...load.parts
  ],
  wires: [
    {points: [[30, 160], [30, 140], [50, 140]]},
    {points: [[50, 140], [90, 140]], unless: 'r1'},
    {points: [[90, 140], [110, 140]]},
    {points: [[110, 140], [130, 140]]},
    {points: [[130, 140], [170, 140]], unless: 'r3'},
    {points: [[170, 140], [190, 140]]},
    {points: [[190, 140], [210, 140]]},
    {points: [[210, 140], [250, 140]]},
    {points: [[110, 140], [110, 40], [250, 40]]},
    {points: [[250, 40], [290, 40]], unless: 'r2'},
    {points: [[290, 40], [330, 40], [330, 80]]},
    {points: [[210, 140], [210, 80], [250, 80]], when: 'c1'},
    {points: [[290, 80], [330, 80]], when: 'c1'},
    {points: [[330, 80], [330, 155]]},
    {points: [[310, 155], [330, 155]]},
    ...referenceBelow.wires,
    ...load.wires
  ]
}
