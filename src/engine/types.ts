/**
 * The engine's data contract: what a stage is (`StageInput`, all SI, defaults applied,
 * op-amp resolved) and what the engine returns (`StageResult`).
 *
 * `StageResult`'s fields `id … requirements` are the `--json` contract of DESIGN §6; the
 * report-only fields (`curves`, `swing`, `bias`) are stripped by `src/results/json.ts`.
 * Notes (`notes` in the JSON) come from `src/rules`, not from the engine.
 */

/** Stage topologies (DESIGN §3.3, §8.1, §8.4). */
export const TOPOLOGIES = ['noninverting', 'inverting', 'follower', 'transimpedance', 'difference', 'lowpass-sallen-key', 'lowpass-mfb', 'instrumentation'] as const
export type Topology = (typeof TOPOLOGIES)[number]
export const isTopology = (s: string): s is Topology => (TOPOLOGIES as readonly string[]).includes(s)

/** Input technologies of an op-amp (DESIGN §3.2). */
export const INPUT_TYPES = ['bipolar', 'bipolar-cancelled', 'jfet', 'cmos', 'zero-drift'] as const
export type InputType = (typeof INPUT_TYPES)[number]
export const isInputType = (s: string): s is InputType => (INPUT_TYPES as readonly string[]).includes(s)

/** Requirement keys of a stage's `require:` map (DESIGN §3.3). */
export const REQUIREMENT_KEYS = {
  'output-error': {unit: 'V', sense: 'max'},
  'output-error-rss': {unit: 'V', sense: 'max'},
  'input-error': {unit: 'V', sense: 'max'},
  'noise-rms': {unit: 'V', sense: 'max'},
  'noise-pp': {unit: 'V', sense: 'max'},
  'phase-margin': {unit: 'deg', sense: 'min'},
  bandwidth: {unit: 'Hz', sense: 'min'},
  /** Worst-case DC error after calibration (DESIGN §4.6); the full worst case without one. */
  'output-error-calibrated': {unit: 'V', sense: 'max'},
  'input-error-calibrated': {unit: 'V', sense: 'max'},
  /** Monte Carlo yield of each DC requirement of the stage, minimum (fraction; DESIGN §8.7). */
  yield: {unit: '%', sense: 'min'}
} as const
export type RequirementKey = keyof typeof REQUIREMENT_KEYS

/** A resistor: value with tolerance and temperature coefficient. */
export interface Resistor {
  /** Resistance, Ω (> 0). */
  value: number
  /** Tolerance as a fraction (0.001 for 0.1 %); 0 when not given. */
  tolerance: number
  /** Temperature coefficient, 1/K (25e-6 for 25 ppm/K); 0 when not given. */
  tempco: number
}

/** A capacitor: value with tolerance (DESIGN §8.4). */
export interface Capacitor {
  /** Capacitance, F (> 0). */
  value: number
  /** Tolerance as a fraction; 0 when not given. Shown in the parameters table only. */
  tolerance: number
}

/** An op-amp's datasheet values, SI. */
export interface OpampParams {
  /** Block id or archetype name. */
  name: string
  /** True when this is a built-in archetype (representative of its class, not a real part). */
  archetype: boolean
  inputType: InputType
  /** Input offset voltage, max at 25 °C, V. */
  vos: number
  /** Offset drift, max, V/K. */
  vosDrift: number
  /** Input bias current, max magnitude at 25 °C, A (average of the two inputs). */
  ib: number
  /** Input offset current, max magnitude at 25 °C, A. */
  ios: number
  /** Max bias current over the stage's temperature range, A; null when not entered. */
  ibMax: number | null
  /** Max offset current over the temperature range, A; null when not entered. */
  iosMax: number | null
  /** Bias current doubling interval, K. Null when not entered (then 10 K for jfet/cmos; zero-drift uses the rule only when given). */
  ibDoubling: number | null
  /** White voltage noise density, V/√Hz. */
  en: number
  /** 1/f corner of en, Hz (0 = none). */
  enCorner: number
  /** White current noise density, A/√Hz. */
  in: number
  /** 1/f corner of in, Hz (0 = none). */
  inCorner: number
  /** Gain-bandwidth product, Hz (> 0). */
  gbw: number
  /** Open-loop DC gain, V/V (linear, converted from dB). */
  aol: number
  /** Phase margin as a unity follower, degrees, 0 < φ ≤ 90 (90 = no second pole). */
  pmUnity: number
  /** Common-mode rejection ratio, linear (V/V). */
  cmrr: number
  /** Power-supply rejection ratio, linear (V/V). */
  psrr: number
  /** Common-mode voltage at which vos is specified, V; null = supply midpoint. */
  vcmRef: number | null
  /** Differential input capacitance, F. */
  cinDiff: number
  /** Common-mode input capacitance, each input to ground, F. */
  cinCm: number
  /** Slew rate, V/s; null when not entered (the slew limit is then skipped, DESIGN §4.6). */
  slew: number | null
  /** Output swing headroom to each rail, V; null when not entered (DESIGN §4.6). */
  swingHeadroom: number | null
  /** Output swing headroom to the negative rail, V; null = use `swingHeadroom`. */
  swingHeadroomNeg: number | null
  /** Output swing headroom to the positive rail, V; null = use `swingHeadroom`. */
  swingHeadroomPos: number | null
  /** Input common-mode headroom to each rail, V (negative: the range extends beyond the rail); null when not entered. */
  cmHeadroom: number | null
  /** Common-mode headroom to the negative rail, V; null = use `cmHeadroom`. */
  cmHeadroomNeg: number | null
  /** Common-mode headroom to the positive rail, V; null = use `cmHeadroom`. */
  cmHeadroomPos: number | null
  /** Largest output current, A; null when not entered. */
  ioutMax: number | null
  /** Open-loop output resistance, Ω; null when not entered (used with loads, DESIGN §8.3). */
  rout: number | null
}

