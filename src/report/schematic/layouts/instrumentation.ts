/**
 * Instrumentation stage (DESIGN §8.2): an integrated in-amp, − input on top, its gain
 * resistor rg between the gain pins on the left; the differential source (two halves of vd
 * around the common mode vcm) drives each input through its leg's rs; the reference lead
 * goes down to vref (ground at 0 V); the load side right of the output.
 */
import type {Layout} from '../types.js'
import {differentialSource, loadPiece} from './shared.js'

const source = differentialSource(40, 100, 180)
// An in-amp stage takes no riso or cload (DESIGN §8.2: no loop of ours to isolate).
const load = loadPiece([320, 140], false)

export const instrumentationLayout: Layout = {
  width: 520,
  opampLabel: [246, 70],
  height: 300,
  parts: [
    ...source.parts,
    {key: 'rs', symbol: 'resistor', at: [70, 100]},
    {key: 'rs', symbol: 'resistor', at: [70, 180]},
    {key: 'opamp', symbol: 'inamp', at: [200, 100]},
    {key: 'rg', symbol: 'resistor', at: [170, 120], rotate: 90, label: 'left'},
    {key: 'vref', symbol: 'voltage-source', at: [270, 205], rotate: 90},
    {key: 'gnd', symbol: 'ground', at: [270, 245], rotate: 90, with: 'vref'},
    {key: 'gnd', symbol: 'ground', at: [270, 205], rotate: 90, with: 'opamp', unless: 'vref'},
    ...load.parts
  ],
  wires: [
    ...source.wires,
    {points: [[40, 100], [70, 100]]},
    {points: [[70, 100], [110, 100]], unless: 'rs'},
    {points: [[110, 100], [200, 100]]},
    {points: [[40, 180], [70, 180]]},
    {points: [[70, 180], [110, 180]], unless: 'rs'},
    {points: [[110, 180], [200, 180]]},
    {points: [[200, 120], [170, 120]], when: 'rg'},
    {points: [[170, 160], [200, 160]], when: 'rg'},
    {points: [[300, 140], [320, 140]]},
    ...load.wires
  ]
}
