/**
 * A fenced code block's info string is printed above it as "Code · LANG", so a short one
 * ("c") never stands alone like a stray letter; checked on the load-cell sample's PDF.
 */
import {describe, expect, it} from 'vitest'
import {readPdf} from './helpers.js'
import {pdfOf, sample} from '../report/helpers.js'

describe('the label of a fenced code block', async () => {
  const {pdf} = await pdfOf(sample('load-cell-bridge.md'))
  const text = (await readPdf(pdf)).pages.join('\n')

  it('names the block as code with its language', () => {
    expect(text).toContain('Code · c')
    expect(text).toMatch(/Code · c\s+\/\* two-point calibration/)
  })
})