/** An integrated instrumentation amplifier's datasheet values, SI (DESIGN §8.2). */
export interface InaParams {
  /** Block id or archetype name. */
  name: string
  archetype: boolean
  inputType: InputType
  /** G = 1 + gainConstant/rg, Ω. */
  gainConstant: number
  /** Gain error at 25 °C excluding rg, fraction. */
  gainError: number
  /** Gain drift excluding rg, 1/K. */
  gainDrift: number
  /** Nonlinearity, fraction of the output span. */
  nonlinearity: number
  vosIn: number
  vosOut: number
  vosInDrift: number
  vosOutDrift: number
  ib: number
  ios: number
  ibMax: number | null
  iosMax: number | null
  ibDoubling: number | null
  vcmRef: number | null
  /** Input-stage and output-stage voltage noise, V/√Hz, with one 1/f corner. */
  enIn: number
  enOut: number
  enCorner: number
  in: number
  inCorner: number
  /** CMRR at the stage's gain, linear. */
  cmrr: number
  /** PSRR, input-referred, linear. */
  psrr: number
  /** Bandwidth ≈ gbw/G, Hz. */
  gbw: number
  slew: number | null
  swingHeadroom: number | null
  cmHeadroom: number | null
}

/** Room-temperature calibration of a stage (DESIGN §4.6). */
export const CALIBRATIONS = ['none', 'offset', 'offset-and-gain'] as const
export type Calibration = (typeof CALIBRATIONS)[number]
export const isCalibration = (s: string): s is Calibration => (CALIBRATIONS as readonly string[]).includes(s)

/** An inclusive range [low, high]. */
export type Range = readonly [number, number]

