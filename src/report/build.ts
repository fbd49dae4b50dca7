/**
 * The report phase: the parsed note and its evaluations in, the report tree out. Each
 * stage block is swapped for its section and each opamp block for its datasheet tables;
 * the cover verdicts, the appendix and the closing text are assembled around the body.
 */
import type {Root, RootContent} from 'mdast'
import type {ParsedNote, StageBlockNode} from '../note/types.js'
import type {StageEvaluation} from '../evaluate/index.js'
import type {ReportContext} from './context.js'
import {buildAppendix} from './appendix.js'
import {failedStageSection, opampSection, stageSection} from './sections/stage.js'
import {sharedNoteBlocks, sharedNotes} from './sections/notes.js'
import type {RuleNote} from '../rules/types.js'
import {coverSummary} from './verdicts.js'
import {paragraph} from './mdast.js'
import {q} from './format.js'
import type {ReportDocument} from './types.js'
import type {ChainEvaluation} from '../evaluate/chains.js'
import type {ChainBlockNode} from '../note/chain-types.js'
import {adcSection, chainSection, failedChainSection} from './sections/chain.js'
import {chainCoverRows, chainVerdictOf} from './chain-verdicts.js'

export interface ReportInput {
  parsed: ParsedNote
  evaluations: StageEvaluation[]
  /** Evaluated chains (DESIGN §8.6); none when absent. */
  chains?: ChainEvaluation[]
  /** Template fragments, parsed: the method appendix and the closing text (sign-off + estimate statements). */
  fragments: {method: Root; closing: Root; appendix?: 'full' | 'short'}
  sourceSha256: string
  toolVersion: string
  fileName: string
}

export interface ReportOutput {
  document: ReportDocument
  /** Warnings met while building (none today; chart warnings arise where charts compile, in src/render). */
  warnings: string[]
}

type Parent = {children: RootContent[]}
const hasChildren = (n: RootContent): n is RootContent & Parent =>
  'children' in n && Array.isArray((n as Partial<Parent>).children)

/** What the chain sections need besides the stage evaluations. */
interface ChainsInReport {
  byBlock: Map<ChainBlockNode, ChainEvaluation>
  /** Stage id → its evaluation. */
  stages: Map<string, StageEvaluation>
  /** Stage id → where its input comes from, for a later stage of a chain. */
  fed: Map<string, {chain: string; previous: string}>
}

/** A line at the top of a later chain stage's section: where its input range came from. */
function fedLine(ev: StageEvaluation, chains: ChainsInReport): RootContent[] {
  const fed = chains.fed.get(ev.input.id)
  if (fed === undefined) return []
  const [lo, hi] = ev.input.input
  return [paragraph(`Input range ${q(lo, 'V')} … ${q(hi, 'V')}: the output of stage ${fed.previous} in chain ${fed.chain} (DESIGN §8.6), used throughout this section.`)]
}

function replaceBlocks(nodes: RootContent[], ctx: ReportContext, byBlock: Map<StageBlockNode, StageEvaluation>, shared: readonly RuleNote[], chains: ChainsInReport): RootContent[] {
  const out: RootContent[] = []
  for (const node of nodes) {
    if (node.type === 'stageBlock') {
      const ev = byBlock.get(node)
      if (ev) {
        const section = stageSection(ctx, ev, shared)
        out.push(...section.slice(0, 1), ...fedLine(ev, chains), ...section.slice(1))
      } else out.push(...failedStageSection(node))
    } else if (node.type === 'chainBlock') {
      const ev = chains.byBlock.get(node)
      out.push(...(ev ? chainSection(ctx, ev, chains.stages) : failedChainSection(node)))
    } else if (node.type === 'adcBlock') {
      out.push(...adcSection(ctx, node))
    } else if (node.type === 'opampBlock') {
      out.push(...opampSection(ctx, node))
    } else if (node.type === 'paragraph' && node.children.some((c) => c.type === 'image' || c.type === 'imageReference')) {
      // The note's own images are figures too, numbered in document order with the charts:
      // those a paragraph holds directly, which the PDF draws as blocks of their own.
      out.push({...node, children: node.children.map((c) => {
        if (c.type !== 'image' && c.type !== 'imageReference') return c
        ctx.figure += 1
        return {...c, data: {...c.data, figure: ctx.figure}}
      })})
    } else if (hasChildren(node)) {
      out.push({...node, children: replaceBlocks(node.children, ctx, byBlock, shared, chains)} as RootContent)
    } else {
      out.push(node)
    }
  }
  return out
}

function chainsInReport(input: ReportInput): ChainsInReport {
  const chains = input.chains ?? []
  const fed = new Map<string, {chain: string; previous: string}>()
  for (const ev of chains) ev.result.stages.forEach((id, i) => {
    if (i > 0) fed.set(id, {chain: ev.input.id, previous: ev.result.stages[i - 1]!})
  })
  return {
    byBlock: new Map(chains.map((ev) => [ev.block, ev] as const)),
    stages: new Map(input.evaluations.map((ev) => [ev.input.id, ev] as const)),
    fed
  }
}

/** Build the report tree: synchronous, no I/O, no chart library. */
export function buildReport(input: ReportInput): ReportOutput {
  const ctx: ReportContext = {figure: 0, table: 0, warnings: [], coverNotes: [],
    opampEntries: new Map(input.parsed.opamps.map((o) => [o.id, o.entries] as const))}
  const byBlock = new Map(input.evaluations.map((ev) => [ev.block, ev] as const))
  // Notes that several stages share word for word are printed once, before the prose.
  const shared = sharedNotes(input.evaluations.map((ev) => ev.notes))
  const body: Root = {type: 'root', children: [
    ...sharedNoteBlocks(shared, ctx.coverNotes),
    ...replaceBlocks(input.parsed.tree.children, ctx, byBlock, shared, chainsInReport(input))
  ]}
  const chains = input.chains ?? []
  const document: ReportDocument = {
    meta: input.parsed.meta,
    cover: coverSummary(input.evaluations, ctx.coverNotes, chainCoverRows(chains)),
    body,
    appendix: buildAppendix({
      evaluations: input.evaluations, chains, method: input.fragments.method, form: input.fragments.appendix ?? 'full',
      sourceSha256: input.sourceSha256, toolVersion: input.toolVersion, fileName: input.fileName
    }),
    closing: input.fragments.closing,
    sourceSha256: input.sourceSha256,
    toolVersion: input.toolVersion
  }
  return {document, warnings: ctx.warnings}
}
