/**
 * Bounded line work for hostile text. pdfkit breaks a word wider than its line by measuring
 * what is left of the word after every piece it cuts off (and caches each measurement), so
 * its time and memory grow with the square of the word's length: one 100,000-character
 * word exhausted the heap. Here a word that is certainly wider than the line is cut first,
 * in one pass over its characters' advances, into pieces that each fill a line, with a line
 * break between them (and one before the word, which starts on a fresh line), so pdfkit
 * only ever wraps words that fit. The characters themselves are unchanged.
 *
 * And the other bound: how many characters at most fit in a box, from the narrowest advance
 * of a printing DejaVu glyph, so that splitting a long cell or code block at a page only
 * ever measures the text one page can hold.
 */

/**
 * Narrowest advance of a printing character, as a fraction of the font size: 0.166 em in
 * DejaVu Sans (U+02E1), 0.219 em in the bold faces, 0.602 em in Sans Mono (read from the
 * fonts' advance widths with fontkit); 0.15 em leaves a margin, so the bounds below are
 * never too small.
 */
export const MIN_ADVANCE_EM = 0.15

/** Marks, joiners and selectors attach to the character before them: no cut before one. */
const ATTACHES = /[\p{M}\u200c\u200d\ufe00-\ufe0f]/u

/** Most characters a line `width` wide can hold at `size` (an upper bound). */
export function maxCharsPerLine(width: number, size: number): number {
  return Math.max(1, Math.ceil(Math.max(width, 1) / (MIN_ADVANCE_EM * Math.max(size, 0.1))))
}

/**
 * `text` with every word longer than a line `width` wide can hold at `size` cut into
 * line-wide pieces (advances from `advance`, one call per distinct character); other words
 * untouched. Linear in the text's length.
 */
export function breakLongWords(text: string, width: number, size: number, advance: (ch: string) => number): string {
  const limit = maxCharsPerLine(width, size)
  if (text.length <= limit) return text
  const widths = new Map<string, number>()
  const widthOf = (ch: string): number => {
    let w = widths.get(ch)
    if (w === undefined) { w = advance(ch); widths.set(ch, w) }
    return w
  }
  // Kerning is not summed here: a little room keeps each piece inside the line.
  const target = Math.max(width * 0.97 - 0.5, 1)
  return text.replace(/\S+/g, (word, at: number) => {
    if (word.length <= limit) return word
    const pieces: string[] = []
    let piece = ''
    let used = 0
    for (const ch of word) {
      const w = widthOf(ch)
      if (piece !== '' && !ATTACHES.test(ch) && used + w > target) {
        pieces.push(piece)
        piece = ''
        used = 0
      }
      piece += ch
      used += w
    }
    if (piece !== '') pieces.push(piece)
    const fresh = at === 0 || text[at - 1] === '\n'
    return `${fresh ? '' : '\n'}${pieces.join('\n')}`
  })
}

/**
 * Most characters that can fit in a box `width` × `height` at `size` with lines `lineHeight`
 * apart: more than this is certainly taller than the box.
 */
export function maxCharsInBox(width: number, height: number, size: number, lineHeight: number): number {
  const lines = Math.max(1, Math.floor(Math.max(height, 0) / Math.max(lineHeight, 0.1)) + 1)
  return lines * (maxCharsPerLine(width, size) + 1)
}
