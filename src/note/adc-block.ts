/**
 * An `adc` block from its fields to `AdcParams` (DESIGN §8.5), driven by `ADC_KEYS`.
 * Required: bits, input. Values in `LSB` (noise, offset, offset-drift; inl is always LSB)
 * are turned into volts with the block's own LSB = span / 2^bits once both are read.
 * Any error in the block makes the result null.
 */
import type {Point} from 'unist'
import type {AdcParams} from '../engine/chain/types.js'
import {readQuantity} from '../units/index.js'
import type {Field} from './block-yaml.js'
import {chainMessages} from './chain-messages.js'
import {ADC_BLOCK_KEYS, ADC_KEYS, isAdcKey, type AdcKey} from './converter-keys.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {noteMessages} from './messages.js'
import type {DefaultedValue} from './types.js'
import {quantityOf, rangeOf} from './values.js'

export interface AdcContext {
  id: string
  idAt: Point
  where: string
  broken: boolean
  report: Reporter
}

export interface BuiltAdc {
  adc: AdcParams | null
  defaulted: DefaultedValue[]
}

/** Build a converter from its fields (see module header). */
export function buildAdc(fields: readonly Field[], ctx: AdcContext): BuiltAdc {
  const {report} = ctx
  const errorsBefore = report.errors
  const given = new Set<string>()
  const values: Partial<Record<AdcKey, {value: number; lsb: boolean}>> = {}
  let input: [number, number] | null = null
  for (const field of fields) {
    given.add(field.key)
    if (field.key === 'input') {
      const r = rangeOf(field, 'voltage', report, 'from-zero')
      if (r === null) continue
      if (!(r.value[1] > r.value[0])) report.error(chainMessages.adcInputEmpty(r.s.text.trim()), r.s.at(0), 'bad-value')
      else input = r.value
      continue
    }
    if (!isAdcKey(field.key)) {
      const suggestion = didYouMean(field.key, ADC_BLOCK_KEYS)
      report.error(noteMessages.unknownKey(field.key, ctx.where, 'an adc', suggestion, null), field.keyAt, 'unknown-key', {
        actual: field.key, ...(suggestion ? {expected: [suggestion]} : {})
      })
      continue
    }
    const spec = ADC_KEYS[field.key]
    const q = quantityOf(field, spec.dim, report)
    if (q === null) continue
    const text = q.s.text.trim()
    if (field.key === 'bits') {
      if (!Number.isInteger(q.value) || q.value < 1 || q.value > 32) {
        report.error(chainMessages.bitsNotInteger(text), q.s.at(0), 'bad-value')
        continue
      }
    } else if (q.value < 0) {
      report.error(noteMessages.negative(field.key, text, 'a value'), q.s.at(0), 'bad-value')
      continue
    } else if (field.key === 'sample-rate' && q.value === 0) {
      report.error(noteMessages.notPositive(field.key, text, 'a sample rate'), q.s.at(0), 'bad-value')
      continue
    }
    const how = readQuantity(text, spec.dim)
    const lsb = spec.dim !== 'lsb' && how.ok && how.unit.startsWith('LSB')
    values[field.key] = {value: q.value, lsb}
  }
  const defaulted: DefaultedValue[] = []
  for (const key of ADC_BLOCK_KEYS) {
    if (given.has(key)) continue
    const spec = isAdcKey(key) ? ADC_KEYS[key] : null
    if (spec === null || spec.need === 'required') {
      if (!ctx.broken) report.error(noteMessages.missingKey(key, ctx.where, 'in every adc block'), ctx.idAt, 'missing-key')
    } else defaulted.push({key, value: spec.need.default})
  }
  const bits = values.bits?.value
  if (report.errors > errorsBefore || input === null || bits === undefined) return {adc: null, defaulted}
  const lsbSize = (input[1] - input[0]) / 2 ** bits
  const volts = (key: AdcKey): number => {
    const v = values[key]
    return v === undefined ? 0 : v.lsb ? v.value * lsbSize : v.value
  }
  const adc: AdcParams = {
    name: ctx.id, archetype: false, bits, input,
    noise: volts('noise'), offset: volts('offset'), offsetDrift: volts('offset-drift'),
    gainError: volts('gain-error'), gainDrift: volts('gain-drift'), inl: values.inl?.value ?? 0,
    sampleRate: values['sample-rate']?.value ?? null
  }
  return {adc, defaulted}
}
