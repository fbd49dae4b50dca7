/**
 * Positions: turning a place inside a fenced block's (or the front matter's) value into a
 * line and column of the Markdown file.
 *
 * remark gives the fence's position; value line k (1-based) is Markdown line
 * `start.line + k`. Inside list items and block quotes the container prefix is stripped
 * from each value line, so the column is shifted by what was stripped: raw line length −
 * value line length. When a tab in the prefix was expanded to spaces the two lengths do
 * not line up; then the shift is found by matching the line's text after its indentation.
 * The text is split on CRLF, CR and LF, and a leading BOM is dropped, as remark does.
 */
import type {Point, Position} from 'unist'

/** The note's text as lines, as remark numbers them. */
export interface SourceText {
  /** Lines without their line endings; line n is `lines[n - 1]`. */
  readonly lines: readonly string[]
}

/** Maps a 1-based line and column inside a value to a Markdown point. */
export type PointMapper = (line: number, column: number) => Point

const LINE_BREAK = /\r\n|\r|\n/

/** Split the note's text into lines (BOM removed). */
export function sourceOf(text: string): SourceText {
  return {lines: text.replace(/^\uFEFF/, '').split(LINE_BREAK)}
}

/** The raw Markdown line `line` (1-based), '' when out of range. */
export const rawLine = (source: SourceText, line: number): string => source.lines[line - 1] ?? ''

/** The column in `raw` of column `column` of `value`, where `value` is `raw` less a prefix. */
export function shiftColumn(raw: string, value: string, column: number): number {
  if (raw.endsWith(value)) return column + raw.length - value.length
  const text = value.trimStart()
  const indent = value.length - text.length
  if (!raw.endsWith(text)) return column
  const textStart = raw.length - text.length
  return Math.max(1, textStart + 1 + (column - 1 - indent))
}

/**
 * A mapper for a node whose first line is a marker (the opening fence, or `---`) and
 * whose `value` starts on the next line.
 */
export function valueMapper(source: SourceText, node: {value: string; position?: Position | undefined}): PointMapper {
  const start = node.position?.start ?? {line: 1, column: 1}
  const valueLines = node.value.split(LINE_BREAK)
  return (line, column) => {
    const mdLine = start.line + line
    const value = valueLines[line - 1]
    if (value === undefined) return {line: mdLine, column}
    return {line: mdLine, column: shiftColumn(rawLine(source, mdLine), value, column)}
  }
}
