/**
 * First half of a stage block: walk its fields through `STAGE_KEYS`, reporting unknown keys,
 * keys the topology does not take and bad values, and collect what was read. Checks that
 * look at several keys, defaults and the assembly of `StageInput` are in `stage-block.ts`.
 */
import type {Point} from 'unist'
import {CALIBRATIONS, REQUIREMENT_KEYS, TOPOLOGIES, YIELD_KEYS, type Calibration, type RequirementKey, type Topology, type YieldOptions} from '../engine/types.js'
import {readYield} from './yield-read.js'
import type {Dimension} from '../units/index.js'
import type {Field} from './block-yaml.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {
  MILLI_CHECKED, OPAMP_BLOCK_KEYS, STAGE_KEYS, isStageKey,
  type CapacitorKey, type QuantityKey, type ResistorKey
} from './keys.js'
import {noteMessages} from './messages.js'
import {STAGE_ROLES} from './types.js'
import {bandOf, capacitorOf, choiceOf, quantityOf, rangeOf, resistorOf, scalarOf, supplyOf} from './values.js'
import {formatQuantity, formatRange, formatTempco} from '../units/index.js'

export interface ReadResistor {
  value: number
  tolerance: number
  tempco: number
  defaulted: ('tolerance' | 'tempco')[]
}

/** What a stage block said, SI, before defaults. */
export interface StageRead {
  topology: Topology | null
  title: string | null
  opamp: {name: string; at: Point} | null
  /** Instrumentation: the `ina:` name. */
  ina: {name: string; at: Point} | null
  resistors: Partial<Record<ResistorKey, ReadResistor>>
  quantities: Partial<Record<QuantityKey, number>>
  rshunt: number | null
  rload: number | null
  capacitors: Partial<Record<CapacitorKey, {value: number; tolerance: number; defaulted: boolean}>>
  /** True when the supply was written as one value (`15 V`, read as 0 … 15 V). */
  supplySingle: boolean
  calibration: Calibration | null
  input: [number, number] | null
  inputCm: [number, number] | null
  supply: [number, number] | null
  temperature: [number, number] | null
  band: [number, number] | null
  require: Partial<Record<RequirementKey, number>>
  /** The Monte Carlo options (DESIGN §8.7); null = off. */
  yield: YieldOptions | null
  /** `alternatives:` as written (DESIGN §8.8); null when not given or not readable. */
  alternatives: boolean | null
  /** Every key written (valid or not), with its field: for missing-key and cross-key checks. */
  given: Map<string, Field>
}

const STAGE_KEY_NAMES = Object.keys(STAGE_KEYS)
/** The words a flag key takes: YAML's `yes`, `on` and `1` are refused, so that a flag reads one way only. */
const FLAG_WORDS = ['true', 'false'] as const

const requirementDim = (unit: string, key: RequirementKey, topology: Topology | null): Dimension =>
  unit === '%' ? 'fraction' : unit === 'deg' ? 'angle' : unit === 'Hz' ? 'frequency' : key === 'input-error' && topology === 'transimpedance' ? 'current' : 'voltage'

function readRequire(field: Field, read: StageRead, report: Reporter): void {
  const v = field.value
  if (v.type === 'scalar' && v.text === null) return
  if (v.type !== 'map') {
    report.error(noteMessages.requireNotMap(), v.type === 'scalar' ? v.at(0) : v.at, 'bad-value')
    return
  }
  for (const sub of v.fields) {
    const name = sub.key.slice('require.'.length)
    if (!Object.hasOwn(REQUIREMENT_KEYS, name)) {
      const suggestion = didYouMean(name, Object.keys(REQUIREMENT_KEYS))
      report.error(noteMessages.unknownRequirement(name, suggestion, Object.keys(REQUIREMENT_KEYS)), sub.keyAt, 'unknown-key', {actual: name, ...(suggestion ? {expected: [suggestion]} : {})})
      continue
    }
    const key = name as RequirementKey
    const q = quantityOf(sub, requirementDim(REQUIREMENT_KEYS[key].unit, key, read.topology), report)
    if (q === null) continue
    if (q.value < 0) {
      report.error(noteMessages.negative(sub.key, q.s.text.trim(), 'a limit'), q.s.at(0), 'bad-value')
      continue
    }
    if (key === 'yield' && !(q.value > 0 && q.value <= 1)) {
      report.error(noteMessages.yieldRequirement(q.s.text.trim()), q.s.at(0), 'bad-value')
      continue
    }
    read.require[key] = q.value
  }
  // A yield is counted against the stage's DC error requirements (DESIGN §8.7): without one it has nothing to count.
  const yieldField = v.fields.find((f) => f.key === 'require.yield')
  if (read.require.yield !== undefined && yieldField !== undefined && !YIELD_KEYS.some((k) => read.require[k] !== undefined)) {
    report.error(noteMessages.yieldWithoutDcRequirement(), yieldField.keyAt, 'bad-value')
    delete read.require.yield
  }
}

