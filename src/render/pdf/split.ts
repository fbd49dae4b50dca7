/**
 * Splitting one-style text at a height: the longest head that fits, and the tail that goes
 * on the next page. Used for table cells taller than what is left of a page and for code
 * blocks. Nothing is dropped: head + tail always hold every character.
 */
import {measureText, type RenderContext, type TextStyle} from './context.js'
import {maxCharsInBox} from './long-words.js'

export interface Split {
  head: string
  tail: string
}

/** Largest index in `candidates` (ascending) whose head fits; -1 when none does. */
function largestFitting(candidates: number[], fits: (end: number) => boolean): number {
  let lo = 0
  let hi = candidates.length - 1
  let best = -1
  while (lo <= hi) {
    const mid = (lo + hi) >> 1
    if (fits(candidates[mid] as number)) {
      best = mid
      lo = mid + 1
    } else hi = mid - 1
  }
  return best
}

/**
 * Splits `text` so the head, drawn at `width` in `style`, is at most `maxHeight` tall.
 * `lines`: break only after newlines when possible (code), else after spaces (prose).
 */
export function splitToHeight(ctx: RenderContext, text: string, style: TextStyle, width: number, maxHeight: number, lines = false): Split {
  const fits = (end: number): boolean => measureText(ctx, text.slice(0, end).replace(/\s+$/, ''), style, width) <= maxHeight
  // No head longer than the box can hold is ever tried: each split measures one page's worth
  // of text, not the whole rest (which made a long cell or code block quadratic).
  const window = maxCharsInBox(width, maxHeight, style.size, measureText(ctx, 'Ag', style, width))
  if (text.length <= window && fits(text.length)) return {head: text, tail: ''}
  const scope = Math.min(text.length, window + 1)
  const pattern = lines ? /\n/g : /\s+/g
  const boundaries: number[] = []
  for (const m of text.slice(0, scope).matchAll(pattern)) {
    const end = (m.index ?? 0) + m[0].length
    if (end < text.length) boundaries.push(end)
  }
  let best = largestFitting(boundaries, fits)
  if (best < 0 && lines) {
    const words: number[] = []
    for (const m of text.slice(0, scope).matchAll(/[ \t]+/g)) words.push((m.index ?? 0) + m[0].length)
    best = largestFitting(words, fits)
    if (best >= 0) return cut(text, words[best] as number, lines)
  }
  if (best >= 0) return cut(text, boundaries[best] as number, lines)
  const chars: number[] = []
  for (let i = 1; i < scope; i++) chars.push(i)
  const c = largestFitting(chars, fits)
  return c < 0 ? {head: '', tail: text} : cut(text, chars[c] as number, lines)
}

function cut(text: string, end: number, lines: boolean): Split {
  const head = text.slice(0, end).replace(/\s+$/, '')
  const rest = text.slice(end)
  return {head, tail: lines ? rest.replace(/^\n/, '') : rest.replace(/^\s+/, '')}
}
