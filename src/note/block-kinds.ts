/**
 * The one table of fenced block kinds. Each kind says how a block of it is read into its
 * node (or that it is recognised but not read yet: a warning, and the block stays code).
 * A new kind (`ina`, `adc`, …) is one entry here with its reader; the block reader
 * (./block-reader.ts) does the rest: ids, fences, YAML, positions, document order.
 */
import type {Point, Position} from 'unist'
import {isArchetypeName} from '../engine/archetypes.js'
import type {Field} from './block-yaml.js'
import type {NoteRule, Reporter} from './diagnostics.js'
import {noteMessages} from './messages.js'
import {buildOpamp} from './opamp-block.js'
import {buildIna} from './ina-block.js'
import {didYouMean} from './did-you-mean.js'
import {INA_ARCHETYPES, INA_ARCHETYPE_NAMES, isInaArchetypeName} from '../engine/ina-archetypes.js'
import type {InaParams} from '../engine/types.js'
import type {OpampRegistry} from './opamp-registry.js'
import {buildStage} from './stage-block.js'
import type {BlockEntry, OpampBlockNode, StageBlockNode} from './types.js'
import {buildAdc} from './adc-block.js'
import {buildChain, type ChainScope} from './chain-block.js'
import type {AdcBlockNode, ChainBlockNode} from './chain-types.js'
import {isAdcArchetypeName} from '../engine/chain/archetypes.js'

/** What a kind's reader gets for one block. */
export interface BlockRead {
  id: string
  idAt: Point
  /** "stage `bridge-amp`". */
  where: string
  /** True when the block's YAML had syntax errors. */
  broken: boolean
  report: Reporter
  fields: readonly Field[]
  entries: BlockEntry[]
  position: Position | undefined
  /** Errors raised before this block was read (a block with more errors gets a null value). */
  errorsBefore: number
  /** Whether this is the first block of its kind with this id. */
  firstOfId: boolean
  opamps: OpampRegistry
  /** The ina blocks read so far (first definition per id), DESIGN §8.2. */
  inas: Map<string, import('../engine/types.js').InaParams | null>
  /** What a chain block may name: stages and converters above it, chain membership. */
  chains: ChainScope
  /** True for a stage that a chain names after its first place (its input comes from the chain). */
  inputFromChain: (id: string) => boolean
}

/** A block node of ours, as a kind's reader makes it. */
export type BlockNode = StageBlockNode | OpampBlockNode | AdcBlockNode | ChainBlockNode

export interface BlockKind {
  /** Read a block into its node; null: recognised, not read (see `unsupported`). */
  read: ((b: BlockRead) => BlockNode) | null
  /** The warning for a kind that is recognised but not read yet. */
  unsupported?: {message: () => string; rule: NoteRule}
  /** Checks of the id beyond the common ones (one word, unique per kind). */
  checkId?: (id: string, idAt: Point, report: Reporter) => void
  /** Whether the kind's ids are known before reading (op-amps a stage above may not use yet). */
  predeclared?: boolean
}

/** A stage's `ina:` name: an ina block above it, or an INA archetype (DESIGN §8.2). */
function inaResolver(inas: ReadonlyMap<string, InaParams | null>, where: string, report: Reporter) {
  return (name: string, at: Point): InaParams | null => {
    if (inas.has(name)) {
      const ina = inas.get(name) ?? null
      if (ina === null) report.info(noteMessages.opampHasErrors(where, name), at, 'opamp-has-errors')
      return ina
    }
    if (isInaArchetypeName(name)) return {...INA_ARCHETYPES[name]}
    const suggestion = didYouMean(name, [...inas.keys(), ...INA_ARCHETYPE_NAMES])
    report.error(noteMessages.unknownIna(name, where, suggestion, INA_ARCHETYPE_NAMES), at, 'unknown-opamp', {
      actual: name, expected: suggestion === null ? [...inas.keys(), ...INA_ARCHETYPE_NAMES] : [suggestion]
    })
    return null
  }
}

