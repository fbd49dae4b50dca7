/**
 * The instrumentation stage in the topology table (DESIGN §8.2). An integrated INA is a
 * compensated block with internal feedback: `evaluateStage` sends these stages to
 * `../instrumentation.ts`, which applies the block's datasheet model. There is no netlist of
 * ours for it, so asking for one is an error, not an approximation.
 */
import type {TopologyModel} from './model.js'

export const instrumentation: TopologyModel = {
  // The terms at resistor values alone cannot know the part's gain constant: rn = rp = rs, unity.
  terms: (r) => ({gain: 1, noiseGain: 1, rgEff: r.rg, rn: r.rs, rp: r.rs}),
  dcKeys: ['vos', 'vos-drift', 'ib', 'ios', 'cmrr', 'psrr', 'gain-error', 'resistor-tolerance', 'resistor-tempco', 'nonlinearity'],
  noiseKeys: ['en-in', 'en-out', 'in+', 'in-', 'r:rs', 'r:rg'],
  commonMode: (input) => input.inputCm,
  netlist: (input) => {
    throw new RangeError(`Unexpected netlist request for instrumentation stage \`${input.id}\`, expected the block model of instrumentation.ts (the part has no netlist of ours)`)
  }
}
