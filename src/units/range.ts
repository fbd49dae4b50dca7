/**
 * Ranges and supplies (DESIGN §3.1): `a .. b unit`, `a unit .. b unit`, a single value, and
 * a symmetric `±10 mV` (the trade writes a range so, on every range key), and supplies `±15 V`,
 * `+-15 V`, `0 .. 5 V`, `-5 .. 12 V`, `5 V`. An end without a unit takes
 * the other end's unit (`0.1 .. 1k Hz` is 0.1 Hz to 1 kHz; `-10m .. 10m V` is ±10 mV).
 * `…` (U+2026), as the formatter prints it, is accepted in place of `..`.
 */
import type {Dimension} from './dimensions.js'
import {unitsMessages} from './messages.js'
import {readQuantity, type QuantityOptions, type QuantityReading} from './parse.js'

/** How a single value is read where a range is expected. */
export type SingleValueRule =
  /** `x` means `0 .. x` (or `x .. 0` for negative x). */
  | 'from-zero'
  /** `x` means `x .. x` (temperature). */
  | 'point'

export interface RangeOptions extends QuantityOptions {
  /** Default 'from-zero' (DESIGN §3.1; `temperature` uses 'point'). */
  single?: SingleValueRule
}

/** A range `[low, high]` in SI, or a message and 0-based offset. */
export type RangeResult =
  | {ok: true; value: [number, number]; /** True when written as one value. */ single: boolean
    /** Set when the range reads, but perhaps not as meant (a prefix written on one end only). */
    warning?: {message: string; offset: number}}
  | {ok: false; message: string; offset: number}

const SEPARATOR = /\s+(?:\.\.|…)\s+/g
const whereOf = (key: string | undefined): string => (key === undefined ? '' : ` for \`${key}\``)
const shift = (r: {message: string; offset: number}, by: number) => ({ok: false as const, message: r.message, offset: r.offset + by})

/** Read both ends, each borrowing the other's unit when it has none. */
function readEnds(left: string, right: string, dim: Dimension, options: QuantityOptions): [QuantityReading, QuantityReading] {
  const base = {...(options.key === undefined ? {} : {key: options.key})}
  const l0 = readQuantity(left, dim, base)
  const r0 = readQuantity(right, dim, base)
  const l = r0.ok && r0.unit !== '' ? readQuantity(left, dim, {...base, borrowUnit: r0.unit}) : l0
  const r = l0.ok && l0.unit !== '' ? readQuantity(right, dim, {...base, borrowUnit: l0.unit}) : r0
  return [l, r]
}

/**
 * Parse a range of dimension `dim` to SI `[low, high]`.
 * @param text
 *   E.g. `-40 .. 85 °C`, `0.1 .. 1k Hz`, `-10 mV .. 10 mV`, or a single value.
 */
