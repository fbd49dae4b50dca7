/**
 * An `ina` block from its fields to `InaParams` (DESIGN §8.2), driven by `INA_KEYS`.
 * Required: input-type, gain-constant, vos-in, vos-out, ib, ios, en-in, en-out, in, cmrr,
 * psrr, gbw. Zero when not given (and listed as defaulted): gain-error, gain-drift,
 * nonlinearity, the drifts, the 1/f corners. Null ("not entered"): ib-max, ios-max,
 * ib-doubling, vcm-ref, slew, swing-headroom, cm-headroom. Any error makes the result null.
 */
import type {Point} from 'unist'
import {INPUT_TYPES, type InaParams, type InputType} from '../engine/types.js'
import {DIMENSIONS, formatQuantity, type Dimension} from '../units/index.js'
import type {Field} from './block-yaml.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {noteMessages} from './messages.js'
import type {DefaultedValue} from './types.js'
import {choiceOf, quantityOf} from './values.js'

type InaField = Exclude<keyof InaParams, 'name' | 'archetype' | 'inputType'>
interface InaKeySpec {
  readonly dim: Dimension
  readonly need: 'required' | 'zero' | 'null'
  readonly field: InaField
}

/** The ina block's quantity keys (DESIGN §8.2); `input-type` is read separately. */
export const INA_KEYS = {
  'gain-constant': {dim: 'resistance', need: 'required', field: 'gainConstant'},
  'gain-error': {dim: 'fraction', need: 'zero', field: 'gainError'},
  'gain-drift': {dim: 'tempco', need: 'zero', field: 'gainDrift'},
  nonlinearity: {dim: 'fraction', need: 'zero', field: 'nonlinearity'},
  'vos-in': {dim: 'voltage', need: 'required', field: 'vosIn'},
  'vos-out': {dim: 'voltage', need: 'required', field: 'vosOut'},
  'vos-in-drift': {dim: 'drift', need: 'zero', field: 'vosInDrift'},
  'vos-out-drift': {dim: 'drift', need: 'zero', field: 'vosOutDrift'},
  ib: {dim: 'current', need: 'required', field: 'ib'},
  ios: {dim: 'current', need: 'required', field: 'ios'},
  'ib-max': {dim: 'current', need: 'null', field: 'ibMax'},
  'ios-max': {dim: 'current', need: 'null', field: 'iosMax'},
  'ib-doubling': {dim: 'temperature-interval', need: 'null', field: 'ibDoubling'},
  'vcm-ref': {dim: 'voltage', need: 'null', field: 'vcmRef'},
  'en-in': {dim: 'voltage-density', need: 'required', field: 'enIn'},
  'en-out': {dim: 'voltage-density', need: 'required', field: 'enOut'},
  'en-corner': {dim: 'frequency', need: 'zero', field: 'enCorner'},
  in: {dim: 'current-density', need: 'required', field: 'in'},
  'in-corner': {dim: 'frequency', need: 'zero', field: 'inCorner'},
  cmrr: {dim: 'ratio-db', need: 'required', field: 'cmrr'},
  psrr: {dim: 'ratio-db', need: 'required', field: 'psrr'},
  gbw: {dim: 'frequency', need: 'required', field: 'gbw'},
  slew: {dim: 'slew', need: 'null', field: 'slew'},
  'swing-headroom': {dim: 'voltage', need: 'null', field: 'swingHeadroom'},
  'cm-headroom': {dim: 'voltage', need: 'null', field: 'cmHeadroom'}
} as const satisfies Record<string, InaKeySpec>

export type InaKey = keyof typeof INA_KEYS
const isInaKey = (s: string): s is InaKey => Object.hasOwn(INA_KEYS, s)
/** Every key an ina block takes, `input-type` included. */
export const INA_BLOCK_KEYS: readonly string[] = ['input-type', ...Object.keys(INA_KEYS)]

export interface InaContext {
  id: string
  idAt: Point
  where: string
  broken: boolean
  report: Reporter
}

/** Build an instrumentation amplifier from its fields (see module header). */
export function buildIna(fields: readonly Field[], ctx: InaContext): {ina: InaParams | null; defaulted: DefaultedValue[]} {
  const {report} = ctx
  const errorsBefore = report.errors
  const values: Partial<Record<InaField, number>> = {}
  const given = new Set<string>()
  let inputType: InputType | null = null
  for (const field of fields) {
    given.add(field.key)
    if (field.key === 'input-type') {
      inputType = choiceOf(field, INPUT_TYPES, report)
      continue
    }
    if (!isInaKey(field.key)) {
      const suggestion = didYouMean(field.key, INA_BLOCK_KEYS)
      report.error(noteMessages.unknownKey(field.key, ctx.where, 'an ina', suggestion, null), field.keyAt, 'unknown-key', {
        actual: field.key, ...(suggestion ? {expected: [suggestion]} : {})
      })
      continue
    }
    const spec = INA_KEYS[field.key]
    const q = quantityOf(field, spec.dim, report)
    if (q === null) continue
    const signed = field.key === 'vcm-ref' || field.key === 'cm-headroom'
    if (!signed && q.value < 0) {
      report.error(noteMessages.negative(field.key, q.s.text.trim(), DIMENSIONS[spec.dim].label), q.s.at(0), 'bad-value')
      continue
    }
    if ((field.key === 'gbw' || field.key === 'gain-constant') && q.value === 0) {
      report.error(noteMessages.notPositive(field.key, q.s.text.trim(), DIMENSIONS[spec.dim].label), q.s.at(0), 'bad-value')
      continue
    }
    values[spec.field] = q.value
  }
  const defaulted: DefaultedValue[] = []
  for (const key of INA_BLOCK_KEYS) {
    if (given.has(key)) continue
    const spec = isInaKey(key) ? INA_KEYS[key] : null
    if (spec === null || spec.need === 'required') {
      if (!ctx.broken) report.error(noteMessages.missingKey(key, ctx.where, 'in every ina block'), ctx.idAt, 'missing-key')
    } else if (spec.need === 'zero') defaulted.push({key, value: formatQuantity(0, DIMENSIONS[spec.dim].si)})
    else defaulted.push({key, value: 'not entered'})
  }
  if (report.errors > errorsBefore || inputType === null) return {ina: null, defaulted}
  const num = (f: InaField): number => values[f] ?? 0
  const opt = (f: InaField): number | null => values[f] ?? null
  const ina: InaParams = {
    name: ctx.id, archetype: false, inputType,
    gainConstant: num('gainConstant'), gainError: num('gainError'), gainDrift: num('gainDrift'), nonlinearity: num('nonlinearity'),
    vosIn: num('vosIn'), vosOut: num('vosOut'), vosInDrift: num('vosInDrift'), vosOutDrift: num('vosOutDrift'),
    ib: num('ib'), ios: num('ios'), ibMax: opt('ibMax'), iosMax: opt('iosMax'), ibDoubling: opt('ibDoubling'), vcmRef: opt('vcmRef'),
    enIn: num('enIn'), enOut: num('enOut'), enCorner: num('enCorner'), in: num('in'), inCorner: num('inCorner'),
    cmrr: num('cmrr'), psrr: num('psrr'), gbw: num('gbw'), slew: opt('slew'), swingHeadroom: opt('swingHeadroom'), cmHeadroom: opt('cmHeadroom')
  }
  return {ina, defaulted}
}