const nodeFields = (b: BlockRead): {id: string; entries: BlockEntry[]; position?: Position} =>
  ({id: b.id, entries: b.entries, ...(b.position ? {position: b.position} : {})})

export const BLOCK_KINDS = {
  stage: {
    read(b) {
      const fromChain = b.inputFromChain(b.id)
      const built = buildStage(b.fields, {
        id: b.id, idAt: b.idAt, where: b.where, broken: b.broken, report: b.report,
        resolveOpamp: b.opamps.resolver(b.where, b.report), resolveIna: inaResolver(b.inas, b.where, b.report),
        inputOptional: fromChain
      })
      const input = b.report.errors > b.errorsBefore ? null : built.input
      const {id, entries, ...rest} = nodeFields(b)
      const node: StageBlockNode = {type: 'stageBlock', id, entries, input, defaulted: built.defaulted, ...rest}
      if (built.inputFromChain) node.inputFromChain = true
      if (built.alternatives) node.alternatives = true
      if (b.firstOfId && id !== '') (b.chains.stagesAbove as Map<string, StageBlockNode>).set(id, node)
      return node
    }
  },
  opamp: {
    predeclared: true,
    checkId(id, idAt, report) {
      if (isArchetypeName(id)) report.warn(noteMessages.archetypeShadowed(id), idAt, 'archetype-shadowed')
    },
    read(b) {
      const built = buildOpamp(b.fields, {id: b.id, idAt: b.idAt, where: b.where, broken: b.broken, report: b.report})
      const opamp = b.report.errors > b.errorsBefore ? null : built.opamp
      const {id, entries, ...rest} = nodeFields(b)
      const node: OpampBlockNode = {type: 'opampBlock', id, entries, opamp, defaulted: built.defaulted, ...rest}
      if (b.firstOfId && id !== '') b.opamps.define(node)
      return node
    }
  },
  ina: {
    read(b) {
      const built = buildIna(b.fields, {id: b.id, idAt: b.idAt, where: b.where, broken: b.broken, report: b.report})
      const ina = b.report.errors > b.errorsBefore ? null : built.ina
      const {id, entries, ...rest} = nodeFields(b)
      if (b.firstOfId && id !== '' && !b.inas.has(id)) b.inas.set(id, ina)
      return {type: 'opampBlock', id, entries, opamp: null, ina, defaulted: built.defaulted, ...rest}
    }
  },
  adc: {
    predeclared: true,
    checkId(id, idAt, report) {
      if (isAdcArchetypeName(id)) report.warn(noteMessages.archetypeShadowed(id).replace('opamp block', 'adc block'), idAt, 'archetype-shadowed')
    },
    read(b) {
      const built = buildAdc(b.fields, {id: b.id, idAt: b.idAt, where: b.where, broken: b.broken, report: b.report})
      const adc = b.report.errors > b.errorsBefore ? null : built.adc
      const {id, entries, ...rest} = nodeFields(b)
      const node: AdcBlockNode = {type: 'adcBlock', id, entries, adc, defaulted: built.defaulted, ...rest}
      if (b.firstOfId && id !== '') (b.chains.adcsAbove as Map<string, AdcBlockNode>).set(id, node)
      return node
    }
  },
  chain: {
    read(b) {
      const built = buildChain(b.fields, {id: b.id, idAt: b.idAt, where: b.where, broken: b.broken, report: b.report, scope: b.chains})
      const input = b.report.errors > b.errorsBefore ? null : built.input
      const {id, entries, ...rest} = nodeFields(b)
      const node: ChainBlockNode = {type: 'chainBlock', id, entries, input, defaulted: built.defaulted, ...rest}
      return node
    }
  }
} as const satisfies Record<string, BlockKind>

export type BlockLang = keyof typeof BLOCK_KINDS
export const BLOCK_LANGS = Object.keys(BLOCK_KINDS) as BlockLang[]
export const isBlockLang = (s: string | null | undefined): s is BlockLang =>
  typeof s === 'string' && Object.hasOwn(BLOCK_KINDS, s)