export function parseRange(text: string, dim: Dimension, options: RangeOptions = {}): RangeResult {
  const where = whereOf(options.key)
  const lead = text.length - text.trimStart().length
  const pm = /^(?:±|\+\/-|\+-)\s*/.exec(text.trimStart())
  if (pm) {
    // `±x` is `-x .. x`.
    const restStart = lead + pm[0].length
    const rest = text.slice(restStart)
    if (rest.trim() === '') return {ok: false, message: unitsMessages.loneSign(where), offset: lead}
    const q = readQuantity(rest, dim, options)
    if (!q.ok) return shift(q, restStart)
    if (!(q.value > 0)) return {ok: false, message: unitsMessages.supplyMagnitude(rest.trim(), where), offset: restStart}
    return {ok: true, value: [-q.value, q.value], single: false}
  }
  const seps = [...text.matchAll(SEPARATOR)]
  if (seps.length > 1) return {ok: false, message: unitsMessages.rangeTooMany(where), offset: seps[1]?.index ?? 0}
  const sep = seps[0]
  if (sep === undefined) {
    const tight = /\.\.|…/.exec(text)
    if (tight) {
      const fixed = text.trim().replace(/\s*(\.\.|…)\s*/, ' .. ')
      return {ok: false, message: unitsMessages.rangeNoSpaces(text.trim(), fixed, where), offset: tight.index}
    }
    const one = readQuantity(text, dim, options)
    if (!one.ok) return one
    const v = one.value
    const value: [number, number] = options.single === 'point' ? [v, v] : [Math.min(0, v), Math.max(0, v)]
    return {ok: true, value, single: true}
  }
  const left = text.slice(0, sep.index)
  const rightStart = sep.index + sep[0].length
  const right = text.slice(rightStart)
  const [l, r] = readEnds(left, right, dim, options)
  if (!l.ok) return l
  if (!r.ok) return shift(r, rightStart)
  if (l.value > r.value) {
    // `1 .. 2 pF`: the left end borrowed `F` but not the `p`, so it reads as 1 F. The prefix
    // stays with its number (`0.1 .. 1k Hz`), which is easy to forget: say so.
    const own = readQuantity(left, dim, options.key === undefined ? {} : {key: options.key})
    if (own.ok && own.unit === '' && own.prefix === '' && r.prefix !== '' && !r.rkm) {
      const fixed = `${left.trim()} ${r.prefix}${r.unit} .. ${right.trim()}`
      return {ok: false, message: unitsMessages.rangePrefixNotShared(text.trim(), r.prefix, r.unit, fixed, where), offset: text.length - text.trimStart().length}
    }
    const fixed = `${right.trim()} .. ${left.trim()}`
    return {ok: false, message: unitsMessages.rangeReversed(text.trim(), fixed, where), offset: text.length - text.trimStart().length}
  }
  // `10 .. 100 kHz` reads as 10 Hz .. 100 kHz: valid, and sometimes meant, but say so. A
  // prefix written on the number (`0.1 .. 1k Hz`) is plainly that end's own: no warning.
  const own = readQuantity(left, dim, options.key === undefined ? {} : {key: options.key})
  const gluedToUnit = r.prefix !== '' && right.trimEnd().endsWith(`${r.prefix}${r.unit}`)
  if (own.ok && own.unit === '' && own.prefix === '' && l.value !== 0 && gluedToUnit && !r.rkm) {
    const meant = `${left.trim()} ${r.prefix}${r.unit} .. ${right.trim()}`
    return {ok: true, value: [l.value, r.value], single: false,
      warning: {message: unitsMessages.rangePrefixOneEnd(text.trim(), r.prefix, r.unit, meant, where), offset: text.length - text.trimStart().length}}
  }
  return {ok: true, value: [l.value, r.value], single: false}
}

/** A supply `[negative rail, positive rail]`, V, or a message and 0-based offset. */
export type SupplyResult = {ok: true; value: [number, number]} | {ok: false; message: string; offset: number}

/**
 * Parse a supply (DESIGN §3.1): `±15 V`, `+-15 V`, `0 .. 5 V`, `-5 .. 12 V`, or `5 V`
 * (= `0 .. 5 V`). The rails must differ.
 */
export function parseSupply(text: string, options: QuantityOptions = {}): SupplyResult {
  const where = whereOf(options.key)
  const lead = text.length - text.trimStart().length
  const pm = /^(?:±|\+\/-|\+-)\s*/.exec(text.trimStart())
  if (pm) {
    const restStart = lead + pm[0].length
    const rest = text.slice(restStart)
    if (rest.trim() === '') return {ok: false, message: unitsMessages.loneSign(where), offset: lead}
    const q = readQuantity(rest, 'voltage', options)
    if (!q.ok) return shift(q, restStart)
    if (!(q.value > 0)) return {ok: false, message: unitsMessages.supplyMagnitude(rest.trim(), where), offset: restStart}
    return {ok: true, value: [-q.value, q.value]}
  }
  const r = parseRange(text, 'voltage', {...options, single: 'from-zero'})
  if (!r.ok) return r
  if (r.value[0] === r.value[1]) return {ok: false, message: unitsMessages.supplyEmpty(text.trim(), where), offset: lead}
  return {ok: true, value: r.value}
}