/** A stage, SI, defaults applied, op-amp resolved (DESIGN §3.3). */
export interface StageInput {
  id: string
  title: string
  topology: Topology
  opamp: OpampParams
  /** Feedback resistor; null for a follower without one (a wire). Required elsewhere. */
  rf: Resistor | null
  /** Gain resistor (noninverting: to ground; inverting: from the source). Null where not used. */
  rg: Resistor | null
  /** Source resistance; null when none (0 Ω). */
  rs: Resistor | null
  /** Bias-compensation resistor at the + input; null when none. */
  rcomp: Resistor | null
  /** Capacitor across rcomp, F (0 = none). */
  ccomp: number
  /** Capacitor across rf, F (0 = none). */
  cf: number
  /** Board capacitance from the − pin to ground, F. */
  cstray: number
  /** Transimpedance source shunt resistance, Ω; null = open. */
  rshunt: number | null
  /** Transimpedance source capacitance, F. */
  csource: number
  /** Transimpedance source DC current (dark current) at 25 °C, A. */
  idark: number
  /** Dark current over the temperature range, A; null = idark·2^(max(0, Tmax − 25)/idarkDoubling). */
  idarkMax: number | null
  /** Dark-current doubling interval, K (default 10 K, common practice for silicon photodiodes). */
  idarkDoubling: number
  /** Voltage on the + input of inverting and transimpedance stages, and the reference node of `difference` and `lowpass-mfb` stages, V. */
  vref: number
  /** Difference: + leg resistor, source + to the + pin (DESIGN §8.1). */
  rp: Resistor | null
  /** Difference: + pin to the reference node at vref. */
  rref: Resistor | null
  /** Low-pass filters (DESIGN §8.4): r1, r2, r3 (MFB only), c1, c2. */
  r1: Resistor | null
  r2: Resistor | null
  r3: Resistor | null
  c1: Capacitor | null
  c2: Capacitor | null
  /** Series isolation resistor between the output pin and the load (DESIGN §8.3); null = none. */
  riso: Resistor | null
  /** Load capacitance from the load node to ground, F. */
  cload: number
  /** Capacitance from the + pin to ground, F. */
  cstrayPlus: number
  /** Difference and instrumentation: common-mode range of the input, V (default 0 .. 0). */
  inputCm: Range
  /** Instrumentation: the integrated amplifier (DESIGN §8.2); null for other topologies. */
  ina: InaParams | null
  /** Signal range at the stage input: V, or A for transimpedance. */
  input: Range
  /** Supply rails [negative, positive], V. */
  supply: Range
  /** Supply tolerance, fraction (default 0.05). */
  supplyTolerance: number
  /** Temperature range, °C (default 25 .. 25). */
  temperature: Range
  /** False when the note gave no `temperature` (the 25 .. 25 °C default applies); absent = not known. */
  temperatureEntered?: boolean
  /** Noise band [fL, fH], Hz, fL > 0. */
  band: Range
  /** Noise temperature, °C (default 25). */
  noiseTemperature: number
  /** Signal frequency for the slew limit, Hz; null = the band's top (DESIGN §4.6). */
  signalFrequency: number | null
  /** Load resistance from the load node (after riso) to ground, Ω; null = none (DESIGN §4.6, §8.3). */
  rload: number | null
  /** Room-temperature calibration (DESIGN §4.6, default none). */
  calibration: Calibration
  /** Requirement limits, SI (V, Hz, degrees; yield a fraction). */
  require: Partial<Record<RequirementKey, number>>
  /** Monte Carlo over the DC budget (DESIGN §8.7); absent or null = off. */
  yield?: YieldOptions | null
}

/** Distributions of the resistor draws (DESIGN §8.7): uniform within ± the limit, or normal σ = limit/3 truncated there. */
export const YIELD_DISTRIBUTIONS = ['uniform', 'normal'] as const
export type YieldDistribution = (typeof YIELD_DISTRIBUTIONS)[number]
export const isYieldDistribution = (s: string): s is YieldDistribution => (YIELD_DISTRIBUTIONS as readonly string[]).includes(s)

/** A stage's `yield:` map (DESIGN §8.7). */
export interface YieldOptions {
  /** Number of trials (≥ 1). */
  trials: number
  /** Seed, an integer 0 … 2^32 − 1. */
  seed: number
  /** Resistor value and tempco draws; the op-amp's maxima are always truncated normals. */
  distribution: YieldDistribution
}

/** The DC requirements a yield is given for (DESIGN §8.7). */
export const YIELD_KEYS = ['output-error', 'input-error', 'output-error-calibrated', 'input-error-calibrated'] as const
export type YieldKey = (typeof YIELD_KEYS)[number]

/** The yield of one DC requirement. */
export interface YieldRequirement {
  key: YieldKey
  /** The requirement's limit, SI. */
  limit: number
  /** Trials meeting the limit. */
  passed: number
  /** passed / trials. */
  yield: number
  /** 95 % Wilson score interval of the yield. */
  interval: [number, number]
}

/** The Monte Carlo result of a stage (DESIGN §8.7). */
export interface YieldResult {
  trials: number
  seed: number
  distribution: YieldDistribution
  /** Why no yield was computed (a topology without a closed form); null when it was. */
  unavailable: string | null
  /** One row per DC requirement the stage gives, in the order of YIELD_KEYS. */
  results: YieldRequirement[]
  /** The error the percentiles, histogram and variance shares describe: the calibrated residual when the stage has a calibration. */
  basis: 'output' | 'output-calibrated'
  /** The worst-case bound of that error (the budget's sum of magnitudes), V. */
  worstCase: number
  /** Nearest-rank percentiles of that error, V; null when unavailable. */
  errorPercentiles: {p50: number; p99: number; p999: number} | null
  /** Largest error of any trial, V. */
  maxError: number
  /** Each random variable's share of the error variance (Jansen total effects normalised to sum 1), largest first. */
  variance: {variable: string; share: number}[]
  /** Where the variance shares were taken: the input end (and common mode) and temperature of largest variance. */
  varianceAt: {input: number; inputCm: number | null; temperature: number} | null
  /** Base rows of the variance estimate. */
  varianceRows: number
  /** Report-only: equal bins over [0, top] of the error. */
  histogram: {top: number; counts: number[]}
}

