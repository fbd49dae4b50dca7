/**
 * Formatting quantities for people: SI-prefix engineering notation (`49.9 kΩ`, `2.5 mV`),
 * percent, dB, degrees, tempco and ranges (`−40 … 85 °C`). The report prints every number
 * through these, so the look of numbers is decided here once.
 *
 * Conventions (our decisions): 3 significant digits by default with trailing zeros dropped
 * (`2.5 mV`, not `2.50 mV`); the minus sign is U+2212; micro is U+00B5; a normal space
 * separates number and unit, except the degree sign of an angle (`60°`; the SI Brochure,
 * 9th ed., writes plane-angle degrees without a space — from memory); zero prints as `0 V`; NaN prints as `—`, ±∞ as `∞ V`.
 */

export interface FormatOptions {
  /** Significant digits (default 3). */
  digits?: number
}

export interface FixedOptions {
  /** Digits after the decimal point, trailing zeros dropped (default 1). */
  decimals?: number
}

const STEPS = [
  [-15, 'f'], [-12, 'p'], [-9, 'n'], [-6, 'µ'], [-3, 'm'], [0, ''], [3, 'k'], [6, 'M'], [9, 'G'], [12, 'T']
] as const

const MINUS = '−'
const sign = (text: string): string => text.replace(/^-/, MINUS)
const join = (num: string, unit: string): string => (unit === '' ? num : unit === '°' ? `${num}°` : `${num} ${unit}`)
const scaleBy = (value: number, exp: number): number => (exp >= 0 ? value / 10 ** exp : value * 10 ** -exp)
const roundSig = (x: number, digits: number): number => Number(x.toPrecision(Math.max(1, Math.min(21, digits))))

function special(value: number, unit: string): string | null {
  if (Number.isNaN(value)) return '—'
  if (!Number.isFinite(value)) return join(value < 0 ? `${MINUS}∞` : '∞', unit)
  return null
}

/**
 * Magnitudes the SI prefixes of the report cover, fT … 999 T (a mantissa from 0.001 f up):
 * a value outside them is no everyday quantity — it comes from an implausible input — and
 * prints in plain scientific form with the unit itself, flagged: `1.01 × 10²⁸ V ⚠`.
 */
const IN_RANGE = {low: 1e-18, high: 1e15}
/** The flag after an out-of-range value. */
export const OUT_OF_RANGE_FLAG = '⚠'

