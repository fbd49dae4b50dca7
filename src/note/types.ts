/**
 * What `src/note` hands on: the document's metadata, the mdast tree with each `stage` and
 * `opamp` fence replaced by a typed, positioned block node, and the blocks themselves.
 * Diagnostics are not here: they are messages on the `VFile` (fatal = error).
 */
import type {Position} from 'unist'
import type {OpampParams, StageInput} from '../engine/types.js'

export const HAZARD_CONTEXTS = ['mains-connected', 'patient-connected', 'high-voltage', 'battery'] as const
export type HazardContext = (typeof HAZARD_CONTEXTS)[number]

export const DOCUMENT_STATUSES = ['draft', 'for-review', 'approved'] as const
export type DocumentStatus = (typeof DOCUMENT_STATUSES)[number]

/**
 * What a stage is in the review: `design` (the default) counts toward the verdict and the
 * exit code; `baseline` (e.g. the circuit as drawn, kept for comparison) is evaluated and
 * shown, but its verdicts do not count.
 */
export const STAGE_ROLES = ['design', 'baseline'] as const
export type StageRole = (typeof STAGE_ROLES)[number]

export interface Reviewer {
  /** Person's name; may be empty (a row to fill in by hand). */
  name: string
  /** Role at the review, e.g. "Reviewer" (default) or "Approver". */
  role: string
}

/** Front matter (DESIGN §3), every key optional. */
export interface DocumentMeta {
  title: string | null
  document: string | null
  revision: string | null
  /** As written (ISO date expected, e.g. 2026-11-30). */
  date: string | null
  author: string | null
  reviewers: Reviewer[]
  project: string | null
  /** Default 'draft'. */
  status: DocumentStatus
  context: HazardContext[]
  template: string | null
}

/** One `key: value` line of a block, as written, with its place in the Markdown file. */
export interface BlockEntry {
  key: string
  /** The value text as written (for `require`, the sub-key is in `key` as `require.noise-rms`). */
  raw: string
  /** 1-based line and column of the key in the Markdown file. */
  line: number
  column: number
}

/** A value the note did not give, and what was used instead. */
export interface DefaultedValue {
  /** Key, e.g. `supply-tolerance` or `rf.tempco`. */
  key: string
  /** The value used, formatted for people, e.g. "5 %". */
  value: string
}

export interface StageBlockNode {
  type: 'stageBlock'
  id: string
  entries: BlockEntry[]
  /** Null when the block had errors. */
  input: StageInput | null
  defaulted: DefaultedValue[]
  /** True when the block gives no `input`: a chain supplies it (DESIGN §8.6; `input` is then a placeholder). */
  inputFromChain?: true
  /** True when the block says `alternatives: true`: evaluate it again with every candidate amplifier (DESIGN §8.8). */
  alternatives?: true
  position?: Position
}

export interface OpampBlockNode {
  type: 'opampBlock'
  id: string
  entries: BlockEntry[]
  /** Null when the block had errors (and for an `ina` block). */
  opamp: OpampParams | null
  /** An `ina` block (DESIGN §8.2): its values, null when it had errors; absent for an opamp block. */
  ina?: import('../engine/types.js').InaParams | null
  defaulted: DefaultedValue[]
  position?: Position
}

export interface ParsedNote {
  meta: DocumentMeta
  /** The note as mdast, front matter removed, blocks replaced by the nodes above. */
  tree: import('mdast').Root
  stages: StageBlockNode[]
  opamps: OpampBlockNode[]
  /** Converter blocks (DESIGN §8.5), in document order. */
  adcs?: import('./chain-types.js').AdcBlockNode[]
  /** Chain blocks (DESIGN §8.6), in document order. */
  chains?: import('./chain-types.js').ChainBlockNode[]
  /** `ina` blocks (DESIGN §8.2), in document order (their node carries `ina`, never `opamp`). */
  inas?: OpampBlockNode[]
}

declare module 'mdast' {
  interface RootContentMap {
    stageBlock: StageBlockNode
    opampBlock: OpampBlockNode
  }
  interface BlockContentMap {
    stageBlock: StageBlockNode
    opampBlock: OpampBlockNode
  }
}
