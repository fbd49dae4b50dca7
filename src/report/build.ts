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
import {combine, counted, coverRows, verdictOf} from './verdicts.js'
import type {ReportDocument} from './types.js'

export interface ReportInput {
  parsed: ParsedNote
  evaluations: StageEvaluation[]
  /** Template fragments, parsed: the method appendix and the closing text (sign-off + estimate statements). */
  fragments: {method: Root; closing: Root}
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

function replaceBlocks(nodes: RootContent[], ctx: ReportContext, byBlock: Map<StageBlockNode, StageEvaluation>, shared: readonly RuleNote[]): RootContent[] {
  const out: RootContent[] = []
  for (const node of nodes) {
    if (node.type === 'stageBlock') {
      const ev = byBlock.get(node)
      out.push(...(ev ? stageSection(ctx, ev, shared) : failedStageSection(node)))
    } else if (node.type === 'opampBlock') {
      out.push(...opampSection(ctx, node))
    } else if (hasChildren(node)) {
      out.push({...node, children: replaceBlocks(node.children, ctx, byBlock, shared)} as RootContent)
    } else {
      out.push(node)
    }
  }
  return out
}

/** Build the report tree: synchronous, no I/O, no chart library. */
export function buildReport(input: ReportInput): ReportOutput {
  const ctx: ReportContext = {figure: 0, table: 0, warnings: []}
  const byBlock = new Map(input.evaluations.map((ev) => [ev.block, ev] as const))
  // Notes that several stages share word for word are printed once, before the prose.
  const shared = sharedNotes(input.evaluations.map((ev) => ev.notes))
  const body: Root = {type: 'root', children: [
    ...sharedNoteBlocks(shared),
    ...replaceBlocks(input.parsed.tree.children, ctx, byBlock, shared)
  ]}
  const verdicts = coverRows(input.evaluations)
  const overall = combine(input.evaluations.flatMap((ev) => counted(ev.result.requirements).map(verdictOf)))
  const document: ReportDocument = {
    meta: input.parsed.meta,
    cover: {verdicts, overall},
    body,
    appendix: buildAppendix({
      evaluations: input.evaluations, method: input.fragments.method,
      sourceSha256: input.sourceSha256, toolVersion: input.toolVersion, fileName: input.fileName
    }),
    closing: input.fragments.closing,
    sourceSha256: input.sourceSha256,
    toolVersion: input.toolVersion
  }
  return {document, warnings: ctx.warnings}
}
