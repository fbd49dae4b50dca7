/**
 * Facts about a fenced block that remark does not give directly: where its id is on the
 * opening line, and whether the fence was closed (an unclosed fence runs to the end of its
 * container, LIBRARY-NOTES). Works on the raw Markdown lines of `place.ts`.
 */
import type {Code} from 'mdast'
import type {Point} from 'unist'
import {rawLine, type SourceText} from './place.js'

export interface FenceInfo {
  /** The id (the info string after the language), or null when none. */
  id: string | null
  /** Where the id starts; the opening fence when there is no id. */
  idAt: Point
  /** The opening fence. */
  fenceAt: Point
  /** False when the document (or container) ended before a closing fence. */
  closed: boolean
}

/** Ids are one word: letters, digits, `-`, `_`, `.`, starting with a letter or digit. */
export const isValidId = (id: string): boolean => /^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(id)

/** Read the opening and closing lines of `code`. */
export function fenceInfo(code: Code, source: SourceText): FenceInfo {
  const start = code.position?.start ?? {line: 1, column: 1}
  const end = code.position?.end ?? start
  const fenceAt: Point = {line: start.line, column: start.column}
  const opening = rawLine(source, start.line).slice(start.column - 1)
  const m = /^(`{3,}|~{3,})(\s*)(\S+)(\s*)(.*?)\s*$/.exec(opening)
  const meta = code.meta?.trim() ?? ''
  const id = meta === '' ? null : meta
  const idAt: Point = m && id !== null
    ? {line: start.line, column: start.column + (m[1] ?? '').length + (m[2] ?? '').length + (m[3] ?? '').length + (m[4] ?? '').length}
    : fenceAt
  const fence = m?.[1] ?? '```'
  const last = rawLine(source, end.line).replace(/^[\s>]*/, '')
  const closing = /^(`{3,}|~{3,})\s*$/.exec(last)?.[1]
  const closed = end.line > start.line && closing !== undefined && closing[0] === fence[0] && closing.length >= fence.length
  return {id, idAt, fenceAt, closed}
}
