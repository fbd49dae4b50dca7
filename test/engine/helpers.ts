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
    }),
    ...newTopologyFixtures()
  ]
}

/** The topologies of DESIGN §8 (difference, low-pass), each with every element it takes, loads included. */
export function newTopologyFixtures(): StageInput[] {
  return [
    stageInput({
      topology: 'difference', opamp: testOpamp({rout: 60}), rf: res(100e3, 0.001, 10e-6), rg: res(10e3, 0.001, 10e-6), rs: res(50),
      rp: res(10e3, 0.001, 10e-6), rref: res(100e3, 0.001, 10e-6), cf: 10e-12, vref: 1, input: [-0.05, 0.05], inputCm: [4, 6],
      riso: res(47), cload: 1e-9, rload: 10e3, cstrayPlus: 1e-12
    }),
    stageInput({
      topology: 'lowpass-sallen-key', r1: res(10e3, 0.001), r2: res(22e3, 0.001), c1: {value: 10e-9, tolerance: 0.05}, c2: {value: 4.7e-9, tolerance: 0.05},
      rf: res(10e3, 0.001), rg: res(10e3, 0.001), rs: null, input: [-1, 1]
    }),
    stageInput({
      topology: 'lowpass-mfb', rf: null, rg: null, rs: null, r1: res(10e3, 0.001), r2: res(20e3, 0.001), r3: res(8.2e3, 0.001),
      c1: {value: 1e-9, tolerance: 0.02}, c2: {value: 22e-9, tolerance: 0.02}, rcomp: res(10e3), ccomp: 100e-9, vref: 2.5, input: [-1, 1]
    })
  ]
}

/** A noninverting stage with the full load of DESIGN §8.3: rout, riso, cload, rload, cstray-plus. */
export const loadedFixture = (): StageInput =>
  stageInput({opamp: testOpamp({rout: 80}), riso: res(33), cload: 4.7e-9, rload: 2e3, cstrayPlus: 3e-12})
