/**
 * Voltage follower: source → rs → rcomp (∥ ccomp) → + pin; output to − pin through rf (∥ cf)
 * or a wire when rf is absent (DESIGN §4.1 row 3, §4.3).
 */
import type {TopologyModel} from './model.js'
import {commonElements, feedbackElements, loadElements, seriesR, stagePoles, VOLTAGE_DC_KEYS} from './model.js'

export const follower: TopologyModel = {
  terms: (r) => ({gain: 1, noiseGain: 1, rgEff: Infinity, rn: r.rf, rp: r.rs + r.rcomp}),
  dcKeys: VOLTAGE_DC_KEYS,
  noiseKeys: ['en', 'in+', 'in-', 'r:rf', 'r:rs', 'r:rcomp'],
  commonMode: (input) => input.input,
  netlist: (input) => ({
    elements: [seriesR('rs', input.rs?.value, 'src', 'x'), ...commonElements(input, 'x'), ...feedbackElements(input), ...loadElements(input)],
    wires: [],
    drive: {kind: 'voltage', node: 'src'},
    opamp: stagePoles(input)
  })
}
