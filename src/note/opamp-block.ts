/**
 * An `opamp` block from its fields to `OpampParams` (DESIGN §3.2), driven by `OPAMP_KEYS`.
 * Required: input-type, vos, ib, ios, en, in, gbw, aol, pm-unity, cmrr, psrr. Zero when not
 * given (and listed as defaulted): vos-drift, en-corner, in-corner, cin-diff, cin-cm. Null
 * ("not entered", listed too): ib-max, ios-max, ib-doubling, vcm-ref, slew, swing-headroom
 * (and -neg/-pos), cm-headroom (and -neg/-pos), iout-max, rout (DESIGN §4.6: a limit without
 * its data is skipped, never checked against a flattering 0).
 * Any error in the block makes the result null.
 */
import type {Point} from 'unist'
import {INPUT_TYPES, type InputType, type OpampParams} from '../engine/types.js'
import {DIMENSIONS, formatQuantity} from '../units/index.js'
import type {Field} from './block-yaml.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {OPAMP_BLOCK_KEYS, OPAMP_KEYS, isOpampKey, isStageKey, type OpampKey} from './keys.js'
import {noteMessages} from './messages.js'
import type {DefaultedValue} from './types.js'
import {choiceOf, quantityOf} from './values.js'

export interface OpampContext {
  id: string
  idAt: Point
  where: string
  broken: boolean
  report: Reporter
}

export interface BuiltOpamp {
  opamp: OpampParams | null
  defaulted: DefaultedValue[]
}

/** What a value not entered means, for the list of defaults. */
const NOT_ENTERED: Partial<Record<OpampKey, string>> = {
  'ib-max': 'not entered (ib, or the doubling rule for FET/CMOS inputs)',
  'ios-max': 'not entered (ios, or the doubling rule for FET/CMOS inputs)',
  'ib-doubling': 'not entered (10 K for jfet and cmos inputs)',
  'vcm-ref': 'not entered (the supply midpoint)',
  slew: 'not entered (the slew limit is skipped)',
  'swing-headroom': 'not entered (the output-swing limit is skipped unless -neg/-pos are given)',
  'swing-headroom-neg': 'not entered (swing-headroom)',
  'swing-headroom-pos': 'not entered (swing-headroom)',
  'cm-headroom': 'not entered (the input-common-mode limit is skipped unless -neg/-pos are given)',
  'cm-headroom-neg': 'not entered (cm-headroom)',
  'cm-headroom-pos': 'not entered (cm-headroom)',
  'iout-max': 'not entered (the output-current limit is skipped)',
  rout: 'not entered (0 Ω)'
}

type OpampKeyField = (typeof OPAMP_KEYS)[OpampKey]['field']

function readValue(field: Field, key: OpampKey, report: Reporter): number | null {
  const spec = OPAMP_KEYS[key]
  const q = quantityOf(field, spec.dim, report)
  if (q === null) return null
  const text = q.s.text.trim()
  const what = DIMENSIONS[spec.dim].label
  let problem: string | null = null
  if (key === 'pm-unity' && !(q.value > 0 && q.value <= 90)) problem = noteMessages.pmOutOfRange(text)
  else if (spec.sign !== 'any' && q.value < 0) problem = noteMessages.negative(key, text, what)
  else if (spec.sign === 'positive' && spec.dim === 'ratio-db' && !(q.value > 1)) problem = noteMessages.notAboveZeroDb(key, text)
  else if (spec.sign === 'positive' && q.value === 0) problem = noteMessages.notPositive(key, text, what)
  if (problem === null) return q.value
  report.error(problem, q.s.at(0), 'bad-value')
  return null
}

/** Build an op-amp from its fields (see module header). */
export function buildOpamp(fields: readonly Field[], ctx: OpampContext): BuiltOpamp {
  const {report} = ctx
  const errorsBefore = report.errors
  const values: Partial<Record<OpampKeyField, number>> = {}
  const given = new Set<string>()
  let inputType: InputType | null = null
  for (const field of fields) {
    given.add(field.key)
    if (field.key === 'input-type') {
      inputType = choiceOf(field, INPUT_TYPES, report)
      continue
    }
    if (!isOpampKey(field.key)) {
      const inStage = isStageKey(field.key)
      const suggestion = inStage ? null : didYouMean(field.key, OPAMP_BLOCK_KEYS)
      report.error(noteMessages.unknownKey(field.key, ctx.where, 'an opamp', suggestion, inStage ? 'a stage block' : null), field.keyAt, 'unknown-key', {
        actual: field.key, ...(suggestion ? {expected: [suggestion]} : {})
      })
      continue
    }
    const v = readValue(field, field.key, report)
    if (v !== null) values[OPAMP_KEYS[field.key].field] = v
  }

  const defaulted: DefaultedValue[] = []
  for (const key of OPAMP_BLOCK_KEYS) {
    if (given.has(key)) continue
    const spec = isOpampKey(key) ? OPAMP_KEYS[key] : null
    if (spec === null || spec.need === 'required') {
      if (!ctx.broken) report.error(noteMessages.missingKey(key, ctx.where, 'in every opamp block'), ctx.idAt, 'missing-key')
    } else if (spec.need === 'zero') {
      defaulted.push({key, value: formatQuantity(0, DIMENSIONS[spec.dim].si)})
    } else {
      defaulted.push({key, value: NOT_ENTERED[key as OpampKey] ?? 'not entered'})
    }
  }
  if (report.errors > errorsBefore || inputType === null) return {opamp: null, defaulted}
  const num = (f: OpampKeyField): number => values[f] ?? 0
  const opt = (f: OpampKeyField): number | null => values[f] ?? null
  const opamp: OpampParams = {
    name: ctx.id, archetype: false, inputType,
    vos: num('vos'), vosDrift: num('vosDrift'), ib: num('ib'), ios: num('ios'),
    ibMax: opt('ibMax'), iosMax: opt('iosMax'), ibDoubling: opt('ibDoubling'),
    en: num('en'), enCorner: num('enCorner'), in: num('in'), inCorner: num('inCorner'),
    gbw: num('gbw'), aol: num('aol'), pmUnity: num('pmUnity'), cmrr: num('cmrr'), psrr: num('psrr'),
    vcmRef: opt('vcmRef'), cinDiff: num('cinDiff'), cinCm: num('cinCm'), slew: opt('slew'),
    swingHeadroom: opt('swingHeadroom'), swingHeadroomNeg: opt('swingHeadroomNeg'), swingHeadroomPos: opt('swingHeadroomPos'),
    cmHeadroom: opt('cmHeadroom'), cmHeadroomNeg: opt('cmHeadroomNeg'), cmHeadroomPos: opt('cmHeadroomPos'),
    ioutMax: opt('ioutMax'), rout: opt('rout')
  }
  return {opamp, defaulted}
}
