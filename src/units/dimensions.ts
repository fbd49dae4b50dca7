/**
 * The dimension table of the quantity grammar (DESIGN §3.1): for each dimension a note key
 * can have, the unit symbols it accepts, their power of ten to SI, and whether prefixes apply.
 *
 * The first unit of each dimension is its natural unit: a bare number is read in it, and a
 * bare prefix (`49.9k`, `2p`) is allowed only when that unit takes prefixes. Parsing is in
 * `parse.ts`; this module holds data only.
 */

/** One unit a dimension accepts. */
export interface UnitSpec {
  /** Spellings, all equivalent; the first is the canonical one. */
  readonly symbols: readonly string[]
  /** Power of ten to SI: the SI value is number × 10^exp (ignored when `decibel`). */
  readonly exp: number
  /** Added after scaling (kelvin to °C: −273.15). Default 0. */
  readonly offset?: number
  /** True when SI prefixes may stand in front of the symbol. */
  readonly prefixed: boolean
  /** True for dB: the SI value is 10^(x/20) (a voltage ratio). */
  readonly decibel?: boolean
}

/** One dimension: how people name it and which units it takes. */
export interface DimensionSpec {
  /** Name with article, for messages: "a resistance". */
  readonly label: string
  /** SI unit shown in messages and used by the formatter. */
  readonly si: string
  /** A typical value, for "e.g." hints in messages. */
  readonly example: string
  readonly units: readonly UnitSpec[]
  /** Letters that may stand for the decimal point (IEC 60062 RKM code); empty when none. */
  readonly rkm: string
}

/**
 * SI prefixes as powers of ten, case-sensitive (DESIGN §3.1). Both micro signs and `u` are
 * accepted. Powers rather than factors, so that `60 uV` is 60 / 10^6, correctly rounded.
 */
export const PREFIXES = {
  f: -15, p: -12, n: -9, u: -6, 'µ': -6, 'μ': -6, m: -3,
  k: 3, M: 6, G: 9, T: 12
} as const
export type Prefix = keyof typeof PREFIXES

/** The one trade exception: on a resistance a bare `K` means kilo (`10K`, `4K7`). */
export const RESISTANCE_EXTRA_PREFIXES = {K: 3} as const

/** Prefix letters written in the wrong case, and the one that was probably meant. */
export const WRONG_CASE_PREFIXES: Readonly<Record<string, Prefix>> = {K: 'k', g: 'G', t: 'T', P: 'p', N: 'n', U: 'u', F: 'f'}

const TEMP = ['°C', '℃', 'degC', 'C']
const RT_HZ = ['√Hz', 'rtHz', 'sqrt(Hz)', '√(Hz)']
const perRootHz = (base: string): string[] => RT_HZ.map((r) => `${base}/${r}`)
const perKelvin = (base: string): string[] => ['K', ...TEMP].map((t) => `${base}/${t}`)

