/**
 * A `chain` block from its fields to a `ChainInput` (DESIGN §8.6): the stages it names in
 * signal order (each a stage block defined above the chain, named once, in no other chain;
 * a transimpedance stage only first), the converter (an adc block above or an archetype),
 * temperature (default: the first stage's), band (default: the last stage's), calibration
 * and requirements. Any error makes the input null; each is positioned at the item at fault.
 */
import type {Point} from 'unist'
import {ADC_ARCHETYPES, ADC_ARCHETYPE_NAMES, isAdcArchetypeName} from '../engine/chain/archetypes.js'
import {CHAIN_REQUIREMENT_KEYS, CHAIN_YIELD_KEYS, type AdcParams, type ChainInput, type ChainRequirementKey} from '../engine/chain/types.js'
import {CALIBRATIONS, type Calibration, type YieldOptions} from '../engine/types.js'
import {formatRange, formatTemperatureRange} from '../units/index.js'
import type {Field, FieldValue} from './block-yaml.js'
import type {AdcBlockNode} from './chain-types.js'
import {chainMessages} from './chain-messages.js'
import {CHAIN_KEYS, CHAIN_REQUIREMENT_DIMS, isChainKey} from './converter-keys.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {noteMessages} from './messages.js'
import {readYield} from './yield-read.js'
import {readAccept} from './stage-read.js'
import type {DefaultedValue, StageBlockNode} from './types.js'
import {bandOf, choiceOf, quantityOf, rangeOf, scalarOf} from './values.js'

/** Topologies that take the sensor's own signal and so can only be first (DESIGN §8.6). */
export const FIRST_ONLY_TOPOLOGIES: readonly string[] = ['transimpedance', 'instrumentation', 'difference']

/** What the chain reader knows of the rest of the note. */
export interface ChainScope {
  /** Stage blocks read so far (first definition per id). */
  stagesAbove: ReadonlyMap<string, StageBlockNode>
  /** Every stage id of the note, at its first definition. */
  allStages: ReadonlyMap<string, Point>
  /** Adc blocks read so far (first definition per id). */
  adcsAbove: ReadonlyMap<string, AdcBlockNode>
  /** Every adc id of the note. */
  allAdcs: ReadonlyMap<string, Point>
  /** Stages already in a chain: the chain's id and where it named the stage (mutated). */
  member: Map<string, {chain: string; at: Point}>
}

export interface ChainContext {
  id: string
  idAt: Point
  where: string
  broken: boolean
  report: Reporter
  scope: ChainScope
}

export interface BuiltChain {
  input: ChainInput | null
  defaulted: DefaultedValue[]
}

/** The ids of a `stages` value with their places; null after reporting. */
function stageItems(field: Field, report: Reporter): {name: string; at: Point}[] | null {
  const v = field.value
  const items: FieldValue[] = v.type === 'seq' ? v.items : v.type === 'scalar' && v.text !== null && !/[\s,]/.test(v.text.trim()) ? [v] : []
  if (v.type !== 'seq' && items.length === 0) {
    report.error(chainMessages.stagesNotList(), v.type === 'scalar' ? v.at(0) : v.at, 'bad-value')
    return null
  }
  if (items.length === 0) {
    report.error(chainMessages.stagesEmpty(), v.type === 'seq' ? v.at : field.keyAt, 'bad-value')
    return null
  }
  const out: {name: string; at: Point}[] = []
  for (const item of items) {
    if (item.type !== 'scalar' || item.text === null || item.text.trim() === '') {
      report.error(chainMessages.stageNotText(), item.type === 'scalar' ? item.at(0) : item.at, 'bad-value')
      return null
    }
    out.push({name: item.text.trim(), at: item.at(0)})
  }
  return out
}

