import {describe, expect, it} from 'vitest'
import {shiftColumn, sourceOf, valueMapper} from '../../src/note/place.js'

describe('sourceOf()', () => {
  it('splits CRLF, CR and LF and drops a BOM', () => {
    expect(sourceOf('\uFEFFa\r\nb\rc\nd').lines).toEqual(['a', 'b', 'c', 'd'])
  })
})

describe('shiftColumn()', () => {
  it.each([
    ['rf: 1k', 'rf: 1k', 5, 5],
    ['  rf: 1k', 'rf: 1k', 5, 7],
    ['> rf: 1k', 'rf: 1k', 1, 3],
    ['\trf: 1k', '  rf: 1k', 3, 2],
    ['\trf: 1k', '  rf: 1k', 7, 6]
  ])('maps column in %j (value %j) col %d to %d', (raw, value, column, expected) => {
    expect(shiftColumn(raw, value, column)).toBe(expected)
  })
})

describe('valueMapper()', () => {
  it('puts value line k on Markdown line start.line + k', () => {
    const source = sourceOf('text\n\n- ```stage s\n  rf: 1k\n  ```\n')
    const map = valueMapper(source, {value: 'rf: 1k', position: {start: {line: 3, column: 3}, end: {line: 5, column: 6}}})
    expect(map(1, 5)).toEqual({line: 4, column: 7})
  })
})
