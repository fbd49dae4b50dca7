/**
 * Echoing the author's inputs: the value as written, with the author's prefix kept, a space
 * between number and unit ("0V" → "0 V") and the unit added where the note leaves it to the
 * key ("2.2p" on a capacitance → "2.2 pF", "1M" on a resistance → "1 MΩ"). `u` is written
 * as the micro sign. Nothing else of the text changes (RKM codes such as `4k7` stay).
 */
import {OPAMP_KEYS, STAGE_KEYS, isStageKey} from '../note/keys.js'
import {INA_KEYS} from '../note/ina-block.js'
import {ADC_KEYS} from '../note/converter-keys.js'
import {DIMENSIONS, type Dimension} from '../units/index.js'

const NUMBER = String.raw`[+\-−]?\d+(?:\.\d+)?(?:[eE][+\-]?\d+)?`
const PREFIX = '[fpnuµμmkKMGT]'
/** Unit symbols a number may be glued to in a note. */
const UNIT_AFTER = String.raw`(?:V\/√Hz|A\/√Hz|V\/K|V\/us|V\/µs|V\/s|Hz|V|A|F|Ω|ohms?|°C|dB|deg|ppm|%)`

const micro = (p: string, dim: Dimension | null): string => (p === 'u' || p === 'μ' ? 'µ' : p === 'K' && dim === 'resistance' ? 'k' : p)

/** The dimension a key's value is written in, when it is one quantity (or a resistor). */
export function dimensionOfKey(key: string, block: 'stage' | 'opamp'): Dimension | null {
  if (block === 'opamp') {
    // An opamp block, or an ina block (its keys are the instrumentation amplifier's).
    const spec = (OPAMP_KEYS as Record<string, {dim: Dimension} | undefined>)[key] ?? (INA_KEYS as Record<string, {dim: Dimension} | undefined>)[key]
    return spec?.dim ?? null
  }
  // An adc block's keys are echoed with the stage-side reader.
  if (!isStageKey(key)) return (ADC_KEYS as Record<string, {dim: Dimension} | undefined>)[key]?.dim ?? null
  const read = STAGE_KEYS[key].read as {kind: string; dim?: Dimension}
  if (read.kind === 'resistor' || read.kind === 'shunt') return 'resistance'
  if (read.kind === 'quantity' && read.dim !== undefined) return read.dim
  return null
}

/** `raw` as it should be echoed for a value of dimension `dim` (null: spacing only). */
export function echoValue(raw: string, dim: Dimension | null): string {
  let text = raw.trim()
  // A space between a number and its (prefixed) unit.
  text = text.replace(new RegExp(`(\\d)(${PREFIX}?)(${UNIT_AFTER})(?![A-Za-z])`, 'g'), (_m, d: string, p: string, u: string) => `${d} ${micro(p, dim)}${u}`)
  text = text.replace(new RegExp(`(\\d) (${PREFIX})(${UNIT_AFTER})`, 'g'), (_m, d: string, p: string, u: string) => `${d} ${micro(p, dim)}${u}`)
  // The per-microsecond of a slew rate is written with the micro sign too ("0.5 V/us" → "0.5 V/µs").
  text = text.replace(/V\/us(?![A-Za-z])/g, 'V/µs')
  if (dim === null) return rangeUnits(text)
  const spec = DIMENSIONS[dim]
  const first = spec?.units[0]
  if (spec === undefined || first === undefined || !first.prefixed) return text
  // A bare number or number-with-prefix token, not followed by a unit token: the key's unit added.
  const bare = new RegExp(`^(\\(?)(${NUMBER})(${PREFIX}?)([,)]?)$`)
  // "10 k" is "10k": a prefix standing alone belongs to the number before it.
  const tokens = text.replace(new RegExp(`(\\d) (${PREFIX})(?=[\\s,)]|$)`, 'g'), '$1$2').split(/(\s+)/)
  return tokens.map((t, i) => {
    const m = bare.exec(t)
    if (m === null) return t
    const next = tokens[i + 2] ?? ''
    if (UNIT_TOKEN.test(next)) return t
    return `${m[1]}${m[2]} ${micro(m[3] ?? '', dim)}${spec.si}${m[4]}`
  }).join('')
}

/** A token that is a unit (with or without prefix): the number before it already has one. */
const UNIT_TOKEN = new RegExp(`^${PREFIX}?(?:${UNIT_AFTER}|R\\b|°)`)

/**
 * A range or supply written with prefixes and one unit at the end ("-10m .. 10m V"): every
 * prefixed number gets the unit ("-10 mV .. 10 mV"); the author's prefixes and `..` stay.
 */
function rangeUnits(text: string): string {
  const end = new RegExp(`(${NUMBER})(${PREFIX})\\s+(V|A|Hz|°C|K)$`).exec(text)
  if (end === null) return text
  const unit = end[3] as string
  return text.replace(new RegExp(`(${NUMBER})(${PREFIX})(?=\\s|$)`, 'g'), (_m, n: string, p: string) => `${n} ${micro(p, null)}${unit}`)
    .replace(new RegExp(`\\s+${unit}$`), '')
}
