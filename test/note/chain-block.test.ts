/**
 * `adc` and `chain` blocks (DESIGN §8.5, §8.6): values in V or LSB, archetypes, and every
 * positioned error of a chain's stage list.
 */
import {describe, expect, it} from 'vitest'
import {chainMessages} from '../../src/note/chain-messages.js'
import {noteMessages} from '../../src/note/index.js'
import {unitsMessages} from '../../src/units/index.js'
import {errorsOf, fence, noteOf} from './helpers.js'

const stage = (id: string, extra = '', input = 'input: -10m .. 10m V\n'): string => fence(`stage ${id}`,
  `topology: noninverting\nopamp: precision-bipolar\nrf: 9k\nrg: 1k\n${input}supply: ±15 V${extra}`)

describe('adc blocks', () => {
  it('reads noise, offset and drift given in LSB as volts with the block’s own LSB = span/2^bits', () => {
    const {note, diagnostics} = noteOf(fence('adc conv', 'bits: 16\ninput: 0 .. 4.096 V\nnoise: 0.5 LSB\noffset: 2 LSB\noffset-drift: 0.1 LSB/K\ninl: 3\ngain-error: 0.02 %\ngain-drift: 5 ppm/K\nsample-rate: 250 kS/s'))
    expect(errorsOf(diagnostics)).toEqual([])
    const adc = note.adcs?.[0]?.adc
    const lsb = 4.096 / 65536
    expect(adc?.noise).toBeCloseTo(0.5 * lsb, 15)
    expect(adc?.offset).toBeCloseTo(2 * lsb, 15)
    expect(adc?.offsetDrift).toBeCloseTo(0.1 * lsb, 15)
    expect(adc?.inl).toBe(3)
    expect(adc?.gainError).toBeCloseTo(2e-4, 15)
    expect(adc?.gainDrift).toBeCloseTo(5e-6, 15)
    expect(adc?.sampleRate).toBe(250e3)
  })

  it('reads volts as volts', () => {
    const {note} = noteOf(fence('adc conv', 'bits: 24\ninput: -2.5 .. 2.5 V\nnoise: 0.6 uV\noffset: 20 uV'))
    expect(note.adcs?.[0]?.adc?.noise).toBeCloseTo(0.6e-6, 15)
    expect(note.adcs?.[0]?.adc?.offset).toBeCloseTo(20e-6, 15)
  })

  it('refuses bits that are not a whole number, at the value', () => {
    const {diagnostics} = noteOf(fence('adc conv', 'bits: 16.5\ninput: 0 .. 5 V'))
    expect(errorsOf(diagnostics)).toEqual([`2:7: error: ${chainMessages.bitsNotInteger('16.5')}`])
  })

  it('refuses LSB on a stage key: the unit is legal only on converter keys', () => {
    const {diagnostics} = noteOf(stage('a', '\ncstray: 2 LSB'))
    expect(errorsOf(diagnostics)).toEqual([`8:11: error: ${unitsMessages.lsbNotHere('LSB', 'capacitance', ' for `cstray`')}`])
  })

  it('requires bits and input', () => {
    const {diagnostics} = noteOf(fence('adc conv', 'noise: 1 uV'))
    expect(errorsOf(diagnostics)).toEqual([
      `1:8: error: ${noteMessages.missingKey('input', 'adc `conv`', 'in every adc block')}`,
      `1:8: error: ${noteMessages.missingKey('bits', 'adc `conv`', 'in every adc block')}`
    ])
  })
})

describe('chain blocks', () => {
  it('reads stages in signal order, the converter archetype and the defaults from the stages', () => {
    const md = stage('a', '\ntemperature: 0 .. 50 °C') + stage('b', '\nband: 1 .. 100 Hz', '') + fence('chain c', 'stages: [a, b]\nadc: delta-sigma-24\nrequire:\n  noise-free-bits: 17\n  alias-rejection: 60 dB\n  error-lsb: 8')
    const {note, diagnostics} = noteOf(md)
    expect(errorsOf(diagnostics)).toEqual([])
    const c = note.chains?.[0]?.input
    expect(c?.stages).toEqual(['a', 'b'])
    expect(c?.adc?.name).toBe('delta-sigma-24')
    expect(c?.temperature).toEqual([0, 50])
    expect(c?.band).toEqual([1, 100])
    expect(c?.require['alias-rejection']).toBeCloseTo(60, 10)
    expect(c?.require['error-lsb']).toBe(8)
    expect(note.stages[1]?.inputFromChain).toBe(true)
  })

  it('still requires `input` on the first stage of a chain', () => {
    const md = stage('a', '', '') + stage('b') + fence('chain c', 'stages: [a, b]')
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([`1:10: error: ${noteMessages.missingKey('input', 'stage `a`', 'in every stage')}`])
  })

  it('names an unknown stage at its place, with a hint', () => {
    const md = stage('amp') + fence('chain c', 'stages: [amp, ampp]')
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([`10:15: error: ${chainMessages.unknownStage('ampp', 'chain `c`', 'amp')}`])
  })

  it('refuses a stage named twice, pointing at the first', () => {
    const md = stage('a') + fence('chain c', 'stages: [a, a]')
    const {file} = noteOf(md)
    const m = file.messages.find((x) => x.ruleId === 'stage-repeated')
    expect(m?.reason).toBe(chainMessages.stageRepeated('a'))
    expect([m?.line, m?.column]).toEqual([10, 13])
    expect((m?.cause as {place?: {line: number; column: number}} | undefined)?.place).toMatchObject({line: 10, column: 10})
  })

  it('refuses a stage defined below the chain', () => {
    const md = fence('chain c', 'stages: [a]') + stage('a')
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([`2:10: error: ${chainMessages.stageDefinedLater('a', 4)}`])
  })

  it('refuses a stage in two chains', () => {
    const md = stage('a') + fence('chain c1', 'stages: [a]') + fence('chain c2', 'stages: [a]')
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([`13:10: error: ${chainMessages.stageInTwoChains('a', 'c1')}`])
  })

  it('refuses a transimpedance stage after the first place', () => {
    const tia = fence('stage t', 'topology: transimpedance\nopamp: precision-jfet\nrf: 1M\ninput: 0 .. 1u A\nsupply: ±5 V')
    const md = stage('a') + tia + fence('chain c', 'stages: [a, t]')
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([`17:13: error: ${chainMessages.onlyFirst('t', 'transimpedance')}`])
  })

  it('refuses converter requirements on a chain without a converter', () => {
    const md = stage('a') + fence('chain c', 'stages: [a]\nrequire:\n  noise-free-bits: 16')
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([`12:3: error: ${chainMessages.lsbWithoutConverter('noise-free-bits')}`])
  })

  it('names an unknown converter with the archetypes', () => {
    const md = stage('a') + fence('chain c', 'stages: [a]\nadc: sar-17')
    const errors = errorsOf(noteOf(md).diagnostics)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toContain('Unexpected converter `sar-17`')
  })
})
