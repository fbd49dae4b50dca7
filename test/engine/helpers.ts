/**
 * Test fixtures for the engine: `stageInput(overrides)` (the `engine` preset of the one
 * stage builder, test/support/stage-input.ts) and one stage per topology.
 */
import type {StageInput} from '../../src/engine/index.js'
import {fromDb, res, stageFrom, testOpamp} from '../support/stage-input.js'

export {fromDb, res, testOpamp}

/** A noninverting stage (G = 21) with every field set (preset `engine`); override anything. */
export const stageInput = (overrides: Partial<StageInput> = {}): StageInput => stageFrom('engine', overrides)

/** One stage per topology, each with every element that topology takes. */
export function topologyFixtures(): StageInput[] {
  return [
    stageInput({rcomp: res(910), ccomp: 10e-9}),
    stageInput({topology: 'inverting', rf: res(47e3, 0.001), rg: res(4.7e3, 0.001), rs: res(200), rcomp: res(4.3e3), ccomp: 1e-9, cf: 4.7e-12, vref: 1.5}),
    stageInput({topology: 'follower', rf: res(10e3), rg: null, rs: res(10e3), rcomp: null, cf: 0}),
    stageInput({
      topology: 'transimpedance', rf: res(1e6, 0.005), rg: null, rs: null, rcomp: res(1e6), ccomp: 100e-9, cf: 2.2e-12,
      rshunt: 200e6, csource: 30e-12, idark: 50e-12, input: [0, 2e-6], vref: 0.5
    })
  ]
}
