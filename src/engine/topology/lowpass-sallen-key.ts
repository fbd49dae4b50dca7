/**
 * Sallen-Key low-pass stage (DESIGN §8.4): source → r1 → node a (`x`) → r2 → + pin; c1 from
 * node a to the op-amp's output pin, c2 from the + pin to ground; − pin to the output pin
 * (unity gain), or through rf (∥ cf) with rg to ground for a gain of 1 + rf/rg.
 */
import type {TopologyModel} from './model.js'
import {commonElements, feedbackElements, loadElements, parallel, seriesR, shuntR, stagePoles, VOLTAGE_DC_KEYS} from './model.js'

export const lowpassSallenKey: TopologyModel = {
  terms: (r) => {
    const g = r.rg === Infinity ? 1 : 1 + r.rf / r.rg
    return {gain: g, noiseGain: g, rgEff: r.rg, rn: parallel(r.rf, r.rg), rp: r.r1 + r.r2}
  },
  dcKeys: VOLTAGE_DC_KEYS,
  noiseKeys: ['en', 'in+', 'in-', 'r:r1', 'r:r2', 'r:rf', 'r:rg'],
  // At DC the capacitors are open and the + pin follows the source.
  commonMode: (input) => input.input,
  netlist: (input) => ({
    elements: [
      seriesR('r1', input.r1?.value, 'src', 'x'),
      seriesR('r2', input.r2?.value, 'x', 'p'),
      {label: 'c1', kind: 'c', a: 'x', b: 'o', value: input.c1?.value ?? 0},
      {label: 'c2', kind: 'c', a: 'p', b: 'gnd', value: input.c2?.value ?? 0},
      ...commonElements(input, 'p'),
      ...feedbackElements(input),
      ...shuntR('rg', input.rg?.value, 'm', 'gnd'),
      ...loadElements(input)
    ],
    wires: [],
    drive: {kind: 'voltage', node: 'src'},
    opamp: stagePoles(input)
  })
}
