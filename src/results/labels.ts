/**
 * People's names for the engine's keys, as printed in tables, charts and the cover.
 * Closed maps over the engine's key unions, so a new key without a label fails to compile.
 */
import type {DcKey, InputType, LimitKey, NoiseKey, RequirementKey, Topology} from '../engine/types.js'

export const DC_LABELS: Record<DcKey, string> = {
  vos: 'Offset voltage',
  'vos-drift': 'Offset drift',
  ib: 'Bias current × resistance mismatch',
  ios: 'Offset current',
  idark: 'Source dark current',
  cmrr: 'Common-mode rejection',
  psrr: 'Supply rejection',
  'aol-gain': 'Finite open-loop gain',
  'gain-error': 'Gain error of the part',
  nonlinearity: 'Gain nonlinearity',
  'resistor-tolerance': 'Resistor tolerance',
  'resistor-tempco': 'Resistor tempco'
}

export const NOISE_LABELS: Record<NoiseKey, string> = {
  en: 'Op-amp voltage noise',
  'en-in': 'Input-stage voltage noise',
  'en-out': 'Output-stage voltage noise',
  'in+': 'Current noise, + input',
  'in-': 'Current noise, − input',
  'r:rf': 'Thermal noise of rf',
  'r:rg': 'Thermal noise of rg',
  'r:rs': 'Thermal noise of rs',
  'r:rcomp': 'Thermal noise of rcomp',
  'r:rshunt': 'Thermal noise of rshunt',
  'r:rp': 'Thermal noise of rp',
  'r:rref': 'Thermal noise of rref',
  'r:r1': 'Thermal noise of r1',
  'r:r2': 'Thermal noise of r2',
  'r:r3': 'Thermal noise of r3',
  'r:riso': 'Thermal noise of riso',
  'r:rload': 'Thermal noise of rload',
  shot: 'Shot noise of source dark current',
  'shot-signal': 'Shot noise of signal current (full scale)'
}

export const REQUIREMENT_LABELS: Record<RequirementKey, string> = {
  'output-error': 'DC error at output, worst case',
  'output-error-rss': 'DC error at output, RSS',
  'input-error': 'DC error referred to input, worst case',
  'noise-rms': 'Output noise, rms over band',
  'noise-pp': 'Output noise, peak-to-peak',
  'phase-margin': 'Phase margin (minimum)',
  bandwidth: 'Closed-loop bandwidth (minimum)',
  'output-error-calibrated': 'DC error at output after calibration, worst case',
  'input-error-calibrated': 'DC error referred to input after calibration, worst case',
  yield: 'Yield of the DC requirements, Monte Carlo (minimum)'
}

export const LIMIT_LABELS: Record<LimitKey, string> = {
  'output-swing': 'Output swing',
  'input-common-mode': 'Input common-mode range',
  slew: 'Slew rate needed',
  'output-current': 'Output current'
}

export const TOPOLOGY_LABELS: Record<Topology, string> = {
  noninverting: 'Non-inverting amplifier',
  inverting: 'Inverting amplifier',
  follower: 'Voltage follower',
  transimpedance: 'Transimpedance amplifier',
  difference: 'Difference amplifier',
  'lowpass-sallen-key': 'Sallen-Key low-pass filter',
  'lowpass-mfb': 'Multiple-feedback low-pass filter',
  instrumentation: 'Instrumentation amplifier'
}

/** Input technologies (DESIGN §3.2), as the trade writes them. */
export const INPUT_TYPE_LABELS: Record<InputType, string> = {
  bipolar: 'bipolar',
  'bipolar-cancelled': 'bias-cancelled bipolar',
  jfet: 'JFET',
  cmos: 'CMOS',
  'zero-drift': 'zero-drift'
}

/** Unit of the stage's input quantity: A for transimpedance, V otherwise. */
export const inputUnit = (t: Topology): 'A' | 'V' => (t === 'transimpedance' ? 'A' : 'V')

/** Unit of the signal gain: Ω (V/A) for transimpedance, V/V otherwise. */
export const gainUnit = (t: Topology): string => (t === 'transimpedance' ? 'Ω' : 'V/V')

/** Unit a requirement's value is printed in. */
export const requirementUnit = (key: RequirementKey, t: Topology): string => {
  switch (key) {
    case 'phase-margin':
      return '°'
    case 'yield':
      return '%'
    case 'bandwidth':
      return 'Hz'
    case 'input-error':
    case 'input-error-calibrated':
      return inputUnit(t)
    case 'output-error-calibrated':
    case 'output-error':
    case 'output-error-rss':
    case 'noise-rms':
    case 'noise-pp':
      return 'V'
  }
}

/** Names of the Monte Carlo's random variables (DESIGN §8.7), as in the variance-share chart. */
const YIELD_VARIABLE_LABELS: Record<string, string> = {
  vos: 'Offset voltage (vos)',
  'vos-drift': 'Offset drift (vos-drift)',
  ib: 'Bias current (ib)',
  ios: 'Offset current (ios)',
  idark: 'Dark current (idark)',
  cmrr: 'Common-mode rejection (1/CMRR)',
  psrr: 'Supply rejection (1/PSRR)',
  supply: 'Supply deviation',
  // An instrumentation amplifier's (DESIGN §8.2) and a converter's (§8.5) variables.
  'vos-in': 'Input offset voltage (vos-in)',
  'vos-out': 'Output offset voltage (vos-out)',
  'vos-in-drift': 'Input offset drift (vos-in-drift)',
  'vos-out-drift': 'Output offset drift (vos-out-drift)',
  'gain-error': 'Gain error',
  'gain-drift': 'Gain drift',
  nonlinearity: 'Gain nonlinearity',
  offset: 'Offset',
  'offset-drift': 'Offset drift',
  inl: 'Integral nonlinearity (INL)'
}

/** The label of a Monte Carlo variable: `rf:tolerance` → "rf tolerance". */
export const yieldVariableLabel = (name: string): string => {
  const known = YIELD_VARIABLE_LABELS[name]
  if (known !== undefined) return known
  const [part, what] = name.split(':')
  return what === undefined ? name : `${part} ${what}`
}