/** `accept:` must be a map whose every value is a reason (a stage's or a chain's); the rule ids are checked by src/evaluate. */
export function readAccept(field: Field, report: Reporter): void {
  const v = field.value
  if (v.type === 'scalar' && v.text === null) return
  if (v.type !== 'map') {
    report.error(noteMessages.acceptNotMap(), v.type === 'scalar' ? v.at(0) : v.at, 'bad-value')
    return
  }
  for (const sub of v.fields) {
    const rule = sub.key.slice('accept.'.length)
    if (sub.value.type !== 'scalar' || sub.value.text === null || sub.value.text.trim() === '') {
      report.error(noteMessages.acceptNoReason(rule), sub.keyAt, 'bad-value')
    }
  }
}

function readResistor(field: Field, key: ResistorKey, read: StageRead, report: Reporter): void {
  const r = resistorOf(field, report)
  if (r === null) return
  const {value, tolerance, tempco} = r.value.value
  const text = r.s.text.trim()
  const wire = read.topology === 'follower' && key === 'rf'
  const problem = value < 0
    ? noteMessages.negative(key, text, 'a resistance')
    : value === 0 && (key === 'rg' || (key === 'rf' && !wire)) ? noteMessages.notPositive(key, text, 'a resistance') : null
  if (problem !== null) {
    report.error(problem, r.s.at(0), 'bad-value')
    return
  }
  // `rs: 10 mΩ` with the unit written out says milli plainly (a source or shunt of milliohms is
  // real); a bare `10m`, or rf/rg under 1 Ω however written, is suspicious.
  if (MILLI_CHECKED.includes(key) && r.value.prefix === 'm' && (r.value.unit === '' || key !== 'rs') && value < 1) {
    report.warn(noteMessages.milliOhm(key, formatQuantity(value, 'Ω')), r.s.at(0), 'suspicious-milliohm')
  }
  implausibleResistor(key, value, tempco, r.s.at(0), report)
  read.resistors[key] = {value, tolerance, tempco, defaulted: r.value.defaulted}
}

/**
 * Bounds of what a practising engineer would call plausible (common practice): a tempco
 * over 10,000 ppm/K (1 %/K: thermistors, not resistors), a resistance over 1 TΩ or under
 * 1 mΩ, a supply beyond 1 kV. Beyond them a value is accepted, with a warning at the key.
 */
export const PLAUSIBLE = {tempco: 10_000e-6, resistanceMax: 1e12, resistanceMin: 1e-3, supply: 1000} as const

function implausibleResistor(key: string, value: number, tempco: number, at: Point, report: Reporter): void {
  if (Math.abs(tempco) > PLAUSIBLE.tempco) {
    report.warn(noteMessages.implausible(key, 'tempco', formatTempco(tempco), '10,000 ppm/K'), at, 'suspicious-value')
  }
  if (value > PLAUSIBLE.resistanceMax || (value > 0 && value < PLAUSIBLE.resistanceMin)) {
    report.warn(noteMessages.implausible(key, 'resistance', formatQuantity(value, 'Ω'), '1 mΩ … 1 TΩ'), at, 'suspicious-value')
  }
}

function readQuantityKey(field: Field, key: QuantityKey, dim: Dimension, read: StageRead, report: Reporter): void {
  const q = quantityOf(field, dim, report)
  if (q === null) return
  const text = q.s.text.trim()
  // vref and noise-temperature may be negative; currents, capacitances and tolerances not.
  const signed = dim === 'voltage' || dim === 'temperature'
  const what = dim === 'current' ? 'a current' : dim === 'fraction' ? 'a tolerance' : dim === 'frequency' ? 'a frequency'
    : dim === 'temperature-interval' ? 'a temperature interval' : 'a capacitance'
  const mustBePositive = key === 'idark-doubling' || key === 'signal-frequency'
  const problem = !signed && q.value < 0
    ? noteMessages.negative(key, text, what)
    : mustBePositive && q.value === 0 ? noteMessages.notPositive(key, text, what)
    : key === 'supply-tolerance' && q.value >= 1 ? noteMessages.supplyTolerance(text) : null
  if (problem !== null) {
    report.error(problem, q.s.at(0), 'bad-value')
    return
  }
  read.quantities[key] = q.value
}