/** Check every named stage; returns the stage nodes, or null when any is at fault. */
function resolveStages(items: {name: string; at: Point}[], ctx: ChainContext): StageBlockNode[] | null {
  const {report, scope} = ctx
  const seen = new Map<string, Point>()
  const nodes: StageBlockNode[] = []
  let ok = true
  for (const [i, {name, at}] of items.entries()) {
    const first = seen.get(name)
    if (first !== undefined) {
      report.error(chainMessages.stageRepeated(name), at, 'stage-repeated', {cause: {reason: chainMessages.firstHere(name), place: first}})
      ok = false
      continue
    }
    seen.set(name, at)
    const node = scope.stagesAbove.get(name)
    if (node === undefined) {
      const later = scope.allStages.get(name)
      if (later !== undefined) {
        report.error(chainMessages.stageDefinedLater(name, later.line), at, 'stage-defined-later', {cause: {reason: noteMessages.firstId('stage', name), place: later}})
      } else {
        const suggestion = didYouMean(name, [...scope.allStages.keys()])
        report.error(chainMessages.unknownStage(name, ctx.where, suggestion), at, 'unknown-stage', {actual: name, ...(suggestion ? {expected: [suggestion]} : {})})
      }
      ok = false
      continue
    }
    const other = scope.member.get(name)
    if (other !== undefined) {
      report.error(chainMessages.stageInTwoChains(name, other.chain), at, 'stage-in-two-chains', {cause: {reason: chainMessages.otherChain(other.chain), place: other.at}})
      ok = false
      continue
    }
    scope.member.set(name, {chain: ctx.id, at})
    const topology = node.input?.topology ?? node.entries.find((e) => e.key === 'topology')?.raw.trim() ?? ''
    if (i > 0 && FIRST_ONLY_TOPOLOGIES.includes(topology)) {
      report.error(chainMessages.onlyFirst(name, topology), at, 'stage-only-first')
      ok = false
      continue
    }
    if (node.input === null) {
      report.info(chainMessages.stageHasErrors(ctx.where, name), at, 'stage-has-errors')
      ok = false
      continue
    }
    nodes.push(node)
  }
  return ok ? nodes : null
}

function resolveAdc(field: Field, ctx: ChainContext): AdcParams | null | 'error' {
  const s = scalarOf(field, 'an adc block id or a converter archetype', ctx.report)
  if (s === null) return 'error'
  const name = s.text.trim()
  const at = s.at(0)
  const {scope, report} = ctx
  const above = scope.adcsAbove.get(name)
  if (above !== undefined) {
    if (above.adc === null) report.info(chainMessages.adcHasErrors(ctx.where, name), at, 'adc-has-errors')
    return above.adc ?? 'error'
  }
  const later = scope.allAdcs.get(name)
  if (later !== undefined) {
    report.error(chainMessages.adcDefinedLater(name, later.line), at, 'adc-defined-later', {cause: {reason: noteMessages.firstId('adc', name), place: later}})
    return 'error'
  }
  if (isAdcArchetypeName(name)) return {...ADC_ARCHETYPES[name]}
  const suggestion = didYouMean(name, [...scope.allAdcs.keys(), ...ADC_ARCHETYPE_NAMES])
  report.error(chainMessages.unknownAdc(name, ctx.where, suggestion, ADC_ARCHETYPE_NAMES), at, 'unknown-adc', {actual: name, ...(suggestion ? {expected: [suggestion]} : {})})
  return 'error'
}

function readRequire(field: Field, current: boolean, report: Reporter): Partial<Record<ChainRequirementKey, number>> {
  const out: Partial<Record<ChainRequirementKey, number>> = {}
  const v = field.value
  if (v.type === 'scalar' && v.text === null) return out
  if (v.type !== 'map') {
    report.error(noteMessages.requireNotMap(), v.type === 'scalar' ? v.at(0) : v.at, 'bad-value')
    return out
  }
  const known = Object.keys(CHAIN_REQUIREMENT_KEYS)
  for (const sub of v.fields) {
    const name = sub.key.slice('require.'.length)
    if (!Object.hasOwn(CHAIN_REQUIREMENT_KEYS, name)) {
      const suggestion = didYouMean(name, known)
      report.error(noteMessages.unknownRequirement(name, suggestion, known), sub.keyAt, 'unknown-key', {actual: name, ...(suggestion ? {expected: [suggestion]} : {})})
      continue
    }
    const key = name as ChainRequirementKey
    const d = CHAIN_REQUIREMENT_DIMS[key]
    const q = quantityOf(sub, d === 'input' ? (current ? 'current' : 'voltage') : d, report)
    if (q === null) continue
    // dB limits arrive as linear ratios from the grammar; a chain states them in dB.
    const value = d === 'ratio-db' ? 20 * Math.log10(q.value) : q.value
    if (d !== 'ratio-db' && value < 0) {
      report.error(noteMessages.negative(sub.key, q.s.text.trim(), 'a limit'), q.s.at(0), 'bad-value')
      continue
    }
    if (key === 'yield' && !(value > 0 && value <= 1)) {
      report.error(noteMessages.yieldRequirement(q.s.text.trim()), q.s.at(0), 'bad-value')
      continue
    }
    out[key] = value
  }
  // A yield is counted against the chain's DC error requirements (DESIGN §8.7): without one it has nothing to count.
  const yieldField = v.fields.find((f) => f.key === 'require.yield')
  if (out.yield !== undefined && yieldField !== undefined && !CHAIN_YIELD_KEYS.some((k) => out[k] !== undefined)) {
    report.error(chainMessages.yieldWithoutDcRequirement(), yieldField.keyAt, 'bad-value')
    delete out.yield
  }
  return out
}

