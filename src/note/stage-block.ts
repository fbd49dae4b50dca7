/**
 * A `stage` block from its fields to a `StageInput`: reads them (`stage-read.ts`), reports
 * missing required keys at the block's id and checks that need several keys (ccomp without
 * rcomp, cf on a follower without rf), resolves the op-amp through the caller, then applies
 * the defaults and lists them. Any error in the block makes the input null.
 */
import type {Point} from 'unist'
import {inaAsOpamp} from '../engine/ina-archetypes.js'
import type {InaParams, OpampParams, Resistor, StageInput, Topology} from '../engine/types.js'
import {formatPercent, formatQuantity, formatRange, formatTemperature, formatTemperatureRange, formatTempco} from '../units/index.js'
import type {Field} from './block-yaml.js'
import type {Reporter} from './diagnostics.js'
import {STAGE_KEYS, type ResistorKey, type StageKey} from './keys.js'
import {noteMessages} from './messages.js'
import {readStage, type ReadResistor, type StageRead} from './stage-read.js'
import type {DefaultedValue} from './types.js'

/** Defaults where DESIGN §3.3 gives them, and ours where it is silent (band). */
export const STAGE_DEFAULTS = {
  cstray: 0,
  supplyTolerance: 0.05,
  temperature: [25, 25] as const,
  /** Our decision: DESIGN is silent. 0.1 Hz .. 10 kHz covers a precision stage's usual band. */
  band: [0.1, 10e3] as const,
  noiseTemperature: 25,
  vref: 0,
  /** DESIGN §4.2: common practice for silicon photodiodes. */
  idarkDoubling: 10
} as const

/** How a stage's `opamp:` is resolved; null after an error or when the opamp block has errors. */
export type OpampResolver = (name: string, at: Point) => OpampParams | null

export interface StageContext {
  id: string
  /** Where the id is (missing-key errors point there). */
  idAt: Point
  /** "stage `bridge-amp`". */
  where: string
  /** True when the block's YAML had syntax errors: missing keys are then not reported. */
  broken: boolean
  report: Reporter
  resolveOpamp: OpampResolver
  /** Resolves an instrumentation stage's `ina:` (DESIGN §8.2). */
  resolveIna: (name: string, at: Point) => InaParams | null
  /** True for a stage a chain names after its first place: `input` may be left out (DESIGN §8.6). (optional) */
  inputOptional?: boolean
}

export interface BuiltStage {
  input: StageInput | null
  defaulted: DefaultedValue[]
  /** True when `input` was left out for the chain to supply (the input's range is a placeholder). */
  inputFromChain: boolean
  /** True when the block asks for its input-technology alternatives (`alternatives: true`, DESIGN §8.8). */
  alternatives: boolean
}

const RESISTOR_KEYS: readonly ResistorKey[] = ['rf', 'rg', 'rs', 'rcomp', 'rp', 'rref', 'r1', 'r2', 'r3', 'riso']

function reportMissing(read: StageRead, ctx: StageContext): void {
  for (const key of Object.keys(STAGE_KEYS) as StageKey[]) {
    if (read.given.has(key) || (key === 'input' && ctx.inputOptional === true)) continue
    const use = STAGE_KEYS[key].use
    const everywhere = Object.values(use).every((u) => u === 'r')
    if (everywhere) ctx.report.error(noteMessages.missingKey(key, ctx.where, 'in every stage'), ctx.idAt, 'missing-key')
    else if (read.topology !== null && use[read.topology] === 'r') {
      ctx.report.error(noteMessages.missingKey(key, ctx.where, `for ${read.topology === 'inverting' ? 'an' : 'a'} ${read.topology} stage`), ctx.idAt, 'missing-key')
    }
  }
}

