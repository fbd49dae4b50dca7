/**
 * Reading a note: Markdown (remark, GFM, YAML front matter) to `ParsedNote`.
 *
 *   1. (Bytes are checked before, once, by `decodeNote` in ./decode.ts.)
 *   2. Parse with unified + remark-parse + remark-frontmatter + remark-gfm.
 *   3. Front matter to `DocumentMeta`, and warn when it is not on line 1.
 *   4. Collect every fenced `stage`/`opamp`/`chain` block in document order.
 *   5. Build each block (opamps defined above a stage resolve; below is an error) and put a
 *      `StageBlockNode`/`OpampBlockNode` in the fence's place, position kept.
 *
 * Every problem is a message on `file`; nothing throws and nothing stops at the first error.
 */
import type {Code, Parent, Root} from 'mdast'
import type {Point} from 'unist'
import remarkFrontmatter from 'remark-frontmatter'
import remarkGfm from 'remark-gfm'
import remarkParse from 'remark-parse'
import {unified} from 'unified'
import type {VFile} from 'vfile'
import {ARCHETYPES, ARCHETYPE_NAMES, isArchetypeName} from '../engine/archetypes.js'
import type {OpampParams} from '../engine/types.js'
import {entriesOf, readYaml} from './block-yaml.js'
import {reporterFor, type Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {fenceInfo, isBlockLang, isValidId, type BlockLang} from './fences.js'
import {emptyMeta, readFrontMatter} from './front-matter.js'
import {blockName, noteMessages} from './messages.js'
import {buildOpamp} from './opamp-block.js'
import {sourceOf, valueMapper, type SourceText} from './place.js'
import {buildStage} from './stage-block.js'
import type {OpampBlockNode, ParsedNote, StageBlockNode} from './types.js'

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

/** Most stage/opamp blocks one note may hold (time and memory stay bounded: README, Limits). */
export const MAX_BLOCKS = 10_000

/** Deepest nesting the report renders; real notes stay under ten. */
export const MAX_NESTING = 64

/**
 * The first node nested deeper than MAX_NESTING, found without recursion (the walkers of
 * later phases recurse, and a hostile note could nest thousands of block quotes).
 */
function tooDeep(tree: Root): {depth: number; at: Point | undefined} | null {
  const stack: {node: Parent; depth: number}[] = [{node: tree, depth: 0}]
  while (stack.length > 0) {
    const {node, depth} = stack.pop()!
    if (depth > MAX_NESTING) return {depth, at: node.position?.start}
    for (const child of node.children) if ('children' in child) stack.push({node: child, depth: depth + 1})
  }
  return null
}

function frontMatterNotFirst(source: SourceText, report: Reporter): void {
  const first = source.lines.findIndex((l) => l.trim() !== '')
  if (first > 0 && source.lines[first]?.trim() === '---') {
    report.warn(noteMessages.frontMatterNotFirst(first + 1), {line: first + 1, column: 1}, 'front-matter-position')
  }
}

/**
 * `---` on line 1 followed by `key: value` lines but no closing `---`: remark reads a rule
 * and a paragraph, and the note's title, status and reviewers would vanish without a word.
 */
function frontMatterUnclosed(source: SourceText, report: Reporter): void {
  if (source.lines[0]?.trimEnd() !== '---') return
  const next = source.lines.slice(1).find((l) => l.trim() !== '')
  if (next !== undefined && /^[A-Za-z][\w-]*\s*:(\s|$)/.test(next)) {
    report.error(noteMessages.frontMatterUnclosed(), {line: 1, column: 1}, 'front-matter')
  }
}

interface Registry {
  /** Opamp blocks built so far, first definition per id. */
  before: Map<string, OpampBlockNode>
  /** Every opamp block id in the note, at its first definition. */
  all: Map<string, Point>
}

function resolver(registry: Registry, where: string, report: Reporter) {
  return (name: string, at: Point): OpampParams | null => {
    const defined = registry.before.get(name)
    if (defined !== undefined) {
      if (defined.opamp === null) report.info(noteMessages.opampHasErrors(where, name), at, 'opamp-has-errors')
      return defined.opamp
    }
    const later = registry.all.get(name)
    if (later !== undefined) {
      report.error(noteMessages.opampDefinedLater(name, later.line), at, 'opamp-defined-later', {
        cause: {reason: noteMessages.firstId('opamp', name), place: later}
      })
      return null
    }
    if (isArchetypeName(name)) return {...ARCHETYPES[name]}
    const suggestion = didYouMean(name, [...registry.all.keys(), ...ARCHETYPE_NAMES])
    report.error(noteMessages.unknownOpamp(name, where, suggestion, ARCHETYPE_NAMES), at, 'unknown-opamp', {
      actual: name, expected: suggestion === null ? [...registry.all.keys(), ...ARCHETYPE_NAMES] : [suggestion]
    })
    return null
  }
}

/**
 * The first line of an unclosed block's value that opens another block of ours
 * (```` ```stage b ````): the fence was left open and ran over it. 1-based line and column.
 */
function swallowedFence(value: string): {text: string; line: number; column: number} | null {
  const lines = value.split(/\r\n|\r|\n/)
  for (const [i, line] of lines.entries()) {
    const m = /^(\s*)(?:`{3,}|~{3,})\s*((?:stage|opamp|chain)\b.*?)\s*$/.exec(line)
    if (m) return {text: (m[2] ?? '').trim(), line: i + 1, column: (m[1] ?? '').length + 1}
  }
  return null
}

/** Read a note (see module header). Synchronous; diagnostics go to `file.messages`. */
export function parseNote(file: VFile): ParsedNote {
  const report = reporterFor(file)
  const text = file.toString()
  const source = sourceOf(text)
  const processor = unified().use(remarkParse).use(remarkFrontmatter, ['yaml']).use(remarkGfm)
  const tree: Root = processor.parse(text)
  const deep = tooDeep(tree)
  if (deep !== null) {
    report.error(noteMessages.tooDeep(MAX_NESTING), deep.at ?? {line: 1, column: 1}, 'too-deep')
    return {meta: emptyMeta(), tree: {type: 'root', children: []}, stages: [], opamps: []}
  }

  let meta = emptyMeta()
  const head = tree.children[0]
  if (head?.type === 'yaml') {
    meta = readFrontMatter(head.value, valueMapper(source, head), report)
    tree.children.splice(0, 1)
  } else {
    frontMatterNotFirst(source, report)
    frontMatterUnclosed(source, report)
  }

  const found = collect(tree, [])
  if (found.length > MAX_BLOCKS) {
    const extra = found[MAX_BLOCKS]!.code.position?.start ?? {line: 1, column: 1}
    report.error(noteMessages.tooManyBlocks(found.length, MAX_BLOCKS), extra, 'too-many-blocks')
    return {meta, tree: {type: 'root', children: []}, stages: [], opamps: []}
  }
  const registry: Registry = {before: new Map(), all: new Map()}
  for (const f of found) {
    const id = f.lang === 'opamp' ? f.code.meta?.trim() : undefined
    if (id && !registry.all.has(id)) registry.all.set(id, fenceInfo(f.code, source).idAt)
  }

  const stages: StageBlockNode[] = []
  const opamps: OpampBlockNode[] = []
  const firstStage = new Map<string, Point>()
  const firstOpamp = new Map<string, Point>()
  for (const {code, lang, parent, index} of found) {
    const info = fenceInfo(code, source)
    if (lang === 'chain') {
      report.warn(noteMessages.chainUnsupported(), info.fenceAt, 'chain-unsupported')
      continue
    }
    const errorsBefore = report.errors
    const where = blockName(lang, info.id)
    if (info.id === null) report.error(noteMessages.missingId(lang), info.fenceAt, 'missing-id')
    else if (!isValidId(info.id)) report.error(noteMessages.badId(lang, info.id), info.idAt, 'bad-id')
    if (!info.closed) report.warn(noteMessages.unclosedFence(where), info.fenceAt, 'unclosed-fence')
    const id = info.id ?? ''
    const seen = lang === 'stage' ? firstStage : firstOpamp
    const first = info.id === null ? undefined : seen.get(id)
    if (first !== undefined) {
      report.error(noteMessages.duplicateId(lang, id), info.idAt, 'duplicate-id', {cause: {reason: noteMessages.firstId(lang, id), place: first}})
    } else if (info.id !== null) seen.set(id, info.idAt)
    if (lang === 'opamp' && isArchetypeName(id)) report.warn(noteMessages.archetypeShadowed(id), info.idAt, 'archetype-shadowed')

    const mapper = valueMapper(source, code)
    const swallowed = info.closed ? null : swallowedFence(code.value)
    if (swallowed !== null) {
      report.error(noteMessages.swallowedBlock(swallowed.text, where), mapper(swallowed.line, swallowed.column), 'swallowed-block')
    }
    // A block that swallowed another one is not read: its keys would only repeat the cause.
    const {fields, broken} = swallowed === null ? readYaml(code.value, mapper, where, report) : {fields: [], broken: true}
    const entries = entriesOf(fields)
    const ctx = {id, idAt: info.idAt, where, broken, report}
    const position = code.position
    if (lang === 'stage') {
      const built = buildStage(fields, {...ctx, resolveOpamp: resolver(registry, where, report)})
      const input = report.errors > errorsBefore ? null : built.input
      const node: StageBlockNode = {type: 'stageBlock', id, entries, input, defaulted: built.defaulted, ...(position ? {position} : {})}
      parent.children[index] = node
      stages.push(node)
    } else {
      const built = buildOpamp(fields, ctx)
      const opamp = report.errors > errorsBefore ? null : built.opamp
      const node: OpampBlockNode = {type: 'opampBlock', id, entries, opamp, defaulted: built.defaulted, ...(position ? {position} : {})}
      parent.children[index] = node
      opamps.push(node)
      if (first === undefined && info.id !== null) registry.before.set(id, node)
    }
  }
  return {meta, tree, stages, opamps}
}