/** Build a chain from its fields (see module header). */
export function buildChain(fields: readonly Field[], ctx: ChainContext): BuiltChain {
  const {report} = ctx
  const errorsBefore = report.errors
  const given = new Map(fields.map((f) => [f.key, f]))
  let stages: StageBlockNode[] | null = null
  let adc: AdcParams | null | 'error' = null
  let temperature: [number, number] | null = null
  let band: [number, number] | null = null
  let calibration: Calibration | null = null
  let yieldOptions: YieldOptions | null = null
  let title: string | null = null
  for (const field of fields) {
    const key = field.key
    if (!isChainKey(key)) {
      const suggestion = didYouMean(key, CHAIN_KEYS)
      report.error(noteMessages.unknownKey(key, ctx.where, 'a chain', suggestion, null), field.keyAt, 'unknown-key', {actual: key, ...(suggestion ? {expected: [suggestion]} : {})})
      continue
    }
    switch (key) {
      case 'title': {
        const s = scalarOf(field, 'a title', report)
        if (s !== null) title = s.text.trim()
        break
      }
      case 'stages': {
        const items = stageItems(field, report)
        if (items !== null) stages = resolveStages(items, ctx)
        break
      }
      case 'adc':
        adc = resolveAdc(field, ctx)
        break
      case 'temperature': {
        const r = rangeOf(field, 'temperature', report, 'point')
        if (r !== null) temperature = r.value
        break
      }
      case 'band':
        band = bandOf(field, report) ?? band
        break
      case 'calibration':
        calibration = choiceOf(field, CALIBRATIONS, report)
        break
      case 'yield':
        yieldOptions = readYield(field, report)
        break
      case 'require':
        break
      case 'accept':
        readAccept(field, report)
        break
    }
  }
  if (!given.has('stages') && !ctx.broken) report.error(noteMessages.missingKey('stages', ctx.where, 'in every chain'), ctx.idAt, 'missing-key')
  const first = stages?.[0]?.input ?? null
  const last = stages?.[stages.length - 1]?.input ?? null
  const requireField = given.get('require')
  const require = requireField === undefined ? {} : readRequire(requireField, first?.topology === 'transimpedance', report)
  const converter = adc === 'error' ? null : adc
  if (adc === null) {
    for (const key of ['error-lsb', 'error-lsb-calibrated', 'noise-free-bits', 'effective-bits', 'alias-rejection'] as const) {
      const sub = requireField?.value.type === 'map' ? requireField.value.fields.find((f) => f.key === `require.${key}`) : undefined
      if (sub !== undefined) report.error(chainMessages.lsbWithoutConverter(key), sub.keyAt, 'inconsistent-keys')
    }
  } else if (converter !== null && converter.sampleRate === null) {
    const sub = requireField?.value.type === 'map' ? requireField.value.fields.find((f) => f.key === 'require.alias-rejection') : undefined
    if (sub !== undefined) report.error(chainMessages.aliasWithoutRate(), sub.keyAt, 'inconsistent-keys')
  }

  const defaulted: DefaultedValue[] = []
  if (title === null) defaulted.push({key: 'title', value: ctx.id})
  if (!given.has('adc')) defaulted.push({key: 'adc', value: 'none (the chain ends at an analog output)'})
  if (temperature === null && first !== null) defaulted.push({key: 'temperature', value: `${formatTemperatureRange(first.temperature[0], first.temperature[1])} (the first stage's)`})
  if (band === null && last !== null) defaulted.push({key: 'band', value: `${formatRange(last.band[0], last.band[1], 'Hz')} (the last stage's)`})
  if (calibration === null) defaulted.push({key: 'calibration', value: 'none'})
  if (report.errors > errorsBefore || stages === null || first === null || last === null || adc === 'error') return {input: null, defaulted}
  return {
    input: {
      id: ctx.id,
      title: title ?? ctx.id,
      stages: stages.map((s) => s.id),
      adc: converter,
      temperature: temperature ?? [first.temperature[0], first.temperature[1]],
      band: band ?? [last.band[0], last.band[1]],
      calibration: calibration ?? 'none',
      require,
      yield: yieldOptions
    },
    defaulted
  }
}
