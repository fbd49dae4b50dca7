/**
 * One builder of complete `StageInput`s for the tests (no note parsing), with named presets;
 * each preset is a whole stage, and a test overrides only what it is about. All values are
 * invented for tests.
 */
import {ARCHETYPES} from '../../src/engine/archetypes.js'
import type {OpampParams, Resistor, StageInput} from '../../src/engine/types.js'

/** A resistor with optional tolerance (fraction) and tempco (1/K). */
export const res = (value: number, tolerance = 0, tempco = 0): Resistor => ({value, tolerance, tempco})

/** dB → V/V. */
export const fromDb = (x: number): number => 10 ** (x / 20)

/** An invented bipolar op-amp; values typical of nothing in particular. */
export function testOpamp(overrides: Partial<OpampParams> = {}): OpampParams {
  return {
    name: 'test-amp', archetype: false, inputType: 'bipolar',
    vos: 75e-6, vosDrift: 0.8e-6, ib: 3e-9, ios: 1.5e-9, ibMax: null, iosMax: null, ibDoubling: null,
    en: 9e-9, enCorner: 5, in: 0.3e-12, inCorner: 50, gbw: 2e6, aol: fromDb(120), pmUnity: 60,
    cmrr: fromDb(110), psrr: fromDb(105), vcmRef: null, cinDiff: 3e-12, cinCm: 5e-12, slew: 1e6, swingHeadroom: 1.3,
    swingHeadroomNeg: null, swingHeadroomPos: null, cmHeadroom: null, cmHeadroomNeg: null, cmHeadroomPos: null, ioutMax: null, rout: null,
    ...overrides
  }
}

/** The fields every preset starts from: no optional element, no requirement. */
const BLANK: Omit<StageInput, 'opamp' | 'rf' | 'rg' | 'rs' | 'input' | 'supply' | 'temperature' | 'band'> = {
  id: 'test-stage', title: 'Test stage', topology: 'noninverting',
  rcomp: null, ccomp: 0, cf: 0, cstray: 2e-12, rshunt: null, csource: 0, idark: 0, idarkMax: null, idarkDoubling: 10, vref: 0,
  rp: null, rref: null, r1: null, r2: null, r3: null, c1: null, c2: null,
  riso: null, cload: 0, cstrayPlus: 0, inputCm: [0, 0], ina: null,
  supplyTolerance: 0.05, noiseTemperature: 25, signalFrequency: null, rload: null, calibration: 'none', require: {}
}

/** The named stages (functions, so that every call gets fresh objects). */
export const STAGE_PRESETS = {
  /** Engine tests: noninverting G = 21 (20 kΩ / 1 kΩ, 500 Ω source) on the invented op-amp, ±12 V, −20 … 70 °C, 0.1 Hz … 1 kHz. */
  engine: (): StageInput => ({
    ...BLANK, opamp: testOpamp(), rf: res(20e3, 0.001, 25e-6), rg: res(1e3, 0.001, 25e-6), rs: res(500),
    input: [-0.05, 0.05], supply: [-12, 12], temperature: [-20, 70], band: [0.1, 1e3]
  }),
  /** Rule tests: noninverting G = 11 (10 kΩ / 1 kΩ) on the precision-bipolar archetype, ±15 V, 25 °C, 0.1 … 100 Hz. */
  rules: (): StageInput => ({
    ...BLANK, opamp: {...ARCHETYPES['precision-bipolar']}, rf: res(10e3, 0.001, 25e-6), rg: res(1e3, 0.001, 25e-6), rs: null,
    input: [-0.1, 0.1], supply: [-15, 15], temperature: [25, 25], band: [0.1, 100]
  })
} as const

export type StagePreset = keyof typeof STAGE_PRESETS

/** A complete stage: the preset with `overrides` applied. */
export const stageFrom = (preset: StagePreset, overrides: Partial<StageInput> = {}): StageInput =>
  ({...STAGE_PRESETS[preset](), ...overrides})
