/**
 * Noninverting stage: source → rs → rcomp (∥ ccomp) → + pin; rf from output to − pin,
 * rg from − pin to ground (DESIGN §4.1 table row 1, §4.3).
 */
import type {TopologyModel} from './model.js'
import {commonElements, feedbackElements, loadElements, parallel, seriesR, stagePoles, VOLTAGE_DC_KEYS} from './model.js'

export const noninverting: TopologyModel = {
  terms: (r) => ({
    gain: 1 + r.rf / r.rg,
    noiseGain: 1 + r.rf / r.rg,
    rgEff: r.rg,
    rn: parallel(r.rf, r.rg),
    rp: r.rs + r.rcomp
  }),
  dcKeys: VOLTAGE_DC_KEYS,
  noiseKeys: ['en', 'in+', 'in-', 'r:rf', 'r:rg', 'r:rs', 'r:rcomp'],
  commonMode: (input) => input.input,
  netlist: (input) => ({
    elements: [
      seriesR('rs', input.rs?.value, 'src', 'x'),
      ...commonElements(input, 'x'),
      ...feedbackElements(input), ...loadElements(input),
      // rg to ground is a shunt: absent means open, so it is only stamped when present.
      ...(input.rg ? [{label: 'rg' as const, kind: 'r' as const, a: 'm' as const, b: 'gnd' as const, value: input.rg.value}] : [])
    ],
    wires: [],
    drive: {kind: 'voltage', node: 'src'},
    opamp: stagePoles(input)
  })
}
