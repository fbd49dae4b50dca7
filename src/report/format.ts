/**
 * Number formatting for the report: SI-prefixed quantities from src/units, plus the few
 * report-only forms (shares, dB, degrees, verdict words).
 */
import {formatFixed, formatQuantity, outOfRange} from '../units/format.js'
import type {Verdict} from './types.js'

/** SI-prefixed value with unit, or an em dash for a value that does not exist. */
export const q = (value: number | null, unit: string, digits = 3): string =>
  value === null || !Number.isFinite(value) ? '—' : formatQuantity(value, unit, {digits})

/** A fraction as a percentage with one decimal, e.g. 0.1234 → "12.3 %". */
export const pct = (fraction: number): string => `${(fraction * 100).toFixed(1)} %`

/** Degrees with one decimal, or an em dash. */
export const deg = (value: number | null): string => (value === null ? '—' : `${formatFixed(value, {decimals: 1})}°`)

/** Decibels with one decimal. */
export const db = (value: number): string => `${value.toFixed(1)} dB`

/** The verdict word with its mark, so that it never depends on colour. */
export const verdictText = (v: Verdict): string =>
  v === 'met' ? '✓ met' : v === 'not-met' ? '✗ NOT MET' : '– not evaluated'

const PREFIXES: Record<number, string> = {[-15]: 'f', [-12]: 'p', [-9]: 'n', [-6]: 'µ', [-3]: 'm', 0: '', 3: 'k', 6: 'M', 9: 'G', 12: 'T'}

/** The SI prefix exponent `formatQuantity` gives `value` (a multiple of 3, −15 … 12). */
function prefixExponent(value: number, digits: number): number {
  let exp = Math.max(-15, Math.min(12, Math.floor(Math.log10(Math.abs(value)) / 3) * 3))
  if (Math.abs(Number((value / 10 ** exp).toPrecision(digits))) >= 1000 && exp < 12) exp += 3
  return exp
}

/** Most decimals a column value gets; a value that would need more keeps its own prefix. */
const MAX_DECIMALS = 7

/**
 * A table column of one quantity: every value in the SI prefix of the column's largest
 * magnitude, each to `digits` significant digits, trailing zeros kept ("2.70 mV" beside
 * "0.550 mV"), so that the eye compares like with like ("227 µV", "4.45 µV",
 * "0.00453 µV"); zero is "0"; null is an
 * em dash. A value too small to print in that prefix within seven decimals, or outside
 * the printable magnitudes, keeps its own (`formatQuantity`).
 */
export function column(values: readonly (number | null)[], unit: string, digits = 3): string[] {
  const finite = values.filter((v): v is number => v !== null && Number.isFinite(v) && v !== 0 && !outOfRange(v))
  if (finite.length === 0) return values.map((v) => q(v, unit, digits))
  const largest = finite.reduce((a, v) => (Math.abs(v) > Math.abs(a) ? v : a))
  const exp = prefixExponent(largest, digits)
  const prefixed = `${PREFIXES[exp] ?? ''}${unit}`
  const withUnit = (num: string): string => (prefixed === '' ? num : `${num} ${prefixed}`)
  return values.map((v) => {
    if (v === null || !Number.isFinite(v) || outOfRange(v)) return q(v, unit, digits)
    if (v === 0) return withUnit('0')
    const m = Number((exp >= 0 ? v / 10 ** exp : v * 10 ** -exp).toPrecision(digits))
    const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(Math.abs(m))))
    if (decimals > MAX_DECIMALS) return q(v, unit, digits)
    // Trailing zeros kept here, unlike elsewhere: the column reads to the same digits.
    return withUnit(m.toFixed(decimals).replace(/^-/, '−'))
  })
}
