/**
 * Reading a note: Markdown (remark, GFM, YAML front matter) to `ParsedNote`.
 *
 *   1. (Bytes are checked before, once, by `decodeNote` in ./decode.ts.)
 *   2. Parse with unified + remark-parse + remark-frontmatter + remark-gfm.
 *   3. Front matter to `DocumentMeta`, and warn when it is not on line 1.
 *   4. The block reader (./block-reader.ts, a unified plugin) reads every fenced block of
 *      a kind in the one table of kinds (./block-kinds.ts) and puts its node in the
 *      fence's place, position kept.
 *
 * Every problem is a message on `file`; nothing throws and nothing stops at the first error.
 */
import type {Parent, Root} from 'mdast'
import type {Point} from 'unist'
import remarkFrontmatter from 'remark-frontmatter'
import remarkGfm from 'remark-gfm'
import remarkParse from 'remark-parse'
import {unified} from 'unified'
import type {VFile} from 'vfile'
import {blockReader} from './block-reader.js'
import {reporterFor, type Reporter} from './diagnostics.js'
import {emptyMeta, readFrontMatter} from './front-matter.js'
import {noteMessages} from './messages.js'
import {sourceOf, valueMapper, type SourceText} from './place.js'
import {nestingTooDeep} from './prescan.js'
import type {OpampBlockNode, ParsedNote, StageBlockNode} from './types.js'
import type {AdcBlockNode, ChainBlockNode} from './chain-types.js'

export {MAX_BLOCKS} from './block-reader.js'

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

/** Read a note (see module header). Synchronous; diagnostics go to `file.messages`. */
export function parseNote(file: VFile): ParsedNote {
  const report = reporterFor(file)
  const text = file.toString()
  // A linear pre-scan first: the parser is slow on deep nesting, or overflows its stack.
  const bomb = nestingTooDeep(text, MAX_NESTING)
  if (bomb !== null) {
    report.error(noteMessages.tooDeep(MAX_NESTING), bomb, 'too-deep')
    return {meta: emptyMeta(), tree: {type: 'root', children: []}, stages: [], opamps: []}
  }
  const source = sourceOf(text)
  const processor = unified().use(remarkParse).use(remarkFrontmatter, ['yaml']).use(remarkGfm).use(blockReader)
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

  processor.runSync(tree, file)
  const blocks = file.data.blocks ?? {}
  const stages = (blocks.stage ?? []).filter((n): n is StageBlockNode => n.type === 'stageBlock')
  const opamps = (blocks.opamp ?? []).filter((n): n is OpampBlockNode => n.type === 'opampBlock')
  const inas = (blocks.ina ?? []).filter((n): n is OpampBlockNode => n.type === 'opampBlock')
  const adcs = (blocks.adc ?? []).filter((n): n is AdcBlockNode => n.type === 'adcBlock')
  const chains = (blocks.chain ?? []).filter((n): n is ChainBlockNode => n.type === 'chainBlock')
  return {meta, tree, stages, opamps, adcs, chains, inas}
}
