/**
 * The instrumentation stage (DESIGN §8.2) against the datasheet conventions it models.
 */
import {describe, expect, it} from 'vitest'
import {BOLTZMANN, evaluateStage, INA_ARCHETYPES, inaAsOpamp, type InaParams, type StageInput} from '../../src/engine/index.js'
import {res, stageInput} from '../engine/helpers.js'

const ina = (over: Partial<InaParams> = {}): InaParams => ({...INA_ARCHETYPES['precision-ina'], archetype: false, name: 'test-ina', ...over})
const stage = (part: InaParams, over: Partial<StageInput> = {}): StageInput =>
  stageInput({
    topology: 'instrumentation', ina: part, opamp: inaAsOpamp(part), rf: null, rg: res(494), rs: null, rcomp: null,
    input: [-0.01, 0.01], inputCm: [2.5, 2.5], temperature: [25, 25], band: [0.1, 10], ...over
  })
const term = (r: ReturnType<typeof evaluateStage>, key: string): number => r.dc.contributors.find((c) => c.key === key)?.output ?? NaN
const noise = (r: ReturnType<typeof evaluateStage>, key: string): number => r.noise.contributors.find((c) => c.key === key)?.outputRms ?? NaN

describe('instrumentation amplifier (DESIGN §8.2)', () => {
  it('G = 1 + gain-constant/rg, and output vos = vos-in·G + vos-out (datasheet convention, common practice)', () => {
    const part = ina({vosIn: 20e-6, vosOut: 150e-6, gainConstant: 49.4e3})
    const r = evaluateStage(stage(part))
    expect(r.gain).toBeCloseTo(101, 12)
    expect(term(r, 'vos')).toBeCloseTo(20e-6 * 101 + 150e-6, 15)
    expect(r.stability.phaseMargin).toBeNull()
    expect(r.stability.bandwidth).toBeCloseTo(part.gbw / 101, 6)
  })
  it('input-referred white noise √(en-in² + (en-out/G)²) (datasheet convention, common practice)', () => {
    // White only, far below the bandwidth, rg noise removed by a zero noise temperature (0 K).
    const part = ina({enCorner: 0, inCorner: 0, enIn: 8e-9, enOut: 90e-9, gbw: 1e9})
    const r = evaluateStage(stage(part, {noiseTemperature: -273.15, band: [1, 101]}))
    const g = r.gain
    const expected = Math.hypot(8e-9, 90e-9 / g) * Math.sqrt(100)
    expect(Math.abs(r.noise.inputRms / expected - 1)).toBeLessThan(1e-4)
  })
  it('rg noise term √(4kT·rg)·(G − 1)/G, input-referred', () => {
    // rg carries the input stage's differential current: its voltage √(4kT·rg) reaches the
    // output as (G − 1)·√(4kT·rg) (the current through the two internal feedback resistors,
    // whose sum is the gain constant, is V/rg), i.e. (G − 1)/G input-referred.
    const part = ina({enCorner: 0, inCorner: 0, gbw: 1e9})
    const s = stage(part, {band: [1, 101]})
    const r = evaluateStage(s)
    const g = r.gain
    const kT4 = 4 * BOLTZMANN * (25 + 273.15)
    const expected = Math.sqrt(kT4 * 494) * ((g - 1) / g) * g * Math.sqrt(100)
    expect(Math.abs(noise(r, 'r:rg') / expected - 1)).toBeLessThan(1e-4)
  })
  it('ib and ios through the source resistance of each leg', () => {
    const part = ina({ib: 2e-9, ios: 0.5e-9})
    const r = evaluateStage(stage(part, {rs: res(1e3, 0.01)}))
    const g = r.gain
    expect(term(r, 'ib')).toBeCloseTo(2e-9 * 2 * 1e3 * 0.01 * g, 15)
    expect(term(r, 'ios')).toBeCloseTo(0.5e-9 * 1e3 * g, 15)
  })
  it('gain-error and nonlinearity on the differential full scale only', () => {
    const part = ina({gainError: 0.001, nonlinearity: 10e-6})
    const r = evaluateStage(stage(part, {vref: 2.5}))
    const g = r.gain
    expect(term(r, 'gain-error')).toBeCloseTo(0.001 * g * 0.01, 15)
    expect(term(r, 'nonlinearity')).toBeCloseTo(10e-6 * g * 0.02, 15)
    expect(r.dc.fullScaleOutput).toBeCloseTo(2.5 + g * 0.01, 12)
  })
})
