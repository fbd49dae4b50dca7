/**
 * The evaluate phase of chains (DESIGN §8.6): later stages take the previous output range,
 * a given input off by more than 1 % of the span is a warning, and the chain uses each
 * stage's own evaluation.
 */
import {describe, expect, it} from 'vitest'
import {outputSpanOf} from '../../src/evaluate/index.js'
import {evaluatedOf, fence, gainStage} from './helpers.js'

describe('evaluateNoteWithChains()', () => {
  it('gives a later stage the previous stage’s output range as its input', () => {
    const r = evaluatedOf(gainStage('a', '9k', '1k', '-10m .. 20m V') + gainStage('b', '1k', '1k', null) + fence('chain c', 'stages: [a, b]'))
    const b = r.stages.find((s) => s.input.id === 'b')!
    expect(b.input.input[0]).toBeCloseTo(-0.1, 12)
    expect(b.input.input[1]).toBeCloseTo(0.2, 12)
    expect(r.chains[0]!.result.gain).toBeCloseTo(20, 9)
    expect(r.diagnostics.filter((d) => d.includes('differs'))).toEqual([])
  })

  it('warns at a given input more than 1 % of the span away, and uses the computed range', () => {
    const r = evaluatedOf(gainStage('a', '9k', '1k', '-10m .. 10m V') + gainStage('b', '1k', '1k', '-0.1 .. 0.103 V') + fence('chain c', 'stages: [a, b]'))
    expect(r.diagnostics.filter((d) => d.includes('differs'))).toHaveLength(1)
    expect(r.diagnostics.find((d) => d.includes('differs'))).toMatch(/^15:1: warning: Stage `b`: its `input`/)
    expect(r.stages[1]!.input.input[1]).toBeCloseTo(0.1, 12)
  })

  it('accepts a given input within 1 % of the span without a word', () => {
    const r = evaluatedOf(gainStage('a', '9k', '1k', '-10m .. 10m V') + gainStage('b', '1k', '1k', '-0.1 .. 0.101 V') + fence('chain c', 'stages: [a, b]'))
    expect(r.diagnostics.filter((d) => d.includes('differs'))).toEqual([])
  })

  it('evaluates the stages of a chain in signal order whatever their order in the note', () => {
    const r = evaluatedOf(gainStage('b', '1k', '1k', null) + gainStage('a', '4k', '1k', '0 .. 1 V') + fence('chain c', 'stages: [a, b]'))
    expect(r.stages.map((s) => s.input.id)).toEqual(['b', 'a'])
    expect(r.stages[0]!.input.input).toEqual([0, 5])
    expect(r.chains[0]!.result.nodes.map((n) => n.output[1])).toEqual([5, 10])
  })

  it('carries each stage’s DC contributors with its id as the source', () => {
    const r = evaluatedOf(gainStage('a', '9k', '1k', '-10m .. 10m V') + gainStage('b', '1k', '1k', null) + fence('chain c', 'stages: [a, b]\nadc: sar-18'))
    const c = r.chains[0]!.result
    const a = r.stages[0]!.result
    expect(c.dc.contributors.filter((x) => x.source === 'a').map((x) => x.key)).toEqual(a.dc.contributors.map((x) => x.key))
    expect(c.dc.contributors.filter((x) => x.source === 'sar-18')).toHaveLength(5)
  })
})

describe('a chain whose first stage is an instrumentation amplifier', () => {
  const inaStage = fence('stage front', 'topology: instrumentation\nina: precision-ina\nrg: 494 0.1% 10ppm/K\nrs: 175\ninput: -10m .. 10m V\ninput-cm: 2.5 V\nsupply: ±15 V\nband: 0.1 .. 10 Hz')

  it('evaluates from the block model, the next stage taking its output range', () => {
    const r = evaluatedOf(inaStage + gainStage('b', '1k', '1k', null) + fence('chain c', 'stages: [front, b]\nadc: delta-sigma-24'))
    expect(r.diagnostics.filter((d) => d.includes('error'))).toEqual([])
    const front = r.stages.find((s) => s.input.id === 'front')!
    const b = r.stages.find((s) => s.input.id === 'b')!
    expect(b.input.input[1]).toBeCloseTo(front.result.gain * 0.01, 9)
    const c = r.chains[0]!.result
    expect(c.gain).toBeCloseTo(front.result.gain * 2, 9)
    // Σ ek·Π|Gj| of the later stages from the stages' own results.
    const stages = front.result.dc.worstCaseOutput * 2 + b.result.dc.worstCaseOutput
    const converter = c.dc.contributors.filter((x) => x.source === 'delta-sigma-24').reduce((s, x) => s + x.output, 0)
    expect(c.dc.worstCaseOutput / (stages + converter)).toBeCloseTo(1, 12)
    expect(c.dc.contributors.filter((x) => x.source === 'front').map((x) => x.key)).toContain('gain-error')
  })

  it('takes the instrumentation stage’s residuals under the chain’s calibration when the stage states none', () => {
    const r = evaluatedOf(inaStage + gainStage('b', '1k', '1k', null) + fence('chain c', 'stages: [front, b]\ncalibration: offset-and-gain'))
    const cal = r.chains[0]!.result.dc.calibrated!
    const front = cal.contributors.filter((x) => x.source === 'front')
    expect(front.find((x) => x.key === 'vos')!.output).toBe(0)
    expect(front.find((x) => x.key === 'gain-error')!.output).toBe(0)
    expect(front.find((x) => x.key === 'psrr')!.output).toBeGreaterThan(0)
    expect(cal.worstCaseOutput).toBeLessThan(r.chains[0]!.result.dc.worstCaseOutput)
  })
})

describe('outputSpanOf()', () => {
  it('gives an instrumentation stage’s G·vd + vref from its block model (no netlist)', () => {
    const md = fence('stage front', 'topology: instrumentation\nina: precision-ina\nrg: 494\ninput: -10m .. 20m V\nvref: 0.5 V\nsupply: ±15 V\nband: 0.1 .. 10 Hz')
    const r = evaluatedOf(md)
    const s = r.stages[0]!
    const g = s.result.gain
    const [lo, hi] = outputSpanOf(s.input)
    expect(lo).toBeCloseTo(-0.01 * g + 0.5, 12)
    expect(hi).toBeCloseTo(0.02 * g + 0.5, 12)
    expect(lo).toBeCloseTo(s.result.swing.outputSpan[0], 12)
    expect(hi).toBeCloseTo(s.result.swing.outputSpan[1], 12)
  })
})
