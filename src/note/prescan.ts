/**
 * A linear pre-scan of a note's text for structures nested deeper than the report renders,
 * run before the Markdown parser: the parser itself is slow on them (40,000 nested `[` took
 * 14 s, a 1,000-level list 27 s) or overflows its stack (100,000 `>`), so the tree check
 * after parsing comes too late. One pass over the lines, constant work per character:
 *
 * - container depth of a line: its block-quote and list markers and the list items it is inside
 *   (a stack of list-item content columns, as CommonMark nests them: a list marker indented
 *   to an open item's content column, but less than 4 columns further, opens a child item);
 * - bracket depth within a paragraph: `[` opens, `]` closes, a blank line resets.
 *
 * Lines inside fenced code are skipped. The scan errs only towards letting input through:
 * anything it lets pass is still checked on the tree after parsing.
 */
import type {Point} from 'unist'

/** A line's leading spaces, tabs to the next multiple of 4 (CommonMark). */
function indentOf(line: string, from: number): {width: number; end: number} {
  let width = 0
  let i = from
  for (; i < line.length; i++) {
    const c = line[i]
    if (c === ' ') width++
    else if (c === '\t') width += 4 - (width % 4)
    else break
  }
  return {width, end: i}
}

const LIST_MARKER = /^(?:[-+*]|\d{1,9}[.)])(?=[ \t]|$)/

/** The first place where nesting goes deeper than `max`, or null. */
export function nestingTooDeep(text: string, max: number): Point | null {
  const lines = text.split(/\r\n|\r|\n/)
  // Content columns of the open list items (by indentation), innermost last.
  const items: number[] = []
  let brackets = 0
  let prevBlank = true
  let fence: {char: string; length: number} | null = null
  for (let n = 0; n < lines.length; n++) {
    const line = lines[n]!
    if (fence !== null) {
      const close = /^[\s>]*(`{3,}|~{3,})\s*$/.exec(line)
      if (close && close[1]![0] === fence.char && close[1]!.length >= fence.length) fence = null
      continue
    }
    if (line.trim() === '') { brackets = 0; prevBlank = true; continue }
    const lead = indentOf(line, 0)
    const marker = LIST_MARKER.test(line.slice(lead.end))
    // A list marker less indented than an open item closes it; so does a paragraph after a blank line.
    if (marker || prevBlank) while (items.length > 0 && lead.width < items[items.length - 1]!) items.pop()
    prevBlank = false
    // The line's own container markers: `>` and list markers, in any order.
    let depth = items.length
    let p = 0
    let first = true
    for (;;) {
      const ind = indentOf(line, p)
      if (line[ind.end] === '>') {
        depth++
        p = ind.end + 1
      } else {
        const m = LIST_MARKER.exec(line.slice(ind.end))
        if (!m) { p = ind.end; break }
        const top = items.length > 0 ? items[items.length - 1]! : 0
        if (first && ind.width - top >= 4) { p = ind.end; break } // indented code, not a list
        const after = indentOf(line, ind.end + m[0].length)
        const gap = after.width === 0 || after.width > 4 ? 1 : after.width
        if (first) items.push(ind.width + m[0].length + gap)
        depth++
        p = ind.end + m[0].length
      }
      first = false
      if (depth > max) return {line: n + 1, column: p}
    }
    if (/^(`{3,}|~{3,})/.test(line.slice(p))) {
      const m = /^(`{3,}|~{3,})/.exec(line.slice(p))!
      fence = {char: m[1]![0]!, length: m[1]!.length}
      continue
    }
    for (let c = p; c < line.length; c++) {
      const ch = line[c]
      if (ch === '\\') c++
      else if (ch === '[') {
        if (++brackets > max) return {line: n + 1, column: c + 1}
      } else if (ch === ']' && brackets > 0) brackets--
    }
  }
  return null
}