const SUPERSCRIPT: Record<string, string> = {'-': '⁻', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹'}

/** `value` as `m × 10ⁿ` (m to `digits` significant digits), e.g. `−5.46 × 10²⁷`. */
export function formatScientific(value: number, opts: FormatOptions = {}): string {
  const s = special(value, '')
  if (s !== null) return s
  if (value === 0) return '0'
  let exp = Math.floor(Math.log10(Math.abs(value)))
  let mantissa = roundSig(value / 10 ** exp, opts.digits ?? 3)
  if (Math.abs(mantissa) >= 10) { exp += 1; mantissa = roundSig(value / 10 ** exp, opts.digits ?? 3) }
  return `${sign(String(mantissa))} × 10${String(exp).split('').map((c) => SUPERSCRIPT[c] ?? c).join('')}`
}

/** Whether a finite, non-zero value lies outside the magnitudes the report prints with prefixes. */
export const outOfRange = (value: number): boolean =>
  Number.isFinite(value) && value !== 0 && (Math.abs(value) >= IN_RANGE.high || Math.abs(value) < IN_RANGE.low)

/** A plain number to `digits` significant digits, no exponent for everyday sizes, U+2212 minus. */
export function formatNumber(value: number, opts: FormatOptions = {}): string {
  const s = special(value, '')
  if (s !== null) return s
  if (value === 0) return '0'
  if (outOfRange(value)) return `${formatScientific(value, opts)} ${OUT_OF_RANGE_FLAG}`
  const rounded = roundSig(value, opts.digits ?? 3)
  // JavaScript writes 1e21 and up, and below 1e-6, with an exponent: never shown as such.
  if (Math.abs(rounded) >= 1e21 || Math.abs(rounded) < 1e-6) return formatScientific(value, opts)
  return sign(String(rounded))
}

/** A number rounded to a fixed count of decimals with trailing zeros dropped. */
export function formatFixed(value: number, opts: FixedOptions = {}): string {
  const s = special(value, '')
  if (s !== null) return s
  const d = Math.max(0, Math.min(20, opts.decimals ?? 1))
  const text = String(Number(value.toFixed(d)))
  return text === '-0' ? '0' : sign(text)
}

/**
 * A value in engineering notation with an SI prefix: `formatQuantity(49900, 'Ω')` is
 * `49.9 kΩ`, `formatQuantity(-0.0025, 'V')` is `−2.5 mV`.
 * @param unit
 *   Unit symbol without prefix (`Ω`, `V`, `Hz`, `V/√Hz`); '' for none.
 */
export function formatQuantity(value: number, unit: string, opts: FormatOptions = {}): string {
  const s = special(value, unit)
  if (s !== null) return s
  if (value === 0) return join('0', unit)
  if (outOfRange(value)) return `${join(formatScientific(value, opts), unit)} ${OUT_OF_RANGE_FLAG}`
  const digits = opts.digits ?? 3
  let exp = Math.max(-15, Math.min(12, Math.floor(Math.log10(Math.abs(value)) / 3) * 3))
  let mantissa = roundSig(scaleBy(value, exp), digits)
  if (Math.abs(mantissa) >= 1000 && exp < 12) {
    exp += 3
    mantissa = roundSig(scaleBy(value, exp), digits)
  }
  const prefix = STEPS.find(([e]) => e === exp)?.[1] ?? ''
  return join(sign(String(mantissa)), `${prefix}${unit}`)
}

/** A fraction as percent: `formatPercent(0.001)` is `0.1 %`; beyond 10⁶ % (or below 10⁻⁶ %) scientific and flagged. */
export function formatPercent(fraction: number, opts: FormatOptions = {}): string {
  const pct = fraction * 100
  if (Number.isFinite(pct) && pct !== 0 && (Math.abs(pct) >= 1e6 || Math.abs(pct) < 1e-6)) {
    return `${join(formatScientific(pct, opts), '%')} ${OUT_OF_RANGE_FLAG}`
  }
  return join(formatNumber(pct, opts), '%')
}

/** A linear ratio in dB, 20·lg: `formatDb(1e6)` is `120 dB`. */
export function formatDb(linear: number, opts: FixedOptions = {}): string {
  return join(formatFixed(20 * Math.log10(linear), opts), 'dB')
}

/** An angle in degrees: `formatAngle(59.84)` is `59.8°`. */
export function formatAngle(degrees: number, opts: FixedOptions = {}): string {
  return join(formatFixed(degrees, opts), '°')
}

/** A temperature in °C: `formatTemperature(-40)` is `−40 °C`. */
export function formatTemperature(celsius: number, opts: FixedOptions = {}): string {
  return join(formatFixed(celsius, opts), '°C')
}

/** A temperature coefficient, 1/K, in ppm/K: `formatTempco(25e-6)` is `25 ppm/K`. */
export function formatTempco(perKelvin: number, opts: FormatOptions = {}): string {
  return join(formatNumber(perKelvin * 1e6, opts), 'ppm/K')
}

/**
 * Enough significant digits (from `digits`, at most 7) that two different ends of a range
 * print differently: 2.499 … 2.501 V, never "2.5 … 2.5 V".
 */
export function distinctDigits(low: number, high: number, unit: string, digits = 3): number {
  let d = digits
  while (low !== high && d < 7 && formatQuantity(low, unit, {digits: d}) === formatQuantity(high, unit, {digits: d})) d++
  return d
}

/**
 * A range with the unit once where both ends share it: `−10 … 10 mV`, `0 … 10 kHz`,
 * `100 mHz … 10 kHz`.
 */
export function formatRange(low: number, high: number, unit: string, opts: FormatOptions = {}): string {
  const digits = distinctDigits(low, high, unit, opts.digits ?? 3)
  opts = {...opts, digits}
  const hi = formatQuantity(high, unit, opts)
  if (low === 0 && unit !== '') return `0 … ${hi}`
  const lo = formatQuantity(low, unit, opts)
  const suffix = (t: string): string => t.slice(t.indexOf(' '))
  if (lo.includes(' ') && suffix(lo) === suffix(hi)) return `${lo.slice(0, lo.indexOf(' '))} … ${hi}`
  return `${lo} … ${hi}`
}

/** A temperature range in °C: `formatTemperatureRange(-40, 85)` is `−40 … 85 °C`. */
export function formatTemperatureRange(low: number, high: number, opts: FixedOptions = {}): string {
  return `${formatFixed(low, opts)} … ${formatTemperature(high, opts)}`
}

/**
 * A slew rate, V/s, in V/µs as datasheets and engineers write it: `formatSlew(2e6)` is
 * `2 V/µs`, `formatSlew(5e5)` is `0.5 V/µs`. Below 0.01 V/µs (the slew a slow signal needs)
 * per second, as engineers write that (`formatSlew(25.1)` is `25.1 V/s`, `formatSlew(62.8e-3)`
 * is `62.8 mV/s`), never a string of zeros or "nV/µs". The JSON stays in V/s.
 */
export function formatSlew(voltsPerSecond: number, opts: FormatOptions = {}): string {
  const s = special(voltsPerSecond, 'V/µs')
  if (s !== null) return s
  const perMicro = voltsPerSecond * 1e-6
  if (perMicro === 0) return join('0', 'V/µs')
  if (outOfRange(voltsPerSecond)) return `${join(formatScientific(perMicro, opts), 'V/µs')} ${OUT_OF_RANGE_FLAG}`
  if (Math.abs(perMicro) >= 0.01) return join(formatNumber(perMicro, opts), 'V/µs')
  return formatQuantity(voltsPerSecond, 'V/s', opts)
}