function checkCombinations(read: StageRead, ctx: StageContext): void {
  const ccomp = read.given.get('ccomp')
  if (ccomp !== undefined && (read.quantities.ccomp ?? 0) > 0 && (read.resistors.rcomp?.value ?? 0) === 0) {
    ctx.report.error(noteMessages.ccompWithoutRcomp(), ccomp.keyAt, 'inconsistent-keys')
  }
  const vref = read.given.get('vref')
  const v = read.quantities.vref
  if (vref !== undefined && v !== undefined && read.supply !== null && (v < read.supply[0] || v > read.supply[1])) {
    const at = vref.value.type === 'scalar' ? vref.value.at(0) : vref.keyAt
    const text = vref.value.type === 'scalar' ? (vref.value.text ?? '').trim() : ''
    ctx.report.error(noteMessages.vrefOutsideSupply(text, formatRange(read.supply[0], read.supply[1], 'V')), at, 'inconsistent-keys')
  }
  const cf = read.given.get('cf')
  if (read.topology === 'follower' && cf !== undefined && (read.quantities.cf ?? 0) > 0 && (read.resistors.rf?.value ?? 0) === 0) {
    ctx.report.error(noteMessages.cfWithoutRf(), cf.keyAt, 'inconsistent-keys')
  }
  const rg = read.given.get('rg')
  if (read.topology === 'lowpass-sallen-key' && rg !== undefined && !read.given.has('rf')) {
    ctx.report.error(noteMessages.rgWithoutRf(), rg.keyAt, 'inconsistent-keys')
  }
}

const toResistor = (r: ReadResistor | undefined): Resistor | null =>
  r === undefined || r.value === 0 ? null : {value: r.value, tolerance: r.tolerance, tempco: r.tempco}

function defaultsOf(read: StageRead, topology: Topology, id: string): DefaultedValue[] {
  const out: DefaultedValue[] = []
  const applies = (key: StageKey): boolean => STAGE_KEYS[key].use[topology] !== '-' && !read.given.has(key)
  const add = (key: StageKey, value: string): void => {
    if (applies(key)) out.push({key, value})
  }
  add('title', id)
  // Not a default but a reading worth listing with them: one value means 0 to it (DESIGN §3.1).
  if (read.supplySingle && read.supply !== null) {
    out.push({key: 'supply', value: `${formatRange(read.supply[0], read.supply[1], 'V')} (written as one value: 0 V to it)`})
  }
  if (topology === 'follower') add('rf', '0 Ω (a wire)')
  add('rs', 'none (0 Ω)')
  add('rcomp', 'none (0 Ω)')
  for (const key of ['ccomp', 'cf', 'cstray', 'cstray-plus', 'csource'] as const) add(key, formatQuantity(0, 'F'))
  add('rshunt', 'open')
  add('riso', 'none (a wire)')
  add('cload', formatQuantity(0, 'F'))
  if (topology === 'lowpass-sallen-key') add('rf', '0 Ω (unity gain)')
  add('input-cm', formatQuantity(0, 'V'))
  for (const key of ['c1', 'c2'] as const) if (read.capacitors[key]?.defaulted === true) out.push({key: `${key}.tolerance`, value: formatPercent(0)})
  add('idark', formatQuantity(0, 'A'))
  if ((read.quantities.idark ?? 0) > 0) {
    add('idark-max', 'not entered (idark doubled every idark-doubling above 25 °C)')
    add('idark-doubling', formatQuantity(STAGE_DEFAULTS.idarkDoubling, 'K'))
  }
  add('signal-frequency', 'the band’s top')
  add('rload', 'none')
  add('calibration', 'none')
  add('vref', formatQuantity(STAGE_DEFAULTS.vref, 'V'))
  add('supply-tolerance', formatPercent(STAGE_DEFAULTS.supplyTolerance))
  add('temperature', formatTemperatureRange(...STAGE_DEFAULTS.temperature))
  add('band', formatRange(...STAGE_DEFAULTS.band, 'Hz'))
  add('noise-temperature', formatTemperature(STAGE_DEFAULTS.noiseTemperature))
  for (const key of RESISTOR_KEYS) {
    const r = read.resistors[key]
    if (r === undefined) continue
    if (r.defaulted.includes('tolerance')) out.push({key: `${key}.tolerance`, value: formatPercent(0)})
    if (r.defaulted.includes('tempco')) out.push({key: `${key}.tempco`, value: formatTempco(0)})
  }
  return out
}

