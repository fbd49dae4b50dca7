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

describe('chain-riso-divider', () => {
  const invStage = (id: string, rg: string, extra = ''): string =>
    fence(`stage ${id}`, `topology: inverting\nopamp: precision-bipolar\nrf: 10k\nrg: ${rg}\nsupply: ±15 V\nband: 0.1 .. 10 Hz${extra}`)
  const mfbStage = fence('stage m', 'topology: lowpass-mfb\nopamp: precision-bipolar\nr1: 4.99k\nr2: 10k\nr3: 10k\nc1: 10n\nc2: 100n\nsupply: ±15 V\nband: 0.1 .. 10 Hz')
  const skStage = fence('stage s', 'topology: lowpass-sallen-key\nopamp: precision-bipolar\nr1: 10k\nr2: 10k\nc1: 100n\nc2: 47n\nsupply: ±15 V\nband: 0.1 .. 10 Hz')
  const notesOf = (md: string) => evaluatedOf(md).chains[0]!.notes.filter((n) => n.rule === 'chain-riso-divider')

  it('fires where a stage with riso drives an inverting stage, with riso/(riso + rg) and its LSB at full scale', () => {
    const md = gainStage('a', '9k', '1k', '-0.1 .. 0.1 V', '\nriso: 100') + invStage('b', '10k') + fence('chain c', 'stages: [a, b]\nadc: sar-16')
    const r = evaluatedOf(md)
    const n = r.chains[0]!.notes.filter((x) => x.rule === 'chain-riso-divider')
    expect(n).toHaveLength(1)
    expect(n[0]!.severity).toBe('caution')
    const divider = 100 / (100 + 10e3)
    expect(n[0]!.text).toContain(`${(divider * 100).toPrecision(3)} %`)
    expect(n[0]!.text).toContain('0.990 %')
    // Carried to the chain output's full scale, in LSB of the converter (sar-16 archetype).
    const c = r.chains[0]!.result
    const fs = Math.max(...c.outputSpan.map(Math.abs))
    expect(n[0]!.text).toContain(`${((divider * fs) / c.converter!.lsb).toPrecision(3)} LSB`)
  })

  it('fires into a multiple-feedback filter’s r1 (a DC gain error) and a Sallen–Key r1 (the response only)', () => {
    const mfb = notesOf(gainStage('a', '9k', '1k', '-0.1 .. 0.1 V', '\nriso: 49.9') + mfbStage + fence('chain c', 'stages: [a, m]'))
    expect(mfb).toHaveLength(1)
    expect(mfb[0]!.text).toContain(`${((49.9 / (49.9 + 4990)) * 100).toPrecision(3)} %`)
    expect(mfb[0]!.text).toContain('gain error')
    const sk = notesOf(gainStage('a', '9k', '1k', '-0.1 .. 0.1 V', '\nriso: 49.9') + skStage + fence('chain c', 'stages: [a, s]'))
    expect(sk).toHaveLength(1)
    expect(sk[0]!.text).toContain('draws no current')
  })

  it('with an rload of its own on the driving stage, only the further division by Rin in parallel (the stage counts riso into rload)', () => {
    const n = notesOf(gainStage('a', '9k', '1k', '-0.1 .. 0.1 V', '\nriso: 100\nrload: 10k') + invStage('b', '10k') + fence('chain c', 'stages: [a, b]'))
    expect(n).toHaveLength(1)
    // By hand (voltage divider): the pin sees riso into rload ∥ Rin = 5 kΩ: 5000/5100; the stage counts 10000/10100.
    const missing = 1 - (5000 / 5100) / (10000 / 10100)
    expect(missing).toBeCloseTo(0.0098039, 6)
    expect(n[0]!.text).toContain(`${(missing * 100).toPrecision(3)} %`)
    expect(n[0]!.text).toContain('rload = 10 kΩ')
  })

  it('is silent with no riso, into a non-inverting input, and on the last stage (into the converter)', () => {
    expect(notesOf(gainStage('a', '9k', '1k', '-0.1 .. 0.1 V') + invStage('b', '10k') + fence('chain c', 'stages: [a, b]'))).toEqual([])
    expect(notesOf(gainStage('a', '9k', '1k', '-0.1 .. 0.1 V', '\nriso: 100') + gainStage('b', '1k', '1k', null) + fence('chain c', 'stages: [a, b]'))).toEqual([])
    expect(notesOf(gainStage('a', '9k', '1k', '-0.1 .. 0.1 V') + invStage('b', '10k', '\nriso: 100') + fence('chain c', 'stages: [a, b]\nadc: sar-16'))).toEqual([])
  })
})