export const DIMENSIONS = {
  resistance: {
    label: 'a resistance', si: 'Ω', example: '4.7 kΩ', rkm: 'RkKMG',
    units: [
      {symbols: ['Ω', 'Ω', 'ohm', 'ohms'], exp: 0, prefixed: true},
      {symbols: ['R'], exp: 0, prefixed: false}
    ]
  },
  capacitance: {
    label: 'a capacitance', si: 'F', example: '2.2 pF', rkm: 'pnuµμm',
    units: [{symbols: ['F'], exp: 0, prefixed: true}]
  },
  voltage: {label: 'a voltage', si: 'V', example: '2.5 mV', rkm: '', units: [{symbols: ['V'], exp: 0, prefixed: true}]},
  current: {label: 'a current', si: 'A', example: '2 nA', rkm: '', units: [{symbols: ['A'], exp: 0, prefixed: true}]},
  frequency: {label: 'a frequency', si: 'Hz', example: '1 kHz', rkm: '', units: [{symbols: ['Hz'], exp: 0, prefixed: true}]},
  temperature: {
    label: 'a temperature', si: '°C', example: '25 °C', rkm: '',
    units: [
      {symbols: TEMP, exp: 0, prefixed: false},
      {symbols: ['K'], exp: 0, offset: -273.15, prefixed: false}
    ]
  },
  'temperature-interval': {
    label: 'a temperature interval', si: 'K', example: '10 K', rkm: '',
    units: [{symbols: ['K', ...TEMP], exp: 0, prefixed: false}]
  },
  'voltage-density': {
    label: 'a voltage noise density', si: 'V/√Hz', example: '8 nV/√Hz', rkm: '',
    units: [{symbols: perRootHz('V'), exp: 0, prefixed: true}]
  },
  'current-density': {
    label: 'a current noise density', si: 'A/√Hz', example: '0.2 pA/√Hz', rkm: '',
    units: [{symbols: perRootHz('A'), exp: 0, prefixed: true}]
  },
  drift: {label: 'a voltage drift', si: 'V/K', example: '0.6 µV/K', rkm: '', units: [{symbols: perKelvin('V'), exp: 0, prefixed: true}]},
  'ratio-db': {
    label: 'a ratio in dB', si: 'dB', example: '120 dB', rkm: '',
    units: [
      {symbols: ['dB'], exp: 0, prefixed: false, decibel: true},
      {symbols: ['V/V'], exp: 0, prefixed: true}
    ]
  },
  fraction: {
    label: 'a fraction', si: '%', example: '0.1 %', rkm: '',
    units: [
      {symbols: [''], exp: 0, prefixed: false},
      {symbols: ['%'], exp: -2, prefixed: false},
      {symbols: ['ppm'], exp: -6, prefixed: false}
    ]
  },
  tempco: {
    label: 'a temperature coefficient', si: '1/K', example: '25 ppm/K', rkm: '',
    units: [
      {symbols: ['1/K', '/K'], exp: 0, prefixed: false},
      {symbols: perKelvin('ppm'), exp: -6, prefixed: false},
      {symbols: perKelvin('%'), exp: -2, prefixed: false}
    ]
  },
  angle: {label: 'an angle', si: '°', example: '60 deg', rkm: '', units: [{symbols: ['deg', '°'], exp: 0, prefixed: false}]},
  // Converter keys only (DESIGN §8.5): a voltage, or a count of LSB that the adc block turns
  // into volts with its own LSB = span / 2^bits. No other dimension knows `LSB`.
  'converter-voltage': {
    label: 'a converter voltage (V or LSB)', si: 'V', example: '0.5 LSB', rkm: '',
    units: [
      {symbols: ['V'], exp: 0, prefixed: true},
      {symbols: ['LSB', 'LSBs'], exp: 0, prefixed: false}
    ]
  },
  'converter-drift': {
    label: 'a converter drift (V/K or LSB/K)', si: 'V/K', example: '0.1 LSB/K', rkm: '',
    units: [
      {symbols: perKelvin('V'), exp: 0, prefixed: true},
      {symbols: perKelvin('LSB'), exp: 0, prefixed: false}
    ]
  },
  /** A count of LSB: a bare number is LSB (`inl`, `error-lsb`). */
  lsb: {label: 'a number of LSB', si: 'LSB', example: '2 LSB', rkm: '', units: [{symbols: ['LSB', 'LSBs', ''], exp: 0, prefixed: false}]},
  /** A count of bits (`bits`, `noise-free-bits`, `effective-bits`). */
  bits: {label: 'a number of bits', si: 'bits', example: '17 bits', rkm: '', units: [{symbols: ['', 'bits', 'bit'], exp: 0, prefixed: false}]},
  /** A sampling rate: Hz or samples per second. */
  'sample-rate': {
    label: 'a sample rate', si: 'Hz', example: '1 MS/s', rkm: '',
    units: [{symbols: ['Hz'], exp: 0, prefixed: true}, {symbols: ['S/s', 'SPS', 'sps'], exp: 0, prefixed: true}]
  },
  slew: {
    label: 'a slew rate', si: 'V/s', example: '0.5 V/µs', rkm: '',
    units: [
      {symbols: ['V/s'], exp: 0, prefixed: true},
      {symbols: ['V/us', 'V/µs', 'V/μs'], exp: 6, prefixed: true},
      {symbols: ['V/ms'], exp: 3, prefixed: true},
      {symbols: ['V/ns'], exp: 9, prefixed: true}
    ]
  }
} as const satisfies Record<string, DimensionSpec>

export type Dimension = keyof typeof DIMENSIONS
export const DIMENSION_NAMES = Object.keys(DIMENSIONS) as Dimension[]
export const isDimension = (s: string): s is Dimension => s in DIMENSIONS

/** The spec of a dimension, widened to the interface (for code that loops over units). */
export const dimensionSpec = (dim: Dimension): DimensionSpec => DIMENSIONS[dim]

/** Prefixes valid on a dimension, as powers of ten (resistance adds `K`). */
export function prefixesOf(dim: Dimension): Readonly<Record<string, number>> {
  return dim === 'resistance' ? {...PREFIXES, ...RESISTANCE_EXTRA_PREFIXES} : PREFIXES
}

/** x × 10^exp with one correctly rounded operation (division for negative powers). */
export const timesPow10 = (x: number, exp: number): number => (exp >= 0 ? x * 10 ** exp : x / 10 ** -exp)
