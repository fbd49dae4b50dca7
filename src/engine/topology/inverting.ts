/**
 * Inverting stage: source → rs → rg → − pin; rf from output to − pin; + pin to ground
 * through rcomp (∥ ccomp). vref sets only the DC operating point (DESIGN §4.1 row 2, §4.3).
 */
import type {TopologyModel} from './model.js'
import {commonElements, feedbackElements, loadElements, parallel, seriesR, stagePoles, VOLTAGE_DC_KEYS} from './model.js'

export const inverting: TopologyModel = {
  terms: (r) => ({
    gain: -r.rf / (r.rg + r.rs),
    noiseGain: 1 + r.rf / (r.rg + r.rs),
    rgEff: r.rg + r.rs,
    rn: parallel(r.rf, r.rg + r.rs),
    rp: r.rcomp
  }),
  dcKeys: VOLTAGE_DC_KEYS,
  noiseKeys: ['en', 'in+', 'in-', 'r:rf', 'r:rg', 'r:rs', 'r:rcomp'],
  commonMode: (input) => [input.vref],
  netlist: (input) => ({
    elements: [
      seriesR('rs', input.rs?.value, 'src', 'x'),
      seriesR('rg', input.rg?.value, 'x', 'm'),
      ...commonElements(input, 'ref'),
      ...feedbackElements(input), ...loadElements(input)
    ],
    wires: [],
    drive: {kind: 'voltage', node: 'src'},
    dcSources: [{node: 'ref', volts: input.vref}],
    opamp: stagePoles(input)
  })
}
