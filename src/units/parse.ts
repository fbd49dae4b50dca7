/**
 * The quantity grammar of DESIGN §3.1 for single values: a number (decimal or RKM code), an
 * optional SI prefix and an optional unit of the key's dimension, converted to SI.
 *
 * Ranges, supplies and resistor specs build on `readQuantity` in `range.ts` and
 * `resistor.ts`. Nothing here knows about notes or positions beyond a 0-based offset.
 */
import {
  DIMENSION_NAMES, WRONG_CASE_PREFIXES, dimensionSpec, prefixesOf, timesPow10,
  type Dimension, type UnitSpec
} from './dimensions.js'
import {readNumber} from './number.js'
import {unitsMessages} from './messages.js'

/** Result of `parseQuantity`: an SI value, or a message and the 0-based offset of the problem. */
export type QuantityResult = {ok: true; value: number} | {ok: false; message: string; offset: number}

/** Result of `readQuantity`: `QuantityResult` plus how the value was written. */
export type QuantityReading =
  | {
      ok: true
      /** SI value (°C for temperatures, linear V/V for dB). */
      value: number
      /** The SI prefix as written (`k`, `µ`, `K` on a resistance), '' when none. */
      prefix: string
      /** The unit symbol as written (`kΩ` gives `Ω`), '' for a bare number. */
      unit: string
      /** True when written in RKM code (`4k7`). */
      rkm: boolean
    }
  | {ok: false; message: string; offset: number}

export interface QuantityOptions {
  /** Key name for messages: errors then read "… for `rf`, expected …". (optional) */
  key?: string
  /** Unit symbol to use when the text has none (the other end of a range). (optional) */
  borrowUnit?: string
}

interface Resolved {
  unit: UnitSpec
  prefix: string
  /** Power of ten of the prefix. */
  exp: number
  symbol: string
}

/** Largest magnitude accepted, in SI units (linear for dB): 10^18. */
export const MAX_MAGNITUDE = 1e18
/** Smallest non-zero magnitude accepted, in SI units (linear for dB): 10^-24. */
export const MIN_MAGNITUDE = 1e-24

const findSymbol = (dim: Dimension, symbol: string): UnitSpec | undefined =>
  dimensionSpec(dim).units.find((u) => u.symbols.includes(symbol))

/** Resolve the text after the number (`kΩ`, `k Hz`, `m`, ``) on a dimension. */
function lookup(rest: string, dim: Dimension): Resolved | null {
  const natural = dimensionSpec(dim).units[0]
  if (natural === undefined) return null
  const prefixes = prefixesOf(dim)
  if (rest === '') return {unit: natural, prefix: '', exp: 0, symbol: ''}
  const parts = rest.split(/\s+/)
  if (parts.length === 2) {
    const [p = '', s = ''] = parts
    const unit = findSymbol(dim, s)
    // Own keys only: `1 constructor Ω` must not find Object.prototype's members.
    const exp = Object.hasOwn(prefixes, p) ? prefixes[p] : undefined
    return unit?.prefixed && exp !== undefined ? {unit, prefix: p, exp, symbol: s} : null
  }
  if (parts.length > 2) return null
  const exact = findSymbol(dim, rest)
  if (exact) return {unit: exact, prefix: '', exp: 0, symbol: rest}
  for (const [p, exp] of Object.entries(prefixes)) {
    if (!rest.startsWith(p)) continue
    const s = rest.slice(p.length)
    const unit = s === '' ? natural : findSymbol(dim, s)
    if (unit?.prefixed) return {unit, prefix: p, exp, symbol: s}
  }
  return null
}

/** Explain why `rest` is not a unit of `dim`. */
function unitProblem(rest: string, dim: Dimension, where: string): string {
  const single = !/\s/.test(rest)
  for (const p of Object.keys(prefixesOf(dim))) {
    const s = rest.slice(p.length)
    if (single && rest.startsWith(p) && (s === '' || findSymbol(dim, s))) {
      return unitsMessages.prefixNotAllowed(rest, dim, where)
    }
  }
  // `LSB` is a converter's own unit (DESIGN §8.5): legal only on converter keys.
  if (/^LSBs?(\/|$)/.test(rest) && !dimensionSpec(dim).units.some((u) => u.symbols.includes('LSB'))) {
    return unitsMessages.lsbNotHere(rest, dim, where)
  }
  const meant = WRONG_CASE_PREFIXES[rest.charAt(0)]
  if (meant !== undefined && lookup(meant + rest.slice(1), dim)) {
    return unitsMessages.wrongCase(rest.charAt(0), meant, rest, where)
  }
  for (const other of DIMENSION_NAMES) {
    if (other === dim) continue
    const r = lookup(rest, other)
    if (r && r.symbol !== '') return unitsMessages.wrongDimension(rest, other, dim, where)
  }
  return unitsMessages.unknownUnit(rest, dim, where)
}

