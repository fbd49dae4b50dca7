/**
 * Test fixtures for the engine: an invented op-amp and `stageInput(overrides)`, which builds
 * a complete `StageInput` directly (no note parsing). All values are invented for tests.
 */
import type {OpampParams, Resistor, StageInput} from '../../src/engine/index.js'

/** A resistor with optional tolerance (fraction) and tempco (1/K). */
export const res = (value: number, tolerance = 0, tempco = 0): Resistor => ({value, tolerance, tempco})

/** dB → V/V. */
export const fromDb = (x: number): number => 10 ** (x / 20)

/** An invented bipolar op-amp; values typical of nothing in particular. */
export function testOpamp(overrides: Partial<OpampParams> = {}): OpampParams {
  return {
    name: 'test-amp',
    archetype: false,
    inputType: 'bipolar',
    vos: 75e-6,
    vosDrift: 0.8e-6,
    ib: 3e-9,
    ios: 1.5e-9,
    ibMax: null,
    iosMax: null,
    ibDoubling: null,
    en: 9e-9,
    enCorner: 5,
    in: 0.3e-12,
    inCorner: 50,
    gbw: 2e6,
    aol: fromDb(120),
    pmUnity: 60,
    cmrr: fromDb(110),
    psrr: fromDb(105),
    vcmRef: null,
    cinDiff: 3e-12,
    cinCm: 5e-12,
    slew: 1e6,
    swingHeadroom: 1.3,
    swingHeadroomNeg: null,
    swingHeadroomPos: null,
    cmHeadroom: null,
    cmHeadroomNeg: null,
    cmHeadroomPos: null,
    ioutMax: null,
    rout: null,
    ...overrides
  }
}

/** A noninverting stage (G = 21) with every field set; override anything. */
export function stageInput(overrides: Partial<StageInput> = {}): StageInput {
  return {
    id: 'test-stage',
    title: 'Test stage',
    topology: 'noninverting',
    opamp: testOpamp(),
    rf: res(20e3, 0.001, 25e-6),
    rg: res(1e3, 0.001, 25e-6),
    rs: res(500),
    rcomp: null,
    ccomp: 0,
    cf: 0,
    cstray: 2e-12,
    rshunt: null,
    csource: 0,
    idark: 0,
    idarkMax: null,
    idarkDoubling: 10,
    vref: 0,
    rp: null, rref: null, r1: null, r2: null, r3: null, c1: null, c2: null,
    riso: null, cload: 0, cstrayPlus: 0, inputCm: [0, 0], ina: null,
    input: [-0.05, 0.05],
    supply: [-12, 12],
    supplyTolerance: 0.05,
    temperature: [-20, 70],
    band: [0.1, 1e3],
    noiseTemperature: 25,
    signalFrequency: null,
    rload: null,
    calibration: 'none',
    require: {},
    ...overrides
  }
}

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
