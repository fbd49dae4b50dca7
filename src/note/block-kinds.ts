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
import type {OpampRegistry} from './opamp-registry.js'
import {buildStage} from './stage-block.js'
import type {BlockEntry, OpampBlockNode, StageBlockNode} from './types.js'

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
}

/** A block node of ours, as a kind's reader makes it. */
export type BlockNode = StageBlockNode | OpampBlockNode

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

const nodeFields = (b: BlockRead): {id: string; entries: BlockEntry[]; position?: Position} =>
  ({id: b.id, entries: b.entries, ...(b.position ? {position: b.position} : {})})

export const BLOCK_KINDS = {
  stage: {
    read(b) {
      const built = buildStage(b.fields, {id: b.id, idAt: b.idAt, where: b.where, broken: b.broken, report: b.report, resolveOpamp: b.opamps.resolver(b.where, b.report)})
      const input = b.report.errors > b.errorsBefore ? null : built.input
      const {id, entries, ...rest} = nodeFields(b)
      return {type: 'stageBlock', id, entries, input, defaulted: built.defaulted, ...rest}
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
  chain: {read: null, unsupported: {message: (): string => noteMessages.chainUnsupported(), rule: 'chain-unsupported'}}
} as const satisfies Record<string, BlockKind>

export type BlockLang = keyof typeof BLOCK_KINDS
export const BLOCK_LANGS = Object.keys(BLOCK_KINDS) as BlockLang[]
export const isBlockLang = (s: string | null | undefined): s is BlockLang =>
  typeof s === 'string' && Object.hasOwn(BLOCK_KINDS, s)
