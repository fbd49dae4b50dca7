/**
 * The key tables of the `adc` (DESIGN §8.5) and `chain` (§8.6) blocks: each key with how its
 * value is read, whether it is required and the default shown in the report when it is not
 * given. The block builders (`adc-block.ts`, `chain-block.ts`) only walk them.
 */
import type {Dimension} from '../units/index.js'
import {CHAIN_REQUIREMENT_KEYS, type AdcParams} from '../engine/chain/types.js'

export interface AdcKeySpec {
  readonly dim: Dimension
  /** Field of `AdcParams` it fills. */
  readonly field: Exclude<keyof AdcParams, 'name' | 'archetype' | 'input'>
  /** Required, or the text shown for its default. */
  readonly need: 'required' | {readonly default: string}
}

/** Converter keys with a single quantity; `input` (a range) is read separately and required. */
export const ADC_KEYS = {
  bits: {dim: 'bits', field: 'bits', need: 'required'},
  noise: {dim: 'converter-voltage', field: 'noise', need: {default: '0 V (only the quantisation noise LSB/√12)'}},
  offset: {dim: 'converter-voltage', field: 'offset', need: {default: '0 V'}},
  'offset-drift': {dim: 'converter-drift', field: 'offsetDrift', need: {default: '0 V/K'}},
  'gain-error': {dim: 'fraction', field: 'gainError', need: {default: '0 %'}},
  'gain-drift': {dim: 'tempco', field: 'gainDrift', need: {default: '0 ppm/K'}},
  inl: {dim: 'lsb', field: 'inl', need: {default: '0 LSB'}},
  'sample-rate': {dim: 'sample-rate', field: 'sampleRate', need: {default: 'not entered (no alias-rejection figure)'}}
} as const satisfies Record<string, AdcKeySpec>
export type AdcKey = keyof typeof ADC_KEYS
export const isAdcKey = (s: string): s is AdcKey => Object.hasOwn(ADC_KEYS, s)
/** Every key an adc block takes. */
export const ADC_BLOCK_KEYS: readonly string[] = ['input', ...Object.keys(ADC_KEYS)]

/** Chain keys (DESIGN §8.6). */
export const CHAIN_KEYS = ['title', 'stages', 'adc', 'temperature', 'band', 'calibration', 'yield', 'require', 'accept'] as const
export type ChainKey = (typeof CHAIN_KEYS)[number]
export const isChainKey = (s: string): s is ChainKey => (CHAIN_KEYS as readonly string[]).includes(s)

/** How each chain requirement is read: the dimension of its limit. */
export const CHAIN_REQUIREMENT_DIMS: Record<keyof typeof CHAIN_REQUIREMENT_KEYS, Dimension | 'input'> = {
  'input-error': 'input',
  'output-error': 'voltage',
  'error-lsb': 'lsb',
  'noise-free-bits': 'bits',
  'effective-bits': 'bits',
  'alias-rejection': 'ratio-db',
  'noise-rms-input': 'input',
  'input-error-calibrated': 'input',
  'output-error-calibrated': 'voltage',
  'error-lsb-calibrated': 'lsb',
  yield: 'fraction'
}