/** Walk the fields of a stage block (see module header). */
export function readStage(fields: readonly Field[], where: string, report: Reporter): StageRead {
  const read: StageRead = {
    topology: null, title: null, opamp: null, ina: null, resistors: {}, quantities: {}, rshunt: null, rload: null, supplySingle: false, calibration: null,
    capacitors: {}, inputCm: null,
    input: null, supply: null, temperature: null, band: null, require: {}, yield: null, alternatives: null, given: new Map()
  }
  for (const f of fields) read.given.set(f.key, f)
  const topo = read.given.get('topology')
  if (topo !== undefined) read.topology = choiceOf(topo, TOPOLOGIES, report)

  for (const field of fields) {
    const key = field.key
    if (!isStageKey(key)) {
      const inOpamp = OPAMP_BLOCK_KEYS.includes(key)
      const suggestion = inOpamp ? null : didYouMean(key, STAGE_KEY_NAMES)
      report.error(noteMessages.unknownKey(key, where, 'a stage', suggestion, inOpamp ? 'an opamp block' : null), field.keyAt, 'unknown-key', {
        actual: key, ...(suggestion ? {expected: [suggestion]} : {})
      })
      continue
    }
    const spec = STAGE_KEYS[key]
    if (read.topology !== null && spec.use[read.topology] === '-') {
      report.error(noteMessages.keyNotForTopology(key, read.topology, where), field.keyAt, 'key-not-for-topology')
      continue
    }
    const kind = spec.read
    switch (kind.kind) {
      case 'topology':
        break
      case 'text': {
        const s = scalarOf(field, 'a title', report)
        if (s !== null) read.title = s.text.trim()
        break
      }
      case 'opamp': {
        const s = scalarOf(field, 'an opamp block id or an archetype name', report)
        if (s !== null) read.opamp = {name: s.text.trim(), at: s.at(0)}
        break
      }
      case 'ina': {
        const s = scalarOf(field, 'an ina block id or an INA archetype name', report)
        if (s !== null) read.ina = {name: s.text.trim(), at: s.at(0)}
        break
      }
      case 'resistor':
        readResistor(field, key as ResistorKey, read, report)
        break
      case 'shunt': {
        const r = resistorOf(field, report)
        if (r === null) break
        const text = r.s.text.trim()
        if (r.value.hasParts) report.error(noteMessages.shuntParts(key), r.s.at(r.value.partsOffset), 'bad-value')
        else if (r.value.value.value <= 0) report.error(noteMessages.notPositive(key, text, 'a resistance'), r.s.at(0), 'bad-value')
        else if (key === 'rload') read.rload = r.value.value.value
        else read.rshunt = r.value.value.value
        break
      }
      case 'capacitor': {
        const c = capacitorOf(field, report)
        if (c === null) break
        if (c.value.value <= 0) report.error(noteMessages.notPositive(key, c.s.text.trim(), 'a capacitance'), c.s.at(0), 'bad-value')
        else read.capacitors[key as CapacitorKey] = c.value
        break
      }
      case 'input-cm': {
        const r = rangeOf(field, 'voltage', report, 'point')
        if (r !== null) read.inputCm = r.value
        break
      }
      case 'calibration':
        read.calibration = choiceOf(field, CALIBRATIONS, report)
        break
      case 'quantity':
        readQuantityKey(field, key as QuantityKey, kind.dim, read, report)
        break
      case 'input': {
        if (read.topology === null) break
        const r = rangeOf(field, read.topology === 'transimpedance' ? 'current' : 'voltage', report, 'from-zero')
        if (r !== null) read.input = r.value
        break
      }
      case 'supply': {
        const r = supplyOf(field, report)
        if (r !== null) {
          read.supply = r.value
          const t = r.s.text.trim()
          read.supplySingle = !/^(?:±|\+\/-|\+-)/.test(t) && !/\.\.|…/.test(t)
          if (Math.max(Math.abs(r.value[0]), Math.abs(r.value[1])) > PLAUSIBLE.supply) {
            report.warn(noteMessages.implausible('supply', 'supply', formatRange(r.value[0], r.value[1], 'V'), '±1 kV'), r.s.at(0), 'suspicious-value')
          }
        }
        break
      }
      case 'temperature-range': {
        const r = rangeOf(field, 'temperature', report, 'point')
        if (r !== null) read.temperature = r.value
        break
      }
      case 'band':
        read.band = bandOf(field, report) ?? read.band
        break
      case 'require':
        readRequire(field, read, report)
        break
      case 'role': {
        const s = scalarOf(field, '`design` or `baseline`', report)
        if (s === null) break
        const value = s.text.trim()
        if (!(STAGE_ROLES as readonly string[]).includes(value)) report.error(noteMessages.unknownRole(value, didYouMean(value, STAGE_ROLES)), s.at(0), 'bad-value')
        break
      }
      case 'accept':
        readAccept(field, report)
        break
      case 'yield':
        read.yield = readYield(field, report)
        break
      case 'flag': {
        const word = choiceOf(field, FLAG_WORDS, report)
        if (word !== null) read.alternatives = word === 'true'
        break
      }
    }
  }
  return read
}