const whereOf = (key: string | undefined): string => (key === undefined ? '' : ` for \`${key}\``)

/** Read one value with its prefix and unit (see `QuantityReading`). */
export function readQuantity(text: string, dim: Dimension, options: QuantityOptions = {}): QuantityReading {
  const where = whereOf(options.key)
  const lead = text.length - text.trimStart().length
  const body = text.trim()
  if (body === '') return {ok: false, message: unitsMessages.empty(dim, where), offset: 0}
  const pm = /^(?:±|\+\/-|\+-)\s*/.exec(body)
  if (pm) {
    const message = pm[0].length === body.length ? unitsMessages.loneSign(where) : unitsMessages.plusMinus(where)
    return {ok: false, message, offset: lead}
  }
  const dots = /\.\.|…/.exec(body)
  if (dots) return {ok: false, message: unitsMessages.rangeInSingle(where, dim), offset: lead + dots.index}

  const num = readNumber(body, dim, where)
  if (!num.ok) return {...num, offset: lead + num.offset}
  const restStart = num.end + (body.slice(num.end).length - body.slice(num.end).trimStart().length)
  let rest = body.slice(restStart)
  const borrow = options.borrowUnit
  if (borrow !== undefined && borrow !== '') {
    const bare = lookup(rest, dim)
    if (bare && bare.symbol === '') rest = `${rest}${borrow}`
  }
  const resolved = lookup(rest, dim)
  if (!resolved) return {ok: false, message: unitProblem(rest, dim, where), offset: lead + restStart}
  if (num.rkm && resolved.prefix !== '') {
    return {ok: false, message: unitsMessages.rkmWithPrefix(body.slice(0, num.end), rest, where), offset: lead + restStart}
  }
  const {unit, exp, prefix, symbol} = resolved
  const scaled = unit.decibel ? 10 ** (num.value / 20) : timesPow10(num.value, exp + unit.exp)
  // A finite number can still leave the double range once its prefix or dB is applied
  // (`1e308 T`, `7000 dB`), or vanish to 0 (`1e-320 f`, `-7000 dB`): refuse both rather
  // than hand on ∞ or a 0 that was not written.
  // A bare number on a dB key is dB (DESIGN §3.1); a linear ratio written bare (`cmrr: 1e6`)
  // reads as an absurd number of dB: say how it was read and what was probably meant.
  if (unit.decibel && symbol === '' && num.value > 0 && (!Number.isFinite(scaled) || Math.abs(scaled) > MAX_MAGNITUDE)) {
    return {ok: false, message: unitsMessages.bareDecibel(body, 20 * Math.log10(num.value), where), offset: lead}
  }
  if (!Number.isFinite(scaled)) {
    return {ok: false, message: unitsMessages.outOfRange(body, dim, where, 'overflow'), offset: lead}
  }
  if (scaled === 0 && (num.value !== 0 || unit.decibel === true)) {
    return {ok: false, message: unitsMessages.outOfRange(body, dim, where, 'underflow'), offset: lead}
  }
  // Past 10^18 in SI (exa), or below 10^-24 (yocto) but not zero, no quantity of a stage is
  // physical, and such values only overflow the engine later (a sum of squares going to ∞;
  // the thermal noise current 4kT/R of a 1e-160 Ω resistor): refuse them where written.
  if (Math.abs(scaled) > MAX_MAGNITUDE) {
    return {ok: false, message: unitsMessages.beyondPhysical(body, dim, where), offset: lead}
  }
  if (scaled !== 0 && Math.abs(scaled) < MIN_MAGNITUDE) {
    return {ok: false, message: unitsMessages.belowPhysical(body, dim, where), offset: lead}
  }
  const value = scaled + (unit.offset ?? 0)
  if (dim === 'temperature' && value < -273.15) {
    return {ok: false, message: unitsMessages.belowAbsoluteZero(body, where), offset: lead}
  }
  return {ok: true, value, prefix, unit: symbol, rkm: num.rkm}
}

/**
 * Parse one quantity of dimension `dim` to SI (DESIGN §3.1). A bare number is read in the
 * dimension's natural unit (Ω, F, V, A, Hz, °C, V/√Hz, A/√Hz, V/K, dB, fraction, 1/K, °, V/s).
 * @param text
 *   The value as written, e.g. `49.9 kΩ`, `4k7`, `130 dB`.
 * @returns
 *   The SI value, or a message and the 0-based offset in `text` of the problem.
 */
export function parseQuantity(text: string, dim: Dimension, options: QuantityOptions = {}): QuantityResult {
  const r = readQuantity(text, dim, options)
  return r.ok ? {ok: true, value: r.value} : r
}
