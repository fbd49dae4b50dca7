/**
 * Resistor specs (DESIGN §3.1): `value [tolerance] [tempco]`, parts in any order after the
 * value, each part allowed a space before its unit and a leading `±`:
 * `49.9k 0.1% 25ppm/K`, `4.7 kΩ 25 ppm/°C ±1 %`. A missing part is 0 and reported as
 * defaulted. A bare number after the value is refused: it could be either part.
 */
import {unitsMessages} from './messages.js'
import {readQuantity, type QuantityOptions} from './parse.js'

/** A resistor in SI; the same shape as the engine's `Resistor` (units imports nothing of ours). */
export interface ResistorSpec {
  /** Resistance, Ω. */
  value: number
  /** Tolerance, fraction (0.001 = 0.1 %); 0 when not written. */
  tolerance: number
  /** Temperature coefficient, 1/K (25e-6 = 25 ppm/K); 0 when not written. */
  tempco: number
}

/** A parsed resistor with how it was written, or a message and 0-based offset. */
export type ResistorResult =
  | {
      ok: true
      value: ResistorSpec
      /** The parts that were not written (and so are 0). */
      defaulted: ('tolerance' | 'tempco')[]
      /** The SI prefix of the value as written ('' when none), for the "did you mean M?" check. */
      prefix: string
      /** The unit symbol as written after the value ('' for a bare number or RKM code). */
      unit: string
      /** True when the text had a tolerance or a tempco (used to refuse them on `rshunt`). */
      hasParts: boolean
      /** 0-based offset of the first tolerance or tempco part, when there is one. */
      partsOffset: number
    }
  | {ok: false; message: string; offset: number}

interface Group {
  text: string
  start: number
}

/** Split into groups: a new group starts at each token that begins like a number. */
function groupsOf(text: string): Group[] {
  const groups: Group[] = []
  for (const m of text.matchAll(/\S+/g)) {
    const token = m[0]
    const last = groups[groups.length - 1]
    if (last === undefined || /^[\d+\-−±.]/.test(token)) groups.push({text: token, start: m.index})
    else last.text = text.slice(last.start, m.index + token.length)
  }
  return groups
}

const whereOf = (key: string | undefined): string => (key === undefined ? '' : ` for \`${key}\``)

/**
 * Parse a resistor spec to SI (`value` Ω, `tolerance` fraction, `tempco` 1/K).
 * Negative or zero values are returned as read: range checks belong to the caller.
 */
export function parseResistor(text: string, options: QuantityOptions = {}): ResistorResult {
  const where = whereOf(options.key)
  const groups = groupsOf(text)
  const [first, ...parts] = groups
  if (first === undefined) return {ok: false, message: unitsMessages.empty('resistance', where), offset: 0}
  const value = readQuantity(first.text, 'resistance', options)
  if (!value.ok) return {...value, offset: value.offset + first.start}
  let tolerance: number | null = null
  let tempco: number | null = null
  for (const g of parts) {
    const signed = g.text.startsWith('±')
    const body = signed ? g.text.slice(1) : g.text
    const at = g.start + (signed ? 1 : 0)
    const part = /\/|ppm\s*\//.test(body) ? 'tempco' : /%|ppm/.test(body) ? 'tolerance' : null
    if (part === null) return {ok: false, message: unitsMessages.resistorExtra(g.text, where), offset: g.start}
    const q = readQuantity(body, part === 'tempco' ? 'tempco' : 'fraction', options)
    if (!q.ok) return {...q, offset: q.offset + at}
    if (q.value < 0) return {ok: false, message: unitsMessages.negativePart(part, g.text, where), offset: g.start}
    if (part === 'tolerance' && q.value >= 1) return {ok: false, message: unitsMessages.toleranceTooLarge(g.text, where), offset: g.start}
    if ((part === 'tolerance' ? tolerance : tempco) !== null) {
      return {ok: false, message: unitsMessages.resistorTwice(part, g.text, where), offset: g.start}
    }
    if (part === 'tolerance') tolerance = q.value
    else tempco = q.value
  }
  const defaulted: ('tolerance' | 'tempco')[] = []
  if (tolerance === null) defaulted.push('tolerance')
  if (tempco === null) defaulted.push('tempco')
  return {
    ok: true,
    value: {value: value.value, tolerance: tolerance ?? 0, tempco: tempco ?? 0},
    defaulted,
    prefix: value.prefix,
    unit: value.unit,
    hasParts: parts.length > 0,
    partsOffset: parts[0]?.start ?? text.length
  }
}
