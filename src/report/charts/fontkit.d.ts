/**
 * The slice of fontkit 2 that the chart text measurement uses. fontkit ships no types, so
 * this module declaration covers only what `fonts.ts` calls. Interfaces only (no type
 * aliases), so that a wider declaration elsewhere in the project merges with this one.
 */
declare module 'fontkit' {
  export interface Glyph {
    /** Advance width, font units. */
    advanceWidth: number
  }
  export interface Font {
    familyName: string
    /** Font units per em. */
    unitsPerEm: number
    glyphForCodePoint(codePoint: number): Glyph
    hasGlyphForCodePoint(codePoint: number): boolean
  }
  /** Parse font bytes (a single TTF/OTF; collections are not used here). */
  export function create(buffer: Uint8Array, postscriptName?: string): Font
}
