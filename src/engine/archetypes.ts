/**
 * Built-in op-amp archetypes: one representative parameter set per input technology.
 *
 * Every value here is invented, typical of its class as a designer would pencil it in
 * before choosing a part; none is taken from, or matches, any real part. The report says
 * so wherever an archetype is used ("representative of the class, not a real part").
 */
import type {OpampParams} from './types.js'

export const ARCHETYPE_NAMES = [
  'general-bipolar',
  'precision-bipolar',
  'bias-cancelled-bipolar',
  'precision-jfet',
  'precision-cmos',
  'zero-drift'
] as const
export type ArchetypeName = (typeof ARCHETYPE_NAMES)[number]
export const isArchetypeName = (s: string): s is ArchetypeName => (ARCHETYPE_NAMES as readonly string[]).includes(s)

/** Statement printed wherever an archetype is used. */
export const ARCHETYPE_DISCLAIMER =
  'Archetype values are representative of the input class, not a real part: replace them with the chosen part’s datasheet maxima before sign-off.'

const dB = (x: number): number => 10 ** (x / 20)

const base = {
  archetype: true, ibMax: null, iosMax: null, ibDoubling: null, vcmRef: null,
  swingHeadroomNeg: null, swingHeadroomPos: null, cmHeadroom: null, cmHeadroomNeg: null, cmHeadroomPos: null,
  ioutMax: null, rout: null
} as const

/** The archetypes, SI. Invented values (demo only), typical of each class. */
export const ARCHETYPES: Record<ArchetypeName, OpampParams> = {
  'general-bipolar': {
    ...base, name: 'general-bipolar', inputType: 'bipolar',
    vos: 2e-3, vosDrift: 7e-6, ib: 250e-9, ios: 50e-9,
    en: 12e-9, enCorner: 20, in: 0.6e-12, inCorner: 200,
    gbw: 1.5e6, aol: dB(100), pmUnity: 60, cmrr: dB(86), psrr: dB(90),
    cinDiff: 2e-12, cinCm: 3e-12, slew: 0.6e6, swingHeadroom: 1.5
  },
  'precision-bipolar': {
    ...base, name: 'precision-bipolar', inputType: 'bipolar',
    vos: 50e-6, vosDrift: 0.5e-6, ib: 2.5e-9, ios: 2e-9,
    en: 8e-9, enCorner: 3, in: 0.12e-12, inCorner: 80,
    gbw: 1e6, aol: dB(128), pmUnity: 62, cmrr: dB(120), psrr: dB(115),
    cinDiff: 3e-12, cinCm: 4e-12, slew: 0.3e6, swingHeadroom: 1.2
  },
  'bias-cancelled-bipolar': {
    ...base, name: 'bias-cancelled-bipolar', inputType: 'bipolar-cancelled',
    vos: 40e-6, vosDrift: 0.4e-6, ib: 1e-9, ios: 0.9e-9,
    en: 10e-9, enCorner: 5, in: 0.2e-12, inCorner: 60,
    gbw: 700e3, aol: dB(124), pmUnity: 60, cmrr: dB(118), psrr: dB(112),
    cinDiff: 4e-12, cinCm: 4e-12, slew: 0.25e6, swingHeadroom: 1.2
  },
  'precision-jfet': {
    ...base, name: 'precision-jfet', inputType: 'jfet',
    vos: 300e-6, vosDrift: 3e-6, ib: 5e-12, ios: 2e-12,
    en: 11e-9, enCorner: 80, in: 2e-15, inCorner: 0,
    gbw: 5e6, aol: dB(112), pmUnity: 55, cmrr: dB(100), psrr: dB(100),
    cinDiff: 8e-12, cinCm: 6e-12, slew: 15e6, swingHeadroom: 1.5
  },
  'precision-cmos': {
    ...base, name: 'precision-cmos', inputType: 'cmos',
    vos: 150e-6, vosDrift: 1.5e-6, ib: 1e-12, ios: 0.5e-12,
    en: 18e-9, enCorner: 400, in: 0.6e-15, inCorner: 0,
    gbw: 3e6, aol: dB(115), pmUnity: 58, cmrr: dB(95), psrr: dB(95),
    cinDiff: 5e-12, cinCm: 5e-12, slew: 2e6, swingHeadroom: 0.05
  },
  'zero-drift': {
    ...base, name: 'zero-drift', inputType: 'zero-drift',
    vos: 8e-6, vosDrift: 0.04e-6, ib: 120e-12, ios: 200e-12,
    en: 40e-9, enCorner: 0, in: 0.15e-12, inCorner: 0,
    gbw: 1.8e6, aol: dB(130), pmUnity: 58, cmrr: dB(125), psrr: dB(120),
    cinDiff: 6e-12, cinCm: 6e-12, slew: 1e6, swingHeadroom: 0.05
  }
}