/** DC contributor keys (DESIGN §4.2). */
export const DC_KEYS = ['vos', 'vos-drift', 'ib', 'ios', 'idark', 'cmrr', 'psrr', 'aol-gain', 'gain-error', 'resistor-tolerance', 'resistor-tempco', 'nonlinearity'] as const
export type DcKey = (typeof DC_KEYS)[number]

/** Noise contributor keys (DESIGN §4.3). */
export const NOISE_KEYS = [
  'en', 'en-in', 'en-out', 'in+', 'in-', 'r:rf', 'r:rg', 'r:rs', 'r:rcomp', 'r:rshunt', 'r:rp', 'r:rref', 'r:r1', 'r:r2', 'r:r3', 'r:riso', 'r:rload', 'shot', 'shot-signal'
] as const
export type NoiseKey = (typeof NOISE_KEYS)[number]

/** The residual budget after a room-temperature calibration (DESIGN §4.6). */
export interface CalibratedBudget {
  calibration: Exclude<Calibration, 'none'>
  /** Residual of every key of `DcBudget.contributors`, same order, V. */
  contributors: {key: DcKey; output: number}[]
  worstCaseOutput: number
  rssOutput: number
  worstCaseInput: number
  rssInput: number
}

export interface DcBudget {
  /** ΔT = max(Tmax − 25, 25 − Tmin, 0), K. */
  temperatureSpan: number
  /** max|Vout,ideal| over the input range's two ends, reference term included (DESIGN §4.2), V. */
  fullScaleOutput: number
  /** Every key that applies to the topology, zero or not; output-referred magnitude, V. */
  contributors: {key: DcKey; output: number}[]
  worstCaseOutput: number
  rssOutput: number
  worstCaseInput: number
  rssInput: number
  /** Residuals after calibration; null when the stage has none (DESIGN §4.6). */
  calibrated: CalibratedBudget | null
  /**
   * Difference stages: the network's own common-mode rejection at its worst tolerance corner,
   * 20·lg(|G|/|Acm|), dB (DESIGN §8.1); null for other topologies, when no resistor carries a
   * tolerance, or when the ideal network rejects the common mode exactly at every corner.
   */
  networkCmrr: number | null
}

export interface NoiseBudget {
  /** [fL, fH], Hz. */
  band: [number, number]
  /** Noise temperature, K. */
  temperature: number
  /** Output rms over the band at the full-scale signal (with `shot-signal`), V. */
  outputRms: number
  /** Output rms over the band without `shot-signal` (the noise floor at zero signal), V. */
  zeroSignalOutputRms: number
  /** 6.6 × rms, V. */
  outputPeakToPeak: number
  /** Output rms ÷ |G| at DC (V, or A for transimpedance). */
  inputRms: number
  contributors: {key: NoiseKey; outputRms: number}[]
}

export interface Stability {
  /** Degrees; null when the loop gain never crosses 1. */
  phaseMargin: number | null
  /** Loop-gain crossover, Hz; null when none. */
  crossover: number | null
  /** Closed-loop −3 dB bandwidth, Hz; null when never reached in the analysed span. */
  bandwidth: number | null
  /** 20·lg(max|H|/|H(0)|), dB, ≥ 0. */
  peaking: number
  /** Transimpedance: smallest Cf (F) giving 60°; 0 if already; null if none ≤ 1 µF or not transimpedance. */
  suggestedCf: number | null
}

/** An author's requirement verdict (DESIGN §3.3, §6). */
export interface RequireResult {
  key: RequirementKey
  kind: 'require'
  /** SI limit. */
  limit: number
  /** SI value; null when it does not exist (e.g. no crossover). */
  value: number | null
  met: boolean
}

/** Physical limits checked on every stage (DESIGN §4.6). */
export const LIMIT_KEYS = ['output-swing', 'input-common-mode', 'slew', 'output-current'] as const
export type LimitKey = (typeof LIMIT_KEYS)[number]

/** A [low, high] pair; a side that is not checked (no data for that rail) is null. */
export type Bounds = [number | null, number | null]

