/**
 * Transimpedance stage: the source current flows into the − pin (positive in, so the output
 * moves negative), rshunt and csource from the − pin to ground, rf (∥ cf) from output to
 * − pin, + pin to ground through rcomp (∥ ccomp) (DESIGN §3.3, §4.1 row 4, §4.3).
 */
import type {TopologyModel} from './model.js'
import {commonElements, feedbackElements, loadElements, parallel, stagePoles} from './model.js'

export const transimpedance: TopologyModel = {
  terms: (r) => ({
    gain: -r.rf,
    noiseGain: 1 + r.rf / r.rshunt,
    rgEff: r.rshunt,
    rn: parallel(r.rf, r.rshunt),
    rp: r.rcomp
  }),
  dcKeys: ['vos', 'vos-drift', 'ib', 'ios', 'idark', 'cmrr', 'psrr', 'aol-gain', 'resistor-tolerance', 'resistor-tempco'],
  noiseKeys: ['en', 'in+', 'in-', 'r:rf', 'r:rcomp', 'r:rshunt', 'shot', 'shot-signal'],
  commonMode: (input) => [input.vref],
  netlist: (input) => ({
    elements: [
      ...commonElements(input, 'ref'),
      ...feedbackElements(input), ...loadElements(input),
      {label: 'csource', kind: 'c', a: 'm', b: 'gnd', value: input.csource},
      ...(input.rshunt === null ? [] : [{label: 'rshunt' as const, kind: 'r' as const, a: 'm' as const, b: 'gnd' as const, value: input.rshunt}])
    ],
    wires: [],
    drive: {kind: 'current', node: 'm'},
    dcSources: [{node: 'ref', volts: input.vref}],
    opamp: stagePoles(input)
  })
}