/** Build a stage from its fields (see module header). */
export function buildStage(fields: readonly Field[], ctx: StageContext): BuiltStage {
  const errorsBefore = ctx.report.errors
  const read = readStage(fields, ctx.where, ctx.report)
  if (!ctx.broken) reportMissing(read, ctx)
  checkCombinations(read, ctx)
  const ina = read.ina === null ? null : ctx.resolveIna(read.ina.name, read.ina.at)
  // An instrumentation stage's amplifier is its INA; the op-amp view carries its input values.
  const opamp = read.topology === 'instrumentation' ? (ina === null ? null : inaAsOpamp(ina))
    : read.opamp === null ? null : ctx.resolveOpamp(read.opamp.name, read.opamp.at)
  const {topology, supply} = read
  // A later stage of a chain may leave `input` out: the chain supplies the previous stage's output range.
  const inputFromChain = read.input === null && !read.given.has('input') && ctx.inputOptional === true
  const input: [number, number] | null = read.input ?? (inputFromChain ? [0, 0] : null)
  if (ctx.report.errors > errorsBefore || topology === null || opamp === null || input === null || supply === null) {
    return {input: null, defaulted: topology === null ? [] : defaultsOf(read, topology, ctx.id), inputFromChain, alternatives: read.alternatives === true}
  }
  const q = read.quantities
  const stage: StageInput = {
    id: ctx.id,
    title: read.title ?? ctx.id,
    topology,
    opamp,
    rf: toResistor(read.resistors.rf),
    rg: toResistor(read.resistors.rg),
    rs: toResistor(read.resistors.rs),
    rcomp: toResistor(read.resistors.rcomp),
    ccomp: q.ccomp ?? 0,
    cf: q.cf ?? 0,
    cstray: q.cstray ?? STAGE_DEFAULTS.cstray,
    rshunt: read.rshunt,
    rp: toResistor(read.resistors.rp),
    rref: toResistor(read.resistors.rref),
    r1: toResistor(read.resistors.r1),
    r2: toResistor(read.resistors.r2),
    r3: toResistor(read.resistors.r3),
    c1: read.capacitors.c1 === undefined ? null : {value: read.capacitors.c1.value, tolerance: read.capacitors.c1.tolerance},
    c2: read.capacitors.c2 === undefined ? null : {value: read.capacitors.c2.value, tolerance: read.capacitors.c2.tolerance},
    riso: toResistor(read.resistors.riso),
    cload: q.cload ?? 0,
    cstrayPlus: q['cstray-plus'] ?? 0,
    inputCm: read.inputCm ?? [0, 0],
    ina,
    csource: q.csource ?? 0,
    idark: q.idark ?? 0,
    idarkMax: q['idark-max'] ?? null,
    idarkDoubling: q['idark-doubling'] ?? STAGE_DEFAULTS.idarkDoubling,
    vref: q.vref ?? STAGE_DEFAULTS.vref,
    input,
    supply,
    supplyTolerance: q['supply-tolerance'] ?? STAGE_DEFAULTS.supplyTolerance,
    temperature: read.temperature ?? [...STAGE_DEFAULTS.temperature],
    temperatureEntered: read.temperature !== null,
    band: read.band ?? [...STAGE_DEFAULTS.band],
    noiseTemperature: q['noise-temperature'] ?? STAGE_DEFAULTS.noiseTemperature,
    signalFrequency: q['signal-frequency'] ?? null,
    rload: read.rload,
    calibration: read.calibration ?? 'none',
    require: read.require,
    ...(read.yield === null ? {} : {yield: read.yield})
  }
  return {input: stage, defaulted: defaultsOf(read, topology, ctx.id), inputFromChain, alternatives: read.alternatives === true}
}
