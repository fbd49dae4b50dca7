/**
 * Reading the stages of DESIGN §8: the new topologies' keys, capacitors with tolerance, the
 * common-mode range, the load keys, the `ina` block and its archetypes, and the errors for
 * keys a topology does not take.
 */
import {describe, expect, it} from 'vitest'
import {blocksOf, inputOf} from './helpers.js'

const stage = (body: string): string => `# Note\n\n\`\`\`stage s1\n${body}\n\`\`\`\n`
const errors = (md: string): string[] => blocksOf(md).diagnostics.filter((d) => d.includes(': error: '))

describe('difference, low-pass and load keys', () => {
  it('reads a difference stage with its common-mode range and a load', () => {
    const s = inputOf(stage('topology: difference\nopamp: precision-cmos\nrg: 10k 0.1%\nrf: 20k 0.1%\nrp: 10k 0.1%\nrref: 20k 0.1%\n' +
      'input: 0 .. 50m V\ninput-cm: 4.75 .. 5.25 V\nsupply: 0 .. 5.5 V\nriso: 100\ncload: 10n\nrload: 10k\ncstray-plus: 2p'))
    expect(s.rp).toEqual({value: 10e3, tolerance: 0.001, tempco: 0})
    expect(s.rref?.value).toBe(20e3)
    expect(s.inputCm).toEqual([4.75, 5.25])
    expect(s.riso?.value).toBe(100)
    expect(s.cload).toBeCloseTo(10e-9, 20)
    expect(s.rload).toBe(10e3)
    expect(s.cstrayPlus).toBeCloseTo(2e-12, 24)
  })
  it('reads input-cm as x … x from a single value', () => {
    const s = inputOf(stage('topology: difference\nopamp: zero-drift\nrg: 10k\nrf: 10k\nrp: 10k\nrref: 10k\ninput: 10m V\ninput-cm: 2.5 V\nsupply: ±5 V'))
    expect(s.inputCm).toEqual([2.5, 2.5])
  })
  it('reads capacitors with and without tolerance', () => {
    const s = inputOf(stage('topology: lowpass-mfb\nopamp: zero-drift\nr1: 10k\nr2: 10k\nr3: 10k\nc1: 1 nF 2%\nc2: 22n\ninput: 1 V\nsupply: ±5 V'))
    expect(s.c1?.value).toBeCloseTo(1e-9, 20)
    expect(s.c1?.tolerance).toBeCloseTo(0.02, 12)
    expect(s.c2).toEqual({value: expect.closeTo(22e-9, 20), tolerance: 0})
    const d = blocksOf(stage('topology: lowpass-mfb\nopamp: zero-drift\nr1: 10k\nr2: 10k\nr3: 10k\nc1: 1 nF 2%\nc2: 22n\ninput: 1 V\nsupply: ±5 V')).stages[0]!.defaulted
    expect(d).toContainEqual({key: 'c2.tolerance', value: '0 %'})
  })
  it('refuses keys a topology does not take, naming the topology', () => {
    expect(errors(stage('topology: noninverting\nopamp: zero-drift\nrf: 10k\nrg: 1k\nrp: 10k\ninput: 1 V\nsupply: ±5 V')).join('\n')).toMatch(/rp/)
    expect(errors(stage('topology: lowpass-sallen-key\nopamp: zero-drift\nr1: 10k\nr2: 10k\nr3: 10k\nc1: 1n\nc2: 1n\ninput: 1 V\nsupply: ±5 V')).join('\n')).toMatch(/r3.*lowpass-sallen-key/)
    expect(errors(stage('topology: instrumentation\nina: precision-ina\nrg: 499\ncload: 1n\ninput: 10m V\nsupply: ±5 V')).join('\n')).toMatch(/cload/)
  })
  it('reports missing required keys of the new topologies', () => {
    const e = errors(stage('topology: difference\nopamp: zero-drift\nrg: 10k\nrf: 10k\ninput: 10m V\nsupply: ±5 V')).join('\n')
    expect(e).toMatch(/rp/)
    expect(e).toMatch(/rref/)
  })
  it('reports rg without rf on a Sallen-Key stage', () => {
    expect(errors(stage('topology: lowpass-sallen-key\nopamp: zero-drift\nr1: 10k\nr2: 10k\nrg: 10k\nc1: 1n\nc2: 1n\ninput: 1 V\nsupply: ±5 V')).join('\n')).toMatch(/rg.*without.*rf/)
  })
  it('offers a did-you-mean hint for a misspelt new key', () => {
    expect(errors(stage('topology: difference\nopamp: zero-drift\nrg: 10k\nrf: 10k\nrp: 10k\nrrref: 10k\ninput: 10m V\nsupply: ±5 V')).join('\n')).toMatch(/did you mean `rref`/)
  })
})

describe('ina blocks and instrumentation stages', () => {
  const INA = '```ina my-ina\ninput-type: bipolar\ngain-constant: 49.4k\nvos-in: 25 uV\nvos-out: 200 uV\nib: 1 nA\nios: 0.5 nA\n' +
    'en-in: 8 nV/√Hz\nen-out: 60 nV/√Hz\nin: 0.1 pA/√Hz\ncmrr: 120 dB\npsrr: 115 dB\ngbw: 1.5 MHz\nnonlinearity: 5 ppm\ngain-error: 0.02 %\n```\n'
  const INA_STAGE = '```stage s1\ntopology: instrumentation\nina: my-ina\nrg: 499 0.1%\nrs: 175\ninput: -10m .. 10m V\ninput-cm: 2.5 V\nsupply: ±15 V\n```\n'
  it('reads an ina block and resolves it from a stage', () => {
    const s = inputOf(`# Note\n\n${INA}\n${INA_STAGE}`)
    expect(s.ina?.name).toBe('my-ina')
    expect(s.ina?.gainConstant).toBe(49.4e3)
    expect(s.ina?.nonlinearity).toBeCloseTo(5e-6, 15)
    expect(s.ina?.gainError).toBeCloseTo(2e-4, 15)
    expect(s.opamp.name).toBe('my-ina')
  })
  it('resolves an INA archetype, and refuses an op-amp key on an instrumentation stage', () => {
    expect(inputOf(`# Note\n\n${INA_STAGE.replace('my-ina', 'zero-drift-ina')}`).ina?.archetype).toBe(true)
    expect(errors(`# Note\n\n${INA_STAGE.replace('ina: my-ina', 'ina: precision-ina\nopamp: zero-drift')}`).join('\n')).toMatch(/opamp/)
  })
  it('reports an unknown ina with a hint and a missing required ina key', () => {
    expect(errors(`# Note\n\n${INA_STAGE.replace('my-ina', 'precision-inaa')}`).join('\n')).toMatch(/did you mean `precision-ina`/)
    expect(errors(`# Note\n\n${INA.replace('gbw: 1.5 MHz\n', '')}\n${INA_STAGE}`).join('\n')).toMatch(/gbw/)
  })
})
