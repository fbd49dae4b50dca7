/**
 * The block reader, a unified plugin: finds every fenced block of a kind in BLOCK_KINDS
 * (./block-kinds.ts), checks its fence and id, reads its YAML and replaces the fence by
 * the kind's node, position kept, in document order. The nodes of each kind are left on
 * `file.data.blocks`. Problems are messages on the file; nothing throws.
 */
import type {Code, Parent, Root} from 'mdast'
import type {Point} from 'unist'
import type {VFile} from 'vfile'
import {entriesOf, readYaml} from './block-yaml.js'
import {BLOCK_KINDS, BLOCK_LANGS, isBlockLang, type BlockKind, type BlockLang, type BlockNode} from './block-kinds.js'
import {reporterFor, type Reporter} from './diagnostics.js'
import {fenceInfo, isValidId, type FenceInfo} from './fences.js'
import {blockName, noteMessages} from './messages.js'
import {opampRegistry} from './opamp-registry.js'
import {sourceOf, valueMapper, type SourceText} from './place.js'
import {isMap, isScalar, isSeq, parseDocument} from 'yaml'
import type {ChainScope} from './chain-block.js'

declare module 'vfile' {
  interface DataMap {
    /** The block nodes of the note by kind, in document order (set by the block reader). */
    blocks: Partial<Record<BlockLang, BlockNode[]>>
  }
}

/** Most blocks one note may hold (time and memory stay bounded: README, Limits). */
export const MAX_BLOCKS = 10_000

interface Found {
  code: Code
  lang: BlockLang
  parent: Parent
  index: number
}

function collect(node: Parent, out: Found[]): Found[] {
  node.children.forEach((child, index) => {
    if (child.type === 'code' && isBlockLang(child.lang)) out.push({code: child, lang: child.lang, parent: node, index})
    else if ('children' in child) collect(child, out)
  })
  return out
}

const OPENS_BLOCK = new RegExp(`^(\\s*)(?:\`{3,}|~{3,})\\s*((?:${BLOCK_LANGS.join('|')})\\b.*?)\\s*$`)

/**
 * The first line of an unclosed block's value that opens another block of ours
 * (```` ```stage b ````): the fence was left open and ran over it. 1-based line and column.
 */
function swallowedFence(value: string): {text: string; line: number; column: number} | null {
  const lines = value.split(/\r\n|\r|\n/)
  for (const [i, line] of lines.entries()) {
    const m = OPENS_BLOCK.exec(line)
    if (m) return {text: (m[2] ?? '').trim(), line: i + 1, column: (m[1] ?? '').length + 1}
  }
  return null
}

/** Ids of the kinds whose ids are known from the start, at their first definition. */
function predeclaredIds(found: readonly Found[], source: SourceText, lang: BlockLang): Map<string, Point> {
  const all = new Map<string, Point>()
  for (const f of found) {
    const id = f.lang === lang ? f.code.meta?.trim() : undefined
    if (id && !all.has(id)) all.set(id, fenceInfo(f.code, source).idAt)
  }
  return all
}

/**
 * Stage ids that a chain names after its first place, read quietly from every chain fence
 * before any block is read: such a stage may leave out `input` (DESIGN §8.6). The chain's
 * own reading reports whatever is wrong with its list.
 */
function laterChainStages(found: readonly Found[]): Set<string> {
  const later = new Set<string>()
  for (const f of found) {
    if (f.lang !== 'chain') continue
    const doc = parseDocument(f.code.value, {uniqueKeys: false})
    if (!isMap(doc.contents)) continue
    const list = doc.contents.get('stages', true)
    if (!isSeq(list)) continue
    list.items.slice(1).forEach((item) => {
      if (isScalar(item) && item.value !== null) later.add(String(item.value).trim())
    })
  }
  return later
}

/**
 * The checks every block's fence and id get: an id is given, is one word and is unique per
 * kind (a duplicate points at the first), the fence is closed, then the kind's own checks.
 * Returns whether this is the first block of its kind with this id.
 */
function checkIdAndFence(kind: BlockKind, lang: BlockLang, info: FenceInfo, seen: Map<string, Point>, report: Reporter): boolean {
  const where = blockName(lang, info.id)
  if (info.id === null) report.error(noteMessages.missingId(lang), info.fenceAt, 'missing-id')
  else if (!isValidId(info.id)) report.error(noteMessages.badId(lang, info.id), info.idAt, 'bad-id')
  if (!info.closed) report.warn(noteMessages.unclosedFence(where), info.fenceAt, 'unclosed-fence')
  const id = info.id ?? ''
  const first = info.id === null ? undefined : seen.get(id)
  if (first !== undefined) {
    report.error(noteMessages.duplicateId(lang, id), info.idAt, 'duplicate-id', {cause: {reason: noteMessages.firstId(lang, id), place: first}})
  } else if (info.id !== null) seen.set(id, info.idAt)
  kind.checkId?.(id, info.idAt, report)
  return first === undefined
}

/** Read every block of `tree` in place (see module header). */
export function readBlocks(tree: Root, file: VFile): void {
  const report = reporterFor(file)
  const source = sourceOf(file.toString())
  const blocks: Partial<Record<BlockLang, BlockNode[]>> = {}
  file.data.blocks = blocks
  const found = collect(tree, [])
  if (found.length > MAX_BLOCKS) {
    const extra = found[MAX_BLOCKS]!.code.position?.start ?? {line: 1, column: 1}
    report.error(noteMessages.tooManyBlocks(found.length, MAX_BLOCKS), extra, 'too-many-blocks')
    tree.children = []
    return
  }
  const opamps = opampRegistry(predeclaredIds(found, source, 'opamp'))
  const inas = new Map<string, import('../engine/types.js').InaParams | null>()
  const chains: ChainScope = {
    stagesAbove: new Map(), allStages: predeclaredIds(found, source, 'stage'),
    adcsAbove: new Map(), allAdcs: predeclaredIds(found, source, 'adc'), member: new Map()
  }
  const later = laterChainStages(found)
  const inputFromChain = (id: string): boolean => later.has(id)
  const seen = new Map<BlockLang, Map<string, Point>>(BLOCK_LANGS.map((l) => [l, new Map()]))
  for (const {code, lang, parent, index} of found) {
    const kind: BlockKind = BLOCK_KINDS[lang]
    const info = fenceInfo(code, source)
    if (kind.read === null) {
      if (kind.unsupported) report.warn(kind.unsupported.message(), info.fenceAt, kind.unsupported.rule)
      continue
    }
    const errorsBefore = report.errors
    const firstOfId = checkIdAndFence(kind, lang, info, seen.get(lang)!, report)
    const where = blockName(lang, info.id)
    const mapper = valueMapper(source, code)
    const swallowed = info.closed ? null : swallowedFence(code.value)
    if (swallowed !== null) {
      report.error(noteMessages.swallowedBlock(swallowed.text, where), mapper(swallowed.line, swallowed.column), 'swallowed-block')
    }
    // A block that swallowed another one is not read: its keys would only repeat the cause.
    const {fields, broken} = swallowed === null ? readYaml(code.value, mapper, where, report) : {fields: [], broken: true}
    const node = kind.read({
      id: info.id ?? '', idAt: info.idAt, where, broken, report, fields, entries: entriesOf(fields),
      position: code.position, errorsBefore, firstOfId, opamps, inas, chains, inputFromChain
    })
    parent.children[index] = node
    ;(blocks[lang] ??= []).push(node)
  }
}

/** The block reader as a unified plugin: `unified().use(remarkParse).use(blockReader)`. */
export function blockReader(): (tree: Root, file: VFile) => void {
  return readBlocks
}
