/**
 * Built-in converter archetypes (DESIGN §8.5): one representative parameter set per class.
 *
 * Every value is invented, typical of its class as a designer pencils it in before choosing
 * a part; none is taken from, or matches, any real part. The report says so wherever one is
 * used ("representative of the class, not a real part").
 */
import type {AdcParams} from './types.js'

export const ADC_ARCHETYPE_NAMES = ['sar-16', 'sar-18', 'delta-sigma-24'] as const
export type AdcArchetypeName = (typeof ADC_ARCHETYPE_NAMES)[number]
export const isAdcArchetypeName = (s: string): s is AdcArchetypeName => (ADC_ARCHETYPE_NAMES as readonly string[]).includes(s)

/** Statement printed wherever a converter archetype is used. */
export const ADC_ARCHETYPE_DISCLAIMER =
  'Converter archetype values are representative of the class, not a real part: replace them with the chosen converter’s datasheet maxima before sign-off.'

const lsb = (bits: number, lo: number, hi: number): number => (hi - lo) / 2 ** bits

/** The archetypes, SI. Invented values (demo only). */
export const ADC_ARCHETYPES: Record<AdcArchetypeName, AdcParams> = {
  // A 16-bit successive-approximation converter on a 4.096 V reference, unipolar input.
  'sar-16': {
    name: 'sar-16', archetype: true, bits: 16, input: [0, 4.096],
    noise: 0.6 * lsb(16, 0, 4.096), offset: 0.8e-3, offsetDrift: 1.5e-6,
    gainError: 0.0004, gainDrift: 6e-6, inl: 1.5, sampleRate: 500e3
  },
  // An 18-bit SAR with a fully differential ±4.096 V input.
  'sar-18': {
    name: 'sar-18', archetype: true, bits: 18, input: [-4.096, 4.096],
    noise: 1.2 * lsb(18, -4.096, 4.096), offset: 0.3e-3, offsetDrift: 0.8e-6,
    gainError: 0.00025, gainDrift: 4e-6, inl: 2.5, sampleRate: 1e6
  },
  // A 24-bit delta-sigma converter, ±2.5 V input, noise at a slow output data rate;
  // sample-rate is the modulator's.
  'delta-sigma-24': {
    name: 'delta-sigma-24', archetype: true, bits: 24, input: [-2.5, 2.5],
    noise: 0.45e-6, offset: 15e-6, offsetDrift: 40e-9,
    gainError: 0.0001, gainDrift: 2.5e-6, inl: 30, sampleRate: 256e3
  }
}
