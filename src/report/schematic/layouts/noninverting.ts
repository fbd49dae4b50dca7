/**
 * Noninverting stage, + input on top: source → rs → rcomp (∥ ccomp, above) → + pin, with
 * cstray-plus from the + pin to ground; the − pin drops to node N at (235, 200), from which
 * rg and cstray go to ground on the left and rf (∥ cf, below it) goes back to the output
 * node; the load side to the right of the output node. The follower shares this drawing:
 * it has no rg, and an absent rf is drawn as the wire it is.
 */
import type {Layout} from '../types.js'
import {loadPiece} from './shared.js'

const load = loadPiece([330, 125])

export const noninvertingLayout: Layout = {
  width: 520,
  opampLabel: [274, 86],
  height: 280,
  parts: [
    {key: 'source', symbol: 'voltage-source', at: [30, 130], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [30, 170], rotate: 90, with: 'source'},
    {key: 'rs', symbol: 'resistor', at: [60, 110]},
    {key: 'rcomp', symbol: 'resistor', at: [130, 110]},
    {key: 'ccomp', symbol: 'capacitor', at: [130, 60]},
    {key: 'cstray-plus', symbol: 'capacitor', at: [205, 110], rotate: 90, label: 'left'},
    {key: 'gnd', symbol: 'ground', at: [205, 150], rotate: 90, with: 'cstray-plus'},
    {key: 'opamp', symbol: 'opamp', at: [250, 110], plusOnTop: true},
    {key: 'rg', symbol: 'resistor', at: [190, 200], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [190, 240], rotate: 90, with: 'rg'},
    {key: 'cstray', symbol: 'capacitor', at: [140, 200], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [140, 240], rotate: 90, with: 'cstray'},
    {key: 'rf', symbol: 'resistor', at: [250, 200]},
    {key: 'cf', symbol: 'capacitor', at: [250, 230], label: 'below'},
    ...load.parts
  ],
  wires: [
    {points: [[30, 130], [30, 110], [60, 110]]},
    {points: [[60, 110], [100, 110]], unless: 'rs'},
    {points: [[100, 110], [130, 110]]},
    {points: [[130, 110], [170, 110]], unless: 'rcomp'},
    {points: [[130, 110], [130, 60]], when: 'ccomp'},
    {points: [[170, 60], [170, 110]], when: 'ccomp'},
    {points: [[170, 110], [205, 110]]},
    {points: [[205, 110], [250, 110]]},
    {points: [[250, 140], [235, 140], [235, 200]]},
    {points: [[235, 200], [190, 200]], when: ['rg', 'cstray']},
    {points: [[190, 200], [140, 200]], when: 'cstray'},
    {points: [[235, 200], [250, 200]]},
    {points: [[250, 200], [290, 200]], unless: 'rf'},
    {points: [[290, 200], [330, 200]]},
    {points: [[330, 200], [330, 125]]},
    {points: [[235, 200], [235, 230], [250, 230]], when: 'cf'},
    {points: [[290, 230], [330, 230], [330, 200]], when: 'cf'},
    {points: [[310, 125], [330, 125]]},
    ...load.wires
  ]
}
