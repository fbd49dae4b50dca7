/**
 * Sallen-Key low-pass stage (DESIGN §8.4), + input on top: source → r1 → node A → r2 → + pin,
 * c2 and cstray-plus from the + pin to ground; c1 from A over the op-amp to the output node;
 * the − pin drops to node N at (250, 200): a wire (or rf ∥ cf) back to the output node, rg
 * and cstray to ground on the left; the load side right of the output node.
 */
import type {Layout} from '../types.js'
import {loadPiece} from './shared.js'

const load = loadPiece([380, 125])

export const lowpassSallenKeyLayout: Layout = {
  width: 575,
  opampLabel: [289, 86],
  height: 280,
  parts: [
    {key: 'source', symbol: 'voltage-source', at: [30, 130], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [30, 170], rotate: 90, with: 'source'},
    {key: 'r1', symbol: 'resistor', at: [50, 110]},
    {key: 'r2', symbol: 'resistor', at: [105, 110]},
    {key: 'c1', symbol: 'capacitor', at: [205, 50]},
    {key: 'c2', symbol: 'capacitor', at: [155, 110], rotate: 90, label: 'left'},
    {key: 'gnd', symbol: 'ground', at: [155, 150], rotate: 90, with: 'c2'},
    {key: 'cstray-plus', symbol: 'capacitor', at: [195, 110], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [195, 150], rotate: 90, with: 'cstray-plus'},
    {key: 'opamp', symbol: 'opamp', at: [265, 110], plusOnTop: true},
    {key: 'rg', symbol: 'resistor', at: [210, 200], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [210, 240], rotate: 90, with: 'rg'},
    {key: 'cstray', symbol: 'capacitor', at: [160, 200], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [160, 240], rotate: 90, with: 'cstray'},
    {key: 'rf', symbol: 'resistor', at: [295, 200]},
    {key: 'cf', symbol: 'capacitor', at: [295, 230], label: 'below'},
    ...load.parts
  ],
  wires: [
    {points: [[30, 130], [30, 110], [50, 110]]},
    {points: [[50, 110], [90, 110]], unless: 'r1'},
    {points: [[90, 110], [105, 110]]},
    {points: [[105, 110], [145, 110]], unless: 'r2'},
    {points: [[105, 110], [105, 50], [205, 50]]},
    {points: [[245, 50], [380, 50], [380, 125]]},
    {points: [[145, 110], [155, 110]]},
    {points: [[155, 110], [195, 110]]},
    {points: [[195, 110], [265, 110]]},
    {points: [[265, 140], [250, 140], [250, 200]]},
    {points: [[250, 200], [210, 200]], when: ['rg', 'cstray']},
    {points: [[210, 200], [160, 200]], when: 'cstray'},
    {points: [[250, 200], [295, 200]]},
    {points: [[295, 200], [335, 200]], unless: 'rf'},
    {points: [[335, 200], [380, 200]]},
    {points: [[380, 200], [380, 125]]},
    {points: [[250, 200], [250, 230], [295, 230]], when: 'cf'},
    {points: [[335, 230], [380, 230], [380, 200]], when: 'cf'},
    {points: [[325, 125], [380, 125]]},
    ...load.wires
  ]
}
