/**
 * Glyph coverage. pdfkit has no font fallback, so a character the font lacks would print as
 * an empty box. Every string is checked here before it is drawn: a missing glyph becomes
 * '?' and one warning per character and font is recorded.
 */
import {FONT_LABELS, type FontKey, type LoadedFonts} from './fonts.js'
import type {Warnings} from './warnings.js'

export interface GlyphChecker {
  /**
   * The text with every character `font` lacks replaced by '?'. Warns unless `report` is
   * false (for estimates measured in a font the text is not drawn in).
   */
  clean(text: string, font: FontKey, report?: boolean): string
}

export function createGlyphChecker(fonts: LoadedFonts, warnings: Warnings): GlyphChecker {
  const known = new Map<string, boolean>()
  return {
    clean(text, font, report = true) {
      let out = ''
      let changed = false
      for (const ch of text) {
        const cp = ch.codePointAt(0) ?? 0
        if (ch === '\n' || ch === '\t' || ch === '\u00ad') {
          out += ch
          continue
        }
        if (cp < 0x20 || (cp >= 0x7f && cp < 0xa0)) {
          // A control character has no glyph and can move pdfkit's line breaking: drop it.
          if (report) warnings.add(`control character U+${cp.toString(16).toUpperCase().padStart(4, '0')} removed`)
          changed = true
          continue
        }
        const key = `${font}:${cp}`
        let has = known.get(key)
        if (has === undefined) {
          has = fonts[font].hasGlyphForCodePoint(cp)
          known.set(key, has)
        }
        if (!has && report) {
          const hex = cp.toString(16).toUpperCase().padStart(4, '0')
          warnings.add(`U+${hex} not in ${FONT_LABELS[font]}`)
        }
        if (has) out += ch
        else {
          out += '?'
          changed = true
        }
      }
      return changed ? out : text
    },
  }
}
