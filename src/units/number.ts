/**
 * The number at the start of a quantity: decimal with optional exponent (`1.2e-6`), or the
 * IEC 60062 RKM code where the letter stands for the decimal point (`4k7`, `R47`, `1M0`,
 * `2R2`, `4n7`). Only used by `parse.ts`; the unit after the number is resolved there.
 */
import {dimensionSpec, prefixesOf, type Dimension} from './dimensions.js'
import {unitsMessages} from './messages.js'

/** A number read from the start of a text. */
export type NumberReading =
  | {ok: true; value: number; /** Index just after the number. */ end: number; /** True for RKM code. */ rkm: boolean}
  | {ok: false; message: string; offset: number}

const DECIMAL = /^(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+\-−]?\d+)?/
const NON_FINITE = /^(?:nan|inf(?:inity)?)(?![a-z])/i
const escapeClass = (letters: string): string => letters.replace(/[\]\\^-]/g, '\\$&')

/** The power of ten an RKM letter stands for on this dimension (`R` is 0). */
function rkmExp(letter: string, dim: Dimension): number {
  if (letter === 'R') return 0
  return prefixesOf(dim)[letter] ?? 0
}

/**
 * Read the number at the start of `text` (which has no leading whitespace).
 * @param where
 *   Phrase naming the key for messages (" for `rf`"), or "".
 */
export function readNumber(text: string, dim: Dimension, where: string): NumberReading {
  let i = 0
  let sign = 1
  const first = text.charAt(0)
  if (first === '+' || first === '-' || first === '−') {
    sign = first === '+' ? 1 : -1
    i = 1
  }
  const body = text.slice(i)
  if (NON_FINITE.test(body)) return {ok: false, message: unitsMessages.nonFinite(text.split(/\s/)[0] ?? text, where, dim), offset: 0}

  const letters = dimensionSpec(dim).rkm
  if (letters !== '') {
    const cls = escapeClass(letters)
    // Digits, letter, digits: `4k7`, `2R2`, `1M0`; or letter first: `R47`.
    const rkm = new RegExp(`^(\\d*)([${cls}])(\\d+)(?![\\d.,])`).exec(body)
    if (rkm && (rkm[1] !== '' || rkm[2] === 'R' || dim === 'capacitance')) {
      const [whole, int = '', letter = '', frac = ''] = rkm
      const value = sign * Number(`${int === '' ? '0' : int}.${frac}e${rkmExp(letter, dim)}`)
      return {ok: true, value, end: i + whole.length, rkm: true}
    }
  }

  const match = DECIMAL.exec(body)
  if (!match) {
    const found = text.split(/\s/)[0] ?? text
    return {ok: false, message: unitsMessages.noNumber(found, dim, where), offset: 0}
  }
  const end = i + match[0].length
  if (text.charAt(end) === ',' && /\d/.test(text.charAt(end + 1))) {
    const found = text.split(/\s/)[0] ?? text
    return {ok: false, message: unitsMessages.comma(found, found.replace(',', '.'), where), offset: end}
  }
  const value = sign * Number(match[0].replace('−', '-'))
  if (!Number.isFinite(value)) {
    return {ok: false, message: unitsMessages.nonFinite(text.slice(0, end), where, dim), offset: 0}
  }
  // `1e-400` reads as 0 although it was not written as zero.
  if (value === 0 && /[1-9]/.test(match[0].replace(/[eE].*$/, ''))) {
    return {ok: false, message: unitsMessages.outOfRange(text.slice(0, end), dim, where, 'underflow'), offset: 0}
  }
  return {ok: true, value, end, rkm: false}
}
