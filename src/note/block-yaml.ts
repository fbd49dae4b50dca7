/**
 * Reading a YAML body (a block's value or the front matter) into fields with Markdown
 * positions. Uses `yaml.parseDocument` with a `LineCounter`; syntax errors and warnings
 * become diagnostics at their place in the Markdown file, and duplicate keys are errors that
 * point back at the first one (only the first is kept). What the keys mean is left to the
 * block builders.
 */
import type {Point} from 'unist'
import {LineCounter, isMap, isScalar, isSeq, parseDocument, type Node, type YAMLMap} from 'yaml'
import type {BlockEntry} from './types.js'
import type {PointMapper} from './place.js'
import type {Reporter} from './diagnostics.js'
import {noteMessages} from './messages.js'

/** A value as read, with the way back to its place in the Markdown file. */
export type FieldValue =
  | {
      type: 'scalar'
      /** The text as written (plain scalars keep their source: `1.10`, `350`); null when empty. */
      text: string | null
      /** Markdown point of 0-based offset `offset` inside `text`. */
      at: (offset: number) => Point
    }
  | {type: 'map'; fields: Field[]; at: Point}
  | {type: 'seq'; items: FieldValue[]; at: Point}
  | {type: 'other'; at: Point}

/** One `key: value` of a map. */
export interface Field {
  /** Key, with the parent's prefix for nested maps (`require.noise-rms`). */
  key: string
  /** Markdown point of the key. */
  keyAt: Point
  value: FieldValue
  /** The value's source text ('' when empty), for `BlockEntry.raw`. */
  raw: string
}

export interface ReadYaml {
  fields: Field[]
  /** True when YAML reported a syntax error (then missing keys are not reported). */
  broken: boolean
}

/** "list", "map", "value": what a node is, for messages ("Unexpected list for `rf`"). */
export const describeValue = (v: FieldValue): string =>
  v.type === 'map' ? 'map' : v.type === 'seq' ? 'list' : v.type === 'other' ? 'alias' : 'value'

/** The first line of a YAML message, without its block-relative "at line …, column …". */
const cleanYamlMessage = (message: string): string =>
  (message.split('\n')[0] ?? message).replace(/ at line \d+, column \d+:?\s*$/, '').trim()

/**
 * Read `text` as a YAML map.
 * @param where
 *   What the text is, for messages ("stage `bridge-amp`", "front matter").
 */
export function readYaml(text: string, map: PointMapper, where: string, report: Reporter): ReadYaml {
  const lineCounter = new LineCounter()
  const doc = parseDocument(text, {lineCounter, prettyErrors: true, uniqueKeys: false})
  const pointOf = (offset: number): Point => {
    const p = lineCounter.linePos(offset)
    return map(p.line, p.col)
  }
  // One YAML mistake often gives several errors on one line: report the first of each line.
  const errorLines = new Set<number>()
  for (const e of doc.errors) {
    const at = pointOf(e.pos[0])
    if (errorLines.has(at.line)) continue
    errorLines.add(at.line)
    report.error(noteMessages.yamlSyntax(where, cleanYamlMessage(e.message)), at, 'yaml-syntax')
  }
  // A value that a syntax error falls in is dropped: its own checks would only repeat it.
  const errorOffsets = doc.errors.map((e) => e.pos[0])
  const damaged = (range: readonly number[] | null | undefined): boolean =>
    range !== null && range !== undefined && errorOffsets.some((o) => o >= (range[0] ?? 0) && o <= (range[2] ?? range[1] ?? 0))
  for (const w of doc.warnings) report.warn(noteMessages.yamlWarning(where, cleanYamlMessage(w.message)), pointOf(w.pos[0]), 'yaml-syntax')

  const valueOf = (node: unknown, fallback: number): FieldValue => {
    const n = node as Node | null
    const start = n?.range?.[0] ?? fallback
    if (isScalar(n)) {
      if (n.value === null) return {type: 'scalar', text: null, at: () => pointOf(start)}
      const quoted = n.type === 'QUOTE_DOUBLE' || n.type === 'QUOTE_SINGLE'
      const block = n.type === 'BLOCK_LITERAL' || n.type === 'BLOCK_FOLDED'
      const written = typeof n.source === 'string' && !quoted && !block ? n.source : String(n.value)
      const base = start + (quoted ? 1 : 0)
      return {type: 'scalar', text: written, at: (offset) => pointOf(block ? start : base + offset)}
    }
    if (isMap(n)) return {type: 'map', fields: fieldsOf(n, '', where), at: pointOf(start)}
    if (isSeq(n)) return {type: 'seq', items: n.items.map((item) => valueOf(item, start)), at: pointOf(start)}
    if (n === null) return {type: 'scalar', text: null, at: () => pointOf(fallback)}
    return {type: 'other', at: pointOf(start)}
  }

  const fieldsOf = (node: YAMLMap, prefix: string, label: string): Field[] => {
    const fields: Field[] = []
    const seen = new Map<string, Point>()
    for (const pair of node.items) {
      const k = pair.key as Node | null
      const keyStart = k?.range?.[0] ?? node.range?.[0] ?? 0
      if (!isScalar(k) || k.value === null || typeof k.value === 'object') {
        report.error(noteMessages.badKey(label), pointOf(keyStart), 'unknown-key')
        continue
      }
      // A key that a syntax error falls in (an unclosed fence's prose) was reported already.
      if (damaged(k.range)) continue
      const name = String(k.value)
      const key = prefix + name
      const keyAt = pointOf(keyStart)
      const first = seen.get(key)
      if (first !== undefined) {
        report.error(noteMessages.duplicateKey(key, label), keyAt, 'duplicate-key', {
          cause: {reason: noteMessages.firstKey(key), place: first}
        })
        continue
      }
      seen.set(key, keyAt)
      const valueNode = pair.value as Node | null
      if (damaged(valueNode?.range)) continue
      const value = isMap(valueNode)
        ? {type: 'map' as const, fields: fieldsOf(valueNode, `${key}.`, label), at: pointOf(valueNode.range?.[0] ?? keyStart)}
        : valueOf(valueNode, k.range?.[1] ?? keyStart)
      const range = valueNode?.range
      fields.push({key, keyAt, value, raw: range ? text.slice(range[0], range[1]) : ''})
    }
    return fields
  }

  const contents = doc.contents as Node | null
  if (contents === null) return {fields: [], broken: doc.errors.length > 0}
  if (!isMap(contents)) {
    const found = valueOf(contents, 0)
    if (doc.errors.length === 0) {
      report.error(noteMessages.notAMap(where, describeValue(found)), pointOf(contents.range?.[0] ?? 0), 'yaml-syntax')
    }
    return {fields: [], broken: true}
  }
  return {fields: fieldsOf(contents, '', where), broken: doc.errors.length > 0}
}

/** Flatten fields to `BlockEntry`s (nested maps give `require.noise-rms` entries). */
export function entriesOf(fields: readonly Field[]): BlockEntry[] {
  const out: BlockEntry[] = []
  for (const f of fields) {
    if (f.value.type === 'map') out.push(...entriesOf(f.value.fields))
    else out.push({key: f.key, raw: f.value.type === 'scalar' ? (f.value.text ?? '') : f.raw, line: f.keyAt.line, column: f.keyAt.column})
  }
  return out
}
