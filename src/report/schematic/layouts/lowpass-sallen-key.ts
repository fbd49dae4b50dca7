/**
 * Sallen-Key low-pass stage (DESIGN §8.4), + input on top: source → r1 → node A → r2 → + pin,
 * c2 and cstray-plus from the + pin to ground; c1 from A over the op-amp to the output node;
 * the − pin drops to node N at (285, 200): a wire (or rf ∥ cf) back to the output node, rg
 * and cstray to ground on the left; the load side right of the output node.
 */
import type {Layout} from '../types.js'
import {loadPiece} from './shared.js'

const load = loadPiece([415, 125])

export const lowpassSallenKeyLayout: Layout = {
  width: 610,
  opampLabel: [324, 86],
  height: 280,
  parts: [
    {key: 'source', symbol: 'voltage-source', at: [30, 130], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [30, 170], rotate: 90, with: 'source'},
    {key: 'r1', symbol: 'resistor', at: [50, 110]},
    {key: 'r2', symbol: 'resistor', at: [105, 110]},
    {key: 'c1', symbol: 'capacitor', at: [240, 50]},
    {key: 'c2', symbol: 'capacitor', at: [160, 110], rotate: 90, label: 'left'},
    {key: 'gnd', symbol: 'ground', at: [160, 150], rotate: 90, with: 'c2'},
    {key: 'cstray-plus', symbol: 'capacitor', at: [215, 110], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [215, 150], rotate: 90, with: 'cstray-plus'},
    {key: 'opamp', symbol: 'opamp', at: [300, 110], plusOnTop: true},
    {key: 'rg', symbol: 'resistor', at: [245, 200], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [245, 240], rotate: 90, with: 'rg'},
    {key: 'cstray', symbol: 'capacitor', at: [195, 200], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [195, 240], rotate: 90, with: 'cstray'},
    {key: 'rf', symbol: 'resistor', at: [330, 200]},
    {key: 'cf', symbol: 'capacitor', at: [330, 230], label: 'below'},
    ...load.parts
  ],
  wires: [
    {points: [[30, 130], [30, 110], [50, 110]]},
    {points: [[50, 110], [90, 110]], unless: 'r1'},
    {points: [[90, 110], [105, 110]]},
    {points: [[105, 110], [145, 110]], unless: 'r2'},
    {points: [[105, 110], [105, 50], [240, 50]]},
    {points: [[280, 50], [415, 50], [415, 125]]},
    {points: [[145, 110], [160, 110]]},
    {points: [[160, 110], [215, 110]]},
    {points: [[215, 110], [300, 110]]},
    {points: [[300, 140], [285, 140], [285, 200]]},
    {points: [[285, 200], [245, 200]], when: ['rg', 'cstray']},
    {points: [[245, 200], [195, 200]], when: 'cstray'},
    {points: [[285, 200], [330, 200]]},
    {points: [[330, 200], [370, 200]], unless: 'rf'},
    {points: [[370, 200], [415, 200]]},
    {points: [[415, 200], [415, 125]]},
    {points: [[285, 200], [285, 230], [330, 230]], when: 'cf'},
    {points: [[370, 230], [415, 230], [415, 200]], when: 'cf'},
    {points: [[360, 125], [415, 125]]},
    ...load.wires
  ]
}
