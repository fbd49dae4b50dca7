/**
 * The Monte Carlo histogram's marks: every label above the plot frame (no vertical line runs
 * there, so a label never lies across another mark's line), the rightmost line's label in
 * the lowest row, each right-aligned at its own line.
 */
import {describe, expect, it} from 'vitest'
import {yieldHistogramSpec} from '../../../src/report/charts/yield-histogram.js'

type Mark = {x: number; text: string; kind: string; ypix: number}
const marksOf = (spec: unknown): Mark[] => {
  const layers = (spec as {layer: {data?: {values?: unknown[]}}[]}).layer
  return layers[1]!.data!.values as Mark[]
}

describe('yieldHistogramSpec()', () => {
  it('puts the labels of close lines above the frame, the rightmost line lowest', () => {
    const spec = yieldHistogramSpec({top: 13e-3, counts: [5, 10, 3], limits: [{label: 'output-error', value: 12.5e-3}], worstCase: 10.6e-3})
    const marks = marksOf(spec)
    expect(marks.map((m) => m.kind)).toEqual(['limit', 'worst'])
    for (const m of marks) expect(m.ypix).toBeLessThan(0)
    // Row 0 (lowest, nearest the frame) is the largest x; each further row is higher and further left.
    for (let i = 1; i < marks.length; i++) {
      expect(marks[i]!.x).toBeLessThanOrEqual(marks[i - 1]!.x)
      expect(marks[i]!.ypix).toBeLessThan(marks[i - 1]!.ypix)
    }
  })
})