/** A physical-limit verdict (DESIGN §4.6). */
export type LimitResult =
  | {
      key: 'output-swing' | 'input-common-mode'
      kind: 'limit'
      /** [low, high] of the output (or of the input pins) over the input range, V. */
      value: [number, number]
      /** Allowed [low, high], V; null when no rail is checked. */
      limit: Bounds | null
      /** null when skipped (no data). */
      met: boolean | null
      /** Keys that would enable the check (or its unchecked rail). */
      missing: string[]
    }
  | {
      key: 'slew'
      kind: 'limit'
      /** Slew rate needed, 2π·fsig·A, V/s. */
      value: number
      /** The part's slew rate, V/s; null when not entered. */
      limit: number | null
      met: boolean | null
      missing: string[]
      /** Signal frequency used, Hz. */
      signalFrequency: number
      /** Half the output span, V. */
      amplitude: number
      /** Full-power bandwidth slew/(2πA), Hz; null without a slew rate or without a span. */
      fullPowerBandwidth: number | null
    }
  | {
      key: 'output-current'
      kind: 'limit'
      /** Largest |current out of the op-amp's output pin| over the input range, A. */
      value: number
      /** `iout-max`, A; null when not entered. */
      limit: number | null
      met: boolean | null
      missing: string[]
    }

/** One row of the verdicts: an author's requirement or a physical limit. */
export type RequirementResult = RequireResult | LimitResult

/** True for an author's requirement row. */
export const isRequire = (r: RequirementResult): r is RequireResult => r.kind === 'require'

/** Frequency-domain curves for the report's charts (not part of the JSON contract). */
export interface StageCurves {
  /** Frequencies of the noise grid inside the band, Hz, ascending. */
  noiseFrequency: number[]
  /** Output noise density per contributor on `noiseFrequency`, V/√Hz. */
  noiseDensity: Record<NoiseKey, number[]>
  /** Total output noise density on `noiseFrequency` at the full-scale signal, V/√Hz. */
  noiseTotal: number[]
  /** Total output noise density without `shot-signal` (zero signal), V/√Hz; equals `noiseTotal` without that source. */
  noiseTotalZeroSignal: number[]
  /** Cumulative output rms from fL up to each frequency of `noiseFrequency`, V. */
  cumulativeRms: number[]
  /** Frequencies of the loop-gain / closed-loop grid, Hz, ascending. */
  frequency: number[]
  /** |T(f)|, V/V. */
  loopGainMagnitude: number[]
  /** ∠T(f), degrees, unwrapped from DC. */
  loopGainPhase: number[]
  /** |H(f)| signal gain (V/V, or Ω for transimpedance). */
  closedLoopMagnitude: number[]
  /** ∠H(f), degrees, unwrapped from DC (the low-pass response chart). */
  closedLoopPhase: number[]
}

/** Output operating point and swing check (DESIGN §4.1, §4.6). */
export interface SwingCheck {
  /** Output at the input range ends, [min, max], V. */
  outputSpan: [number, number]
  /** Allowed output [min, max] = rails at the low end of supply-tolerance less headroom, V (a rail without headroom data: that rail). */
  allowed: [number, number]
  /** How far the span exceeds the allowed range (V, ≥ 0) at the low and high ends. */
  excess: [number, number]
  fits: boolean
}

/** Bias currents used by the DC budget, after the temperature rules of §4.2. */
export interface BiasUsed {
  ibMax: number
  iosMax: number
  /** How each was found. */
  ibSource: 'ib-max' | 'doubling' | 'datasheet-25C'
  iosSource: 'ios-max' | 'doubling' | 'datasheet-25C'
  /** True when the range leaves 25 °C and no ib-max was entered for a bipolar/zero-drift part without ib-doubling. */
  overTemperatureMissing: boolean
  /** Dark current over the range (transimpedance), A: idark-max, or the doubling rule. */
  idarkMax: number
  idarkSource: 'idark-max' | 'doubling'
}

/** Low-pass figures from the solved response (DESIGN §8.4). */
export interface FilterFigures {
  /** Where the phase of H(f)/H(0) passes −90°, Hz; null when it never does in the span. */
  f0: number | null
  /** |H(f0)/H(0)|; null with f0. */
  q: number | null
  /** H(0), signed, V/V. */
  passbandGain: number
}

export interface StageResult {
  id: string
  topology: Topology
  /** The op-amp block id or archetype name. */
  opamp: string
  /** Signed signal gain at DC: V/V, or V/A (Ω) for transimpedance. */
  gain: number
  /** DC noise gain, V/V. */
  noiseGain: number
  dc: DcBudget
  noise: NoiseBudget
  stability: Stability
  /** Low-pass stages only; null for other topologies (DESIGN §8.4). */
  filter: FilterFigures | null
  requirements: RequirementResult[]
  /** Report-only. */
  curves: StageCurves
  /** Report-only. */
  swing: SwingCheck
  /** Report-only. */
  bias: BiasUsed
  /** Monte Carlo over the DC budget (DESIGN §8.7); null when off. */
  yield: YieldResult | null
}
