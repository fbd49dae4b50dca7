/**
 * The chain rules (issue #11 item 5): for each, one chain that triggers it and one that does not.
 */
import {describe, expect, it} from 'vitest'
import {evaluatedOf, fence, gainStage} from '../evaluate/helpers.js'

const rulesOf = (md: string): string[] => evaluatedOf(md).chains[0]!.notes.map((n) => n.rule)

/** An inverting unity stage with a pole at 1/(2π·10k·cf). */
const filterStage = (id: string, cf: string): string =>
  fence(`stage ${id}`, `topology: inverting\nopamp: precision-bipolar\nrf: 10k\nrg: 10k\ncf: ${cf}\nsupply: ±15 V\nband: 0.1 .. 10 Hz`)

describe('chain-range-underused', () => {
  it('fires when the chain uses under half of the converter range', () => {
    expect(rulesOf(gainStage('a', '9k', '1k', '-10m .. 10m V') + fence('chain c', 'stages: [a]\nadc: delta-sigma-24'))).toContain('chain-range-underused')
  })
  it('is silent when the chain uses most of it', () => {
    expect(rulesOf(gainStage('a', '210k', '1k', '-10m .. 10m V') + fence('chain c', 'stages: [a]\nadc: delta-sigma-24'))).not.toContain('chain-range-underused')
  })
})

describe('chain-later-stage-noise', () => {
  it('fires when a later stage’s noise dominates after a unity first stage', () => {
    const md = gainStage('a', '1', '1M', '-10m .. 10m V') + gainStage('b', '1M', '10k', null) + fence('chain c', 'stages: [a, b]')
    expect(rulesOf(md)).toContain('chain-later-stage-noise')
  })
  it('is silent when the gain is in the first stage', () => {
    const md = gainStage('a', '100k', '1k', '-10m .. 10m V') + gainStage('b', '1k', '1M', null) + fence('chain c', 'stages: [a, b]')
    expect(rulesOf(md)).not.toContain('chain-later-stage-noise')
  })
})

describe('chain-converter-noise', () => {
  it('fires when the converter’s own noise dominates a low-gain chain', () => {
    expect(rulesOf(gainStage('a', '1k', '1k', '-1 .. 1 V') + fence('chain c', 'stages: [a]\nadc: sar-16'))).toContain('chain-converter-noise')
  })
  it('is silent when the analog noise dominates', () => {
    expect(rulesOf(gainStage('a', '210k', '1k', '-10m .. 10m V') + fence('chain c', 'stages: [a]\nadc: delta-sigma-24'))).not.toContain('chain-converter-noise')
  })
})

describe('chain-aliasing', () => {
  it('warns when the chain’s bandwidth exceeds half the sample rate and no stage filters', () => {
    const adc = fence('adc slow', 'bits: 16\ninput: -5 .. 5 V\nsample-rate: 1 kS/s')
    const r = evaluatedOf(gainStage('a', '9k', '1k', '-0.1 .. 0.1 V') + adc + fence('chain c', 'stages: [a]\nadc: slow'))
    const n = r.chains[0]!.notes.find((x) => x.rule === 'chain-aliasing')
    expect(n?.severity).toBe('warning')
    expect(n?.text).toContain('no filter stage')
  })
  it('is silent when a pole well under fs/2 limits the bandwidth', () => {
    const adc = fence('adc slow', 'bits: 16\ninput: -5 .. 5 V\nsample-rate: 1 kS/s')
    const md = gainStage('a', '9k', '1k', '-0.1 .. 0.1 V') + filterStage('f', '1u') + adc + fence('chain c', 'stages: [a, f]\nadc: slow')
    expect(rulesOf(md)).not.toContain('chain-aliasing')
  })
})
