/**
 * Pieces the inverting-family layouts share, op-amp at (250, 140) with the − input on top:
 * the feedback network over the op-amp (node F at (210, 140) on the − row) with the output
 * terminal, and the + input's path down through rcomp ∥ ccomp to the reference.
 */
import type {Placement, Wire} from '../types.js'

interface Piece {
  parts: readonly Placement[]
  wires: readonly Wire[]
}

export const feedbackAbove: Piece = {
  parts: [
    {key: 'opamp', symbol: 'opamp', at: [250, 140]},
    {key: 'rf', symbol: 'resistor', at: [250, 80], label: 'below'},
    {key: 'cf', symbol: 'capacitor', at: [250, 50]},
    {key: 'out', symbol: 'terminal', at: [380, 155]}
  ],
  wires: [
    {points: [[210, 140], [250, 140]]},
    {points: [[210, 140], [210, 80], [250, 80]]},
    {points: [[250, 80], [290, 80]], unless: 'rf'},
    {points: [[290, 80], [330, 80]]},
    {points: [[330, 80], [330, 155]]},
    {points: [[210, 80], [210, 50], [250, 50]], when: 'cf'},
    {points: [[290, 50], [330, 50], [330, 80]], when: 'cf'},
    {points: [[310, 155], [330, 155]]},
    {points: [[330, 155], [377.5, 155]]}
  ]
}

export const referenceBelow: Piece = {
  parts: [
    {key: 'rcomp', symbol: 'resistor', at: [230, 200], rotate: 90, label: 'left'},
    {key: 'ccomp', symbol: 'capacitor', at: [280, 200], rotate: 90},
    {key: 'vref', symbol: 'voltage-source', at: [230, 240], rotate: 90, label: 'left'},
    {key: 'gnd', symbol: 'ground', at: [230, 280], rotate: 90, with: 'vref'},
    {key: 'gnd', symbol: 'ground', at: [230, 240], rotate: 90, with: 'rcomp', unless: 'vref'},
    {key: 'gnd', symbol: 'ground', at: [230, 200], rotate: 90, with: 'opamp', unless: ['rcomp', 'vref']}
  ],
  wires: [
    {points: [[250, 170], [230, 170]]},
    {points: [[230, 170], [230, 200]]},
    {points: [[230, 200], [230, 240]], when: 'vref', unless: 'rcomp'},
    {points: [[230, 200], [280, 200]], when: 'ccomp'},
    {points: [[280, 240], [230, 240]], when: 'ccomp'}
  ]
}
