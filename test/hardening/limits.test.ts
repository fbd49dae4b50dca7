/**
 * The bounds behind the hostile-note fixes, as units: the long-word cutter keeps every
 * character and fills lines, and the nesting pre-scan finds bombs at the right place and
 * lets ordinary notes through. No timing here (the bench measures speed).
 */
import {readdirSync, readFileSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {breakLongWords, maxCharsInBox, maxCharsPerLine} from '../../src/render/pdf/long-words.js'
import {nestingTooDeep} from '../../src/note/prescan.js'
import {ROOT} from '../cli/helpers.js'

describe('breakLongWords()', () => {
  const advance = (ch: string): number => (ch === 'i' ? 2 : 6)

  it('leaves words that fit a line alone', () => {
    const text = 'short words only, a line of them '.repeat(20)
    expect(breakLongWords(text, 300, 10, advance)).toBe(text)
  })

  it('cuts a long word into pieces no wider than the line, keeping every character', () => {
    const word = 'ab'.repeat(2000)
    const out = breakLongWords(`before ${word} after`, 300, 10, advance)
    expect(out.replace(/\n/g, '')).toBe(`before ${word} after`)
    const pieces = out.split('\n')
    expect(pieces[0]).toBe('before ')
    for (const p of pieces.slice(1, -1)) expect(p.length * 6).toBeLessThanOrEqual(300)
    // Every piece but the last is full: no room for one more character.
    for (const p of pieces.slice(1, -2)) expect((p.length + 1) * 6).toBeGreaterThan(300 * 0.97 - 0.5)
  })

  it('never cuts before a combining mark', () => {
    const word = 'e\u0301'.repeat(3000)
    for (const p of breakLongWords(word, 100, 10, (ch) => (ch === '\u0301' ? 0 : 6)).split('\n')) expect(p.startsWith('\u0301')).toBe(false)
  })

  it('bounds characters per line and per box from above', () => {
    // The narrowest DejaVu advance is 0.166 em: a 100 pt line at 10 pt holds at most 61 of them.
    expect(maxCharsPerLine(100, 10)).toBeGreaterThanOrEqual(61)
    expect(maxCharsInBox(100, 120, 10, 12)).toBeGreaterThanOrEqual(11 * 61)
  })
})

describe('nestingTooDeep()', () => {
  it('finds a block-quote, list and bracket bomb at its deepest-allowed-plus-one place', () => {
    expect(nestingTooDeep(`a\n\n${'>'.repeat(100)} x`, 64)).toEqual({line: 3, column: 65})
    expect(nestingTooDeep(`a\n\n${'['.repeat(100)}`, 64)).toEqual({line: 3, column: 65})
    expect(nestingTooDeep(Array.from({length: 100}, (_, i) => `${'  '.repeat(i)}- x`).join('\n'), 64)?.line).toBe(65)
    expect(nestingTooDeep(`${'- > '.repeat(40)}x`, 64)?.line).toBe(1)
  })

  it('lets through brackets split by blank lines, inside code fences, and escaped', () => {
    expect(nestingTooDeep(`${'['.repeat(40)}\n\n${'['.repeat(40)}`, 64)).toBeNull()
    expect(nestingTooDeep(`\`\`\`\n${'['.repeat(100)}\n\`\`\`\n`, 64)).toBeNull()
    expect(nestingTooDeep('\\['.repeat(100), 64)).toBeNull()
  })

  it('lets every sample note through', () => {
    const dir = join(ROOT, 'sample-designs')
    for (const f of readdirSync(dir).filter((n) => n.endsWith('.md'))) expect(nestingTooDeep(readFileSync(join(dir, f), 'utf8'), 64), f).toBeNull()
  })
})
