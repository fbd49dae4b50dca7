/**
 * Reading one field's value with the quantity grammar of `src/units`, reporting problems
 * at the value's place (the offset the grammar gives, mapped into the Markdown file).
 * Each reader returns null after reporting; the caller goes on with the next key.
 */
import type {Point} from 'unist'
import {
  DIMENSIONS, parseQuantity, parseRange, parseResistor, parseSupply,
  type Dimension, type RangeOptions, type ResistorResult
} from '../units/index.js'
import type {Field} from './block-yaml.js'
import {describeValue} from './block-yaml.js'
import type {Reporter} from './diagnostics.js'
import {noteMessages} from './messages.js'
import {didYouMean} from './did-you-mean.js'

/** A scalar's text with its place mapper. */
export interface ScalarText {
  text: string
  at: (offset: number) => Point
}

/** The field's text, or null after reporting a list, map or empty value. */
export function scalarOf(field: Field, expected: string, report: Reporter): ScalarText | null {
  const v = field.value
  if (v.type !== 'scalar') {
    report.error(noteMessages.notScalar(field.key, describeValue(v)), v.at, 'bad-value')
    return null
  }
  if (v.text === null || v.text.trim() === '') {
    report.error(noteMessages.emptyValue(field.key, expected), v.at(0), 'bad-value')
    return null
  }
  return {text: v.text, at: v.at}
}

const expectedOf = (dim: Dimension): string => DIMENSIONS[dim].label

type Parsed<T> = {ok: true; value: T; warning?: {message: string; offset: number}} | {ok: false; message: string; offset: number}

function read<T>(field: Field, expected: string, report: Reporter, parse: (text: string) => Parsed<T>): {value: T; s: ScalarText} | null {
  const s = scalarOf(field, expected, report)
  if (s === null) return null
  const r = parse(s.text)
  if (!r.ok) {
    report.error(r.message, s.at(r.offset), 'bad-value')
    return null
  }
  if (r.warning) report.warn(r.warning.message, s.at(r.warning.offset), 'suspicious-value')
  return {value: r.value, s}
}

/** A single quantity in SI. */
export function quantityOf(field: Field, dim: Dimension, report: Reporter): {value: number; s: ScalarText} | null {
  return read(field, expectedOf(dim), report, (t) => parseQuantity(t, dim, {key: field.key}))
}

/** A range `[low, high]` in SI. */
export function rangeOf(field: Field, dim: Dimension, report: Reporter, single: RangeOptions['single']): {value: [number, number]; s: ScalarText} | null {
  const options: RangeOptions = single === undefined ? {key: field.key} : {key: field.key, single}
  return read(field, `a range of ${expectedOf(dim).replace(/^an? /, '')}`, report, (t) => parseRange(t, dim, options))
}

/** A noise band `[fL, fH]`, Hz: a range that starts above 0 Hz and is not empty (null after an error). */
export function bandOf(field: Field, report: Reporter): [number, number] | null {
  const r = rangeOf(field, 'frequency', report, 'from-zero')
  if (r === null) return null
  if (r.value[0] <= 0) report.error(noteMessages.bandFromZero(), r.s.at(0), 'bad-value')
  else if (r.value[0] === r.value[1]) report.error(noteMessages.bandEmpty(r.s.text.trim()), r.s.at(0), 'bad-value')
  else return r.value
  return null
}

/** A supply `[negative, positive]`, V. */
export function supplyOf(field: Field, report: Reporter): {value: [number, number]; s: ScalarText} | null {
  return read(field, 'a supply (`±15 V`, `0 .. 5 V`)', report, (t) => parseSupply(t, {key: field.key}))
}

/** A resistor spec, with how it was written. */
export function resistorOf(field: Field, report: Reporter): {value: Extract<ResistorResult, {ok: true}>; s: ScalarText} | null {
  return read(field, 'a resistor (`49.9k 0.1% 25ppm/K`)', report, (t) => {
    const r = parseResistor(t, {key: field.key})
    return r.ok ? {ok: true, value: r} : r
  })
}

/**
 * A capacitor spec `value [tolerance]` (DESIGN §8.4): the last word is the tolerance when it
 * ends in `%` or `ppm`, the rest the capacitance.
 */
export function capacitorOf(field: Field, report: Reporter): {value: {value: number; tolerance: number; defaulted: boolean}; s: ScalarText} | null {
  return read(field, 'a capacitor (`10 nF 5%`)', report, (t) => {
    const m = /^(.*\S)\s+(±?)(\S+)\s*$/.exec(t)
    const tolText = m !== null && /(%|ppm)$/.test(m[3]) ? m[3] : null
    const valueText = tolText === null || m === null ? t : m[1]
    const v = parseQuantity(valueText, 'capacitance', {key: field.key})
    if (!v.ok) return v
    if (tolText === null || m === null) {
      return {ok: true, value: {value: v.value, tolerance: 0, defaulted: true as boolean}}
    }
    const at = t.lastIndexOf(tolText)
    const tol = parseQuantity(tolText, 'fraction', {key: field.key})
    if (!tol.ok) return {...tol, offset: tol.offset + at}
    if (tol.value < 0 || tol.value >= 1) return {ok: false, message: noteMessages.capacitorExtra(tolText), offset: at}
    return {ok: true, value: {value: v.value, tolerance: tol.value, defaulted: false}}
  })
}

/** One of a closed set of words, with a did-you-mean hint. */
export function choiceOf<T extends string>(field: Field, choices: readonly T[], report: Reporter): T | null {
  const s = scalarOf(field, `one of ${choices.join(', ')}`, report)
  if (s === null) return null
  const word = s.text.trim()
  const found = choices.find((c) => c === word)
  if (found !== undefined) return found
  const suggestion = didYouMean(word, choices)
  report.error(noteMessages.unknownChoice(field.key, word, choices, suggestion), s.at(0), 'bad-value', {
    actual: word,
    expected: suggestion === null ? [...choices] : [suggestion]
  })
  return null
}
