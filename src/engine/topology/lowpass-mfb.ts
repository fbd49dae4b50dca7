/**
 * Multiple-feedback (inverting) low-pass stage (DESIGN §8.4): source → r1 → node a (`x`);
 * r2 from node a to the output pin; r3 from node a to the − pin; c1 from the − pin to the
 * output pin; c2 from node a to ground; + pin to the reference (vref, AC ground) through
 * rcomp (∥ ccomp).
 */
import type {TopologyModel} from './model.js'
import {commonElements, loadElements, parallel, seriesR, stagePoles, VOLTAGE_DC_KEYS} from './model.js'

export const lowpassMfb: TopologyModel = {
  terms: (r) => ({
    gain: -r.r2 / r.r1,
    noiseGain: 1 + r.r2 / r.r1,
    rgEff: r.r1,
    rn: r.r3 + parallel(r.r1, r.r2),
    rp: r.rcomp
  }),
  dcKeys: VOLTAGE_DC_KEYS,
  noiseKeys: ['en', 'in+', 'in-', 'r:r1', 'r:r2', 'r:r3', 'r:rcomp'],
  commonMode: (input) => [input.vref],
  netlist: (input) => ({
    elements: [
      seriesR('r1', input.r1?.value, 'src', 'x'),
      seriesR('r2', input.r2?.value, 'x', 'o'),
      seriesR('r3', input.r3?.value, 'x', 'm'),
      {label: 'c1', kind: 'c', a: 'm', b: 'o', value: input.c1?.value ?? 0},
      {label: 'c2', kind: 'c', a: 'x', b: 'gnd', value: input.c2?.value ?? 0},
      ...commonElements(input, 'ref'),
      ...loadElements(input)
    ],
    wires: [],
    drive: {kind: 'voltage', node: 'src'},
    dcSources: [{node: 'ref', volts: input.vref}],
    opamp: stagePoles(input)
  })
}
