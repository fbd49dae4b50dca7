/**
 * Built-in instrumentation-amplifier archetypes (DESIGN §8.2): one representative parameter
 * set per class. Every value is invented, typical of its class as a designer would pencil it
 * in before choosing a part; none is taken from, or matches, any real part. The report says
 * so wherever one is used ("representative of the class, not a real part").
 */
import type {InaParams} from './types.js'

export const INA_ARCHETYPE_NAMES = ['general-ina', 'precision-ina', 'zero-drift-ina'] as const
export type InaArchetypeName = (typeof INA_ARCHETYPE_NAMES)[number]
export const isInaArchetypeName = (s: string): s is InaArchetypeName => (INA_ARCHETYPE_NAMES as readonly string[]).includes(s)

const dB = (x: number): number => 10 ** (x / 20)
const base = {archetype: true, ibMax: null, iosMax: null, ibDoubling: null, vcmRef: null} as const

/** The archetypes, SI. Invented values (demo only). */
export const INA_ARCHETYPES: Record<InaArchetypeName, InaParams> = {
  'general-ina': {
    ...base, name: 'general-ina', inputType: 'bipolar',
    gainConstant: 49.4e3, gainError: 0.002, gainDrift: 20e-6, nonlinearity: 20e-6,
    vosIn: 100e-6, vosOut: 500e-6, vosInDrift: 1e-6, vosOutDrift: 10e-6, ib: 2e-9, ios: 1e-9,
    enIn: 10e-9, enOut: 80e-9, enCorner: 10, in: 0.2e-12, inCorner: 100,
    cmrr: dB(100), psrr: dB(100), gbw: 1e6, slew: 1e6, swingHeadroom: 1.2, cmHeadroom: 1.5
  },
  'precision-ina': {
    ...base, name: 'precision-ina', inputType: 'bipolar',
    gainConstant: 49.4e3, gainError: 0.0005, gainDrift: 5e-6, nonlinearity: 5e-6,
    vosIn: 25e-6, vosOut: 200e-6, vosInDrift: 0.2e-6, vosOutDrift: 2e-6, ib: 1e-9, ios: 0.5e-9,
    enIn: 8e-9, enOut: 60e-9, enCorner: 5, in: 0.1e-12, inCorner: 50,
    cmrr: dB(120), psrr: dB(115), gbw: 1.5e6, slew: 0.8e6, swingHeadroom: 1, cmHeadroom: 1.2
  },
  'zero-drift-ina': {
    ...base, name: 'zero-drift-ina', inputType: 'zero-drift',
    gainConstant: 100e3, gainError: 0.001, gainDrift: 10e-6, nonlinearity: 10e-6,
    vosIn: 5e-6, vosOut: 50e-6, vosInDrift: 0.03e-6, vosOutDrift: 0.3e-6, ib: 0.3e-9, ios: 0.5e-9,
    enIn: 50e-9, enOut: 200e-9, enCorner: 0, in: 0.1e-12, inCorner: 0,
    cmrr: dB(125), psrr: dB(120), gbw: 0.5e6, slew: 0.2e6, swingHeadroom: 0.1, cmHeadroom: 0.1
  }
}

/** Statement printed wherever an INA archetype is used. */
export const INA_ARCHETYPE_DISCLAIMER =
  'Instrumentation-amplifier archetype values are representative of the class, not a real part: replace them with the chosen part’s datasheet maxima before sign-off.'

/**
 * The op-amp view of an INA, for the parts of the pipeline that print or check an amplifier
 * (bias currents, slew, headroom): its input stage's values under OpampParams field names.
 */
export function inaAsOpamp(ina: InaParams): import('./types.js').OpampParams {
  return {
    name: ina.name, archetype: ina.archetype, inputType: ina.inputType,
    vos: ina.vosIn, vosDrift: ina.vosInDrift, ib: ina.ib, ios: ina.ios, ibMax: ina.ibMax, iosMax: ina.iosMax, ibDoubling: ina.ibDoubling,
    en: ina.enIn, enCorner: ina.enCorner, in: ina.in, inCorner: ina.inCorner, gbw: ina.gbw, aol: 1e7, pmUnity: 90,
    cmrr: ina.cmrr, psrr: ina.psrr, vcmRef: ina.vcmRef, cinDiff: 0, cinCm: 0, slew: ina.slew,
    swingHeadroom: ina.swingHeadroom, swingHeadroomNeg: null, swingHeadroomPos: null,
    cmHeadroom: ina.cmHeadroom, cmHeadroomNeg: null, cmHeadroomPos: null, ioutMax: null, rout: null
  }
}

/** G = 1 + gain-constant/rg (DESIGN §8.2). */
export const inaGain = (ina: InaParams, rg: number): number => 1 + ina.gainConstant / rg
