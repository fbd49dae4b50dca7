/**
 * The data contract of measurement chains (DESIGN §8.5, §8.6): a converter (`AdcParams`), a
 * chain as the engine sees it (`ChainInput` plus one `ChainStage` view per stage, built from
 * that stage's own evaluation), and what the cascade returns (`ChainResult`).
 *
 * `ChainResult`'s fields `id … requirements` are the `chains` entries of `--json` (§8.6);
 * `curves`, `nodes`, `stageNoise`, `converter` and `outputSpan` are report-only.
 */
import type {Calibration, Range, YieldOptions, YieldRequirement, YieldResult} from '../types.js'

/** A converter's datasheet values, SI (DESIGN §8.5); LSB values already turned into volts. */
export interface AdcParams {
  /** Block id or archetype name. */
  name: string
  /** True for a built-in archetype (representative of the class, not a real part). */
  archetype: boolean
  /** Resolution, bits (an integer ≥ 1). */
  bits: number
  /** Input range [low, high], V. */
  input: Range
  /** Input-referred noise, rms, V (0 when not given). */
  noise: number
  /** Offset, max magnitude, V. */
  offset: number
  /** Offset drift, V/K. */
  offsetDrift: number
  /** Gain error, fraction of the reading (its error at an input V is gainError·|V|). */
  gainError: number
  /** Gain drift, 1/K, reference included. */
  gainDrift: number
  /** Integral nonlinearity, LSB. */
  inl: number
  /** Sampling rate, Hz (a delta-sigma converter's modulator rate); null when not given. */
  sampleRate: number | null
}

/** LSB = span / 2^bits, V (standard converter texts). */
export const lsbOf = (adc: Pick<AdcParams, 'bits' | 'input'>): number => (adc.input[1] - adc.input[0]) / 2 ** adc.bits

/** Requirement keys of a chain's `require:` map (DESIGN §8.6). */
export const CHAIN_REQUIREMENT_KEYS = {
  'input-error': {unit: 'input', sense: 'max'},
  'output-error': {unit: 'V', sense: 'max'},
  'error-lsb': {unit: 'LSB', sense: 'max'},
  'noise-free-bits': {unit: 'bits', sense: 'min'},
  'effective-bits': {unit: 'bits', sense: 'min'},
  'alias-rejection': {unit: 'dB', sense: 'min'},
  'noise-rms-input': {unit: 'input', sense: 'max'},
  'input-error-calibrated': {unit: 'input', sense: 'max'},
  'output-error-calibrated': {unit: 'V', sense: 'max'},
  'error-lsb-calibrated': {unit: 'LSB', sense: 'max'},
  /** Monte Carlo yield of each DC error requirement of the chain, minimum (fraction; DESIGN §8.7). */
  yield: {unit: '%', sense: 'min'}
} as const
export type ChainRequirementKey = keyof typeof CHAIN_REQUIREMENT_KEYS
export const isChainRequirementKey = (s: string): s is ChainRequirementKey => Object.hasOwn(CHAIN_REQUIREMENT_KEYS, s)

/** A chain, SI, defaults applied, converter resolved. */
export interface ChainInput {
  id: string
  title: string
  /** Stage ids in signal order. */
  stages: string[]
  adc: AdcParams | null
  /** Temperature range for the converter's drift terms, °C (default: the first stage's). */
  temperature: Range
  /** Noise band at the converter [fL, fH], Hz (default: the last stage's band). */
  band: Range
  /** Calibration of the whole chain (DESIGN §4.6, §8.6). */
  calibration: Calibration
  /** Requirement limits: V (or A), LSB, bits, dB. */
  require: Partial<Record<ChainRequirementKey, number>>
  /** Monte Carlo over the chain's DC budget (DESIGN §8.7); absent or null = off. */
  yield?: YieldOptions | null
}

/** The chain's DC requirements a yield is given for (DESIGN §8.6, §8.7), in this order. */
export const CHAIN_YIELD_KEYS = ['output-error', 'input-error', 'error-lsb', 'output-error-calibrated', 'input-error-calibrated', 'error-lsb-calibrated'] as const
export type ChainYieldKey = (typeof CHAIN_YIELD_KEYS)[number]

/** The yield of one DC requirement of a chain. */
export type ChainYieldRequirement = Omit<YieldRequirement, 'key'> & {key: ChainYieldKey}

/**
 * The Monte Carlo result of a chain (DESIGN §8.7): the stage's fields, the errors at the
 * converter's input (V), variables named `<stage id>/<variable>` and `<converter>/<key>`.
 */
export type ChainYieldResult = Omit<YieldResult, 'results'> & {results: ChainYieldRequirement[]}

/**
 * What the cascade needs of one evaluated stage: numbers from its own result, and its
 * spectral view (the stage's solved netlist, sampled wherever the chain asks).
 */
