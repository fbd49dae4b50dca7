import {describe, expect, it} from 'vitest'
import {create} from 'fontkit'
import {faceOfWeight, hasGlyphs, measureText} from '../../../src/report/charts/fonts.js'
import {FONTS} from './helpers.js'

describe('faceOfWeight()', () => {
  it.each([
    ['bold', 'bold'], ['bolder', 'bold'], [700, 'bold'], ['600', 'bold'],
    [undefined, 'regular'], ['normal', 'regular'], [400, 'regular'], ['lighter', 'regular'], [500, 'regular']
  ] as const)('maps %j to %s', (weight, face) => {
    expect(faceOfWeight(weight)).toBe(face)
  })
})

describe('measureText()', () => {
  it('sums the DejaVu advance widths at the size given', () => {
    const font = create(FONTS.regular)
    const em = [...'10 kHz'].reduce((w, c) => w + font.glyphForCodePoint(c.codePointAt(0) ?? 0).advanceWidth, 0) / font.unitsPerEm
    expect(measureText(FONTS, 'regular', 10, '10 kHz')).toBeCloseTo(em * 10, 10)
  })

  it('measures bold wider than regular', () => {
    expect(measureText(FONTS, 'bold', 10, 'Frequency (Hz)')).toBeGreaterThan(measureText(FONTS, 'regular', 10, 'Frequency (Hz)'))
  })

  it('gives 0 for empty text or a zero size', () => {
    expect(measureText(FONTS, 'regular', 10, '')).toBe(0)
    expect(measureText(FONTS, 'regular', 0, 'x')).toBe(0)
  })
})

describe('hasGlyphs()', () => {
  it('finds µ, √, −, ° and × in DejaVu Sans', () => {
    expect(hasGlyphs(FONTS, 'regular', 'µ√−°×Ω')).toBe(true)
  })

  it('reports a character DejaVu Sans lacks', () => {
    expect(hasGlyphs(FONTS, 'regular', 'a\u4E2D')).toBe(false)
  })
})
