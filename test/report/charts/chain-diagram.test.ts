/**
 * The chain's block diagram: boxes in order without overlap inside the frame, and range
 * labels that do not run into each other (a second row when they would), for a short and
 * a long chain.
 */
import {describe, expect, it} from 'vitest'
import {chainDiagramSpec, type ChainDiagramInput} from '../../../src/report/charts/chain-diagram.js'

type Layer = {data: {values: Record<string, unknown>[]}; mark: {type: string; align?: string; baseline?: string; fontSize?: number}}
const layersOf = (d: ChainDiagramInput): Layer[] => (chainDiagramSpec(d) as unknown as {layer: Layer[]}).layer

const box = (title: string, l1: string, l2: string, converter = false) => ({title, lines: [l1, l2] as [string, string], converter})
const short: ChainDiagramInput = {inputLabel: '−10 mV … 10 mV', boxes: [box('amp', 'Non-inverting', 'G = 221.8 V/V'), box('adc', '24 bits', '−2.5 V … 2.5 V', true)], nodeLabels: ['−2.22 V … 2.22 V']}
const long: ChainDiagramInput = {
  inputLabel: '−10 mV … 10 mV',
  boxes: [box('front', 'Instrumentation', 'G = 101 V/V'), box('gain2', 'Inverting', 'G = −2 V/V'), box('sk', 'Sallen-Key', 'G = 1 V/V'),
    box('mfb', 'Multiple-feedback', 'G = −1 V/V'), box('sar-18', '18 bits', '−4.1 V … 4.1 V', true)],
  nodeLabels: ['−1.01 V … 1.01 V', '−2.02 V … 2.02 V', '−2.02 V … 2.02 V', '−2.02 V … 2.02 V']
}

describe('chainDiagramSpec()', () => {
  it.each([['two boxes', short], ['five boxes', long]])('%s: boxes in order, apart, inside the frame', (_, d) => {
    const rects = layersOf(d).find((l) => l.mark.type === 'rect')!.data.values as {x: number; x2: number}[]
    expect(rects).toHaveLength(d.boxes.length)
    rects.forEach((r, i) => {
      expect(r.x2).toBeGreaterThan(r.x)
      if (i > 0) expect(r.x).toBeGreaterThan(rects[i - 1]!.x2 + 2)
    })
    expect(rects[0]!.x).toBeGreaterThan(1)
    expect(rects[rects.length - 1]!.x2).toBeLessThanOrEqual(100)
  })

  it('gives a box with a longer line a wider box (Multiple-feedback against Inverting)', () => {
    const rects = layersOf(long).find((l) => l.mark.type === 'rect')!.data.values as {x: number; x2: number}[]
    expect(rects[3]!.x2 - rects[3]!.x).toBeGreaterThan(1.5 * (rects[1]!.x2 - rects[1]!.x))
  })

  it('drops a range label that would touch its neighbour to a second row, and keeps a short chain on one', () => {
    // The range labels are the text layers hung from their top (the box lines are centred).
    const ys = (d: ChainDiagramInput) => layersOf(d).filter((l) => l.mark.type === 'text' && l.mark.baseline === 'top')
      .flatMap((l) => l.data.values.map((v) => v['y'] as number))
    expect(new Set(ys(short)).size).toBe(1)
    expect(new Set(ys(long)).size).toBe(2)
  })
})
