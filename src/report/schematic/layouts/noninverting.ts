/**
 * Noninverting stage, + input on top: source → rs → rcomp (∥ ccomp, above) → + pin; − pin
 * to rg and cstray to ground on the left; rf (∥ cf, below it) from the output back to the
 * − pin under the op-amp. The follower shares this drawing: it has no rg, and an absent rf
 * is drawn as the wire it is.
 */
import type {Layout} from '../types.js'

export const noninvertingLayout: Layout = {
  width: 440,
  opampLabel: [274, 86],
  height: 260,
  parts: [
    {key: 'source', symbol: 'voltage-source', at: [30, 130], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [30, 170], rotate: 90, with: 'source'},
    {key: 'rs', symbol: 'resistor', at: [60, 110]},
    {key: 'rcomp', symbol: 'resistor', at: [130, 110]},
    {key: 'ccomp', symbol: 'capacitor', at: [130, 80]},
    {key: 'opamp', symbol: 'opamp', at: [250, 110], plusOnTop: true},
    {key: 'rg', symbol: 'resistor', at: [190, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [190, 180], rotate: 90, with: 'rg'},
    {key: 'cstray', symbol: 'capacitor', at: [150, 140], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [150, 180], rotate: 90, with: 'cstray'},
    {key: 'rf', symbol: 'resistor', at: [250, 200]},
    {key: 'cf', symbol: 'capacitor', at: [250, 230], label: 'below'},
    {key: 'out', symbol: 'terminal', at: [380, 125]}
  ],
  wires: [
    {points: [[30, 130], [30, 110], [60, 110]]},
    {points: [[60, 110], [100, 110]], unless: 'rs'},
    {points: [[100, 110], [130, 110]]},
    {points: [[130, 110], [170, 110]], unless: 'rcomp'},
    {points: [[130, 110], [130, 80]], when: 'ccomp'},
    {points: [[170, 80], [170, 110]], when: 'ccomp'},
    {points: [[170, 110], [250, 110]]},
    {points: [[250, 140], [230, 140]]},
    {points: [[230, 140], [190, 140]], when: ['rg', 'cstray']},
    {points: [[190, 140], [150, 140]], when: 'cstray'},
    {points: [[230, 140], [230, 200]]},
    {points: [[230, 200], [250, 200]]},
    {points: [[250, 200], [290, 200]], unless: 'rf'},
    {points: [[290, 200], [330, 200]]},
    {points: [[330, 200], [330, 125]]},
    {points: [[230, 200], [230, 230], [250, 230]], when: 'cf'},
    {points: [[290, 230], [330, 230], [330, 200]], when: 'cf'},
    {points: [[310, 125], [330, 125]]},
    {points: [[330, 125], [377.5, 125]]}
  ]
}