export interface ChainStage {
  id: string
  /** Signed DC signal gain (V/V; V/A for a transimpedance first stage). */
  gain: number
  /** The stage's DC contributors, output-referred magnitudes, V. */
  contributors: readonly {key: string; output: number}[]
  /** The residuals after the chain's calibration (same keys); null without one. */
  calibrated: readonly {key: string; output: number}[] | null
  /** Output span over its input range [low, high], V (ideal op-amp, nominal parts). */
  outputSpan: readonly [number, number]
  /** Input range used [low, high] (V, or A). */
  inputSpan: readonly [number, number]
  /** The stage's closed-loop −3 dB bandwidth, Hz; null when none was found. */
  bandwidth: number | null
  spectrum: StageSpectrum
}

/**
 * A stage's full output noise density and complex signal transfer at any frequency, from
 * the stage's own solved netlist (`stageSpectrum` in ./spectrum.ts).
 */
export interface StageSpectrum {
  /**
   * Write, at f > 0: the output noise density with every source (V²/Hz), the same without
   * `shot-signal` (V²/Hz), and Re, Im of the signal transfer H(f), into out[offset … offset + 3].
   */
  at(f: number, out: Float64Array, offset: number): void
  /** H(0), signed. */
  dcGain: number
  /** True when a source depends on the signal (`shot-signal`): the zero-signal floor differs. */
  signalNoise: boolean
}

/** One DC contributor carried to the chain's output. */
export interface ChainDcContributor {
  /** Stage id, or the converter's name. */
  source: string
  key: string
  /** Magnitude at the converter input, V. */
  output: number
}

export interface ChainDcTotals {
  worstCaseOutput: number
  rssOutput: number
  /** Worst case ÷ |ΠGk| (V, or A). */
  worstCaseInput: number
  /** Worst case ÷ LSB; null without a converter. */
  worstCaseLsb: number | null
}

export interface ChainDc extends ChainDcTotals {
  contributors: ChainDcContributor[]
  /** Residuals after the chain's calibration; null without one. */
  calibrated: (ChainDcTotals & {calibration: Exclude<Calibration, 'none'>; contributors: ChainDcContributor[]}) | null
}

export interface ChainNoise {
  /** Analog chain output rms over the chain's band, full-scale signal (V). */
  outputRms: number
  /** The same without signal-dependent noise (V). */
  zeroSignalOutputRms: number
  /** The whole measurement's rms (at the converter when there is one) ÷ |ΠGk| (V, or A). */
  inputRms: number
  /** √(σchain² + noise² + LSB²/12), V; null without a converter. */
  converterRms: number | null
  /** log2(span/(6.6σ)) capped at bits; null without a converter. */
  noiseFreeBits: number | null
  /** log2(span/σ) capped at bits; null without a converter. */
  effectiveBits: number | null
  /** Chain output rms from fL to 10× the chain's bandwidth (V); null without a sample rate. */
  widebandRms: number | null
}

export interface ChainRequireResult {
  key: ChainRequirementKey
  kind: 'require'
  limit: number
  /** null when the figure does not exist (no converter, no sample rate). */
  value: number | null
  met: boolean
}

export interface ChainLimitResult {
  key: 'converter-range'
  kind: 'limit'
  /** The chain's output span [low, high], V. */
  value: [number, number]
  /** The converter's input range, V; null without a converter. */
  limit: [number, number] | null
  met: boolean | null
  missing: string[]
}

export type ChainRequirementResult = ChainRequireResult | ChainLimitResult

/** Report-only curves: the cascaded density on the chain's band grid. */
export interface ChainCurves {
  /** Hz, ascending, inside the chain's band. */
  frequency: number[]
  /** Each stage's part of the chain's output density, V/√Hz, in stage order. */
  stageDensity: number[][]
  /** Total output density, V/√Hz. */
  total: number[]
  /** Cumulative output rms from fL, V. */
  cumulativeRms: number[]
}

export interface ChainResult {
  id: string
  stages: string[]
  /** Signed ΠGk at DC. */
  gain: number
  /** The chain's −3 dB bandwidth, Hz; null when none was found. */
  bandwidth: number | null
  /** Fraction of the converter's span the chain's output covers; null without a converter. */
  rangeUsed: number | null
  dc: ChainDc
  noise: ChainNoise
  /** dB, −20·lg of the largest |H(f)/H(0)| over [fs − fH, fs + fH]; null without fs or when fs ≤ 2·fH. */
  aliasRejection: number | null
  requirements: ChainRequirementResult[]
  /** Report-only: the signal range at every node (input of each stage, then its output). */
  nodes: {stage: string; input: [number, number]; output: [number, number]}[]
  /** Report-only: each stage's noise at the chain output over the band, V rms, stage order. */
  stageNoise: {stage: string; outputRms: number}[]
  /** Report-only: the chain's output span, V. */
  outputSpan: [number, number]
  /** Report-only: the converter figures used (null without one). */
  converter: {name: string; archetype: boolean; bits: number; span: number; lsb: number; input: [number, number]; sampleRate: number | null; noise: number; quantization: number} | null
  /** Report-only: the temperature span used for the converter drift, K. */
  temperatureSpan: number
  /** Report-only: the band used, Hz. */
  band: [number, number]
  curves: ChainCurves
  /** Monte Carlo yield over the chain's DC budget (DESIGN §8.7); null when off. */
  yield: ChainYieldResult | null
}
