/**
 * Small readings a new user met (issue: reviewer-ready figures): `±x` on every range key, a
 * milliohm source with its unit written out, a bare linear ratio on a dB key, and a one-value
 * supply listed with the defaults applied; the new keys of DESIGN §4.6.
 */
import {describe, expect, it} from 'vitest'
import {unitsMessages} from '../../src/units/index.js'
import {blocksOf} from './helpers.js'

const OPAMP = [
  '```opamp amp-a', 'input-type: bipolar', 'vos: 60 uV', 'ib: 2 nA', 'ios: 1.8 nA', 'en: 9 nV/√Hz',
  'in: 0.15 pA/√Hz', 'gbw: 1.2 MHz', 'aol: 126 dB', 'pm-unity: 60 deg', 'cmrr: 120 dB', 'psrr: 118 dB', '```'
]
const BODY = ['topology: noninverting', 'opamp: amp-a', 'rf: 49.9k 0.1% 25ppm/K', 'rg: 1.00k', 'input: -10m .. 10m V', 'supply: ±15 V']
const note = (body: string[] = BODY, opamp: string[] = OPAMP): string => `${opamp.join('\n')}\n\n\`\`\`stage gain-a\n${body.join('\n')}\n\`\`\`\n`
const withLine = (key: string, line: string): string[] => [...BODY.filter((l) => !l.startsWith(`${key}:`)), line]

describe('readings', () => {
  it('reads `input: ±10 mV` as −10 … 10 mV, and `temperature: ±40 °C` likewise', () => {
    const r = blocksOf(note([...withLine('input', 'input: ±10 mV'), 'temperature: ±40 °C']))
    expect(r.diagnostics).toEqual([])
    expect(r.stages[0]?.input?.input).toEqual([-10e-3, 10e-3])
    expect(r.stages[0]?.input?.temperature).toEqual([-40, 40])
  })
  it('does not warn on `rs: 10 mΩ` with the unit written out, but does on a bare `rs: 10m`', () => {
    expect(blocksOf(note([...BODY, 'rs: 10 mΩ'])).diagnostics).toEqual([])
    expect(blocksOf(note([...BODY, 'rs: 10m'])).diagnostics.join('\n')).toMatch(/did you mean `M`/)
  })
  it('says that a bare number on a dB key is dB and suggests the dB figure (`cmrr: 1e6` → 120 dB)', () => {
    const r = blocksOf(note(BODY, OPAMP.map((l) => (l.startsWith('cmrr:') ? 'cmrr: 1e6' : l))))
    expect(r.diagnostics[0]).toBe(`11:7: error: ${unitsMessages.bareDecibel('1e6', 120, ' for `cmrr`')}`)
    expect(r.diagnostics[0]).toContain('`120 dB`')
  })
  it('lists a one-value supply (`15 V` = 0 … 15 V) with the defaults applied', () => {
    const r = blocksOf(note(withLine('supply', 'supply: 15 V').map((l) => (l.startsWith('input:') ? 'input: 0 .. 10m V' : l))))
    expect(r.stages[0]?.input?.supply).toEqual([0, 15])
    expect(r.stages[0]?.defaulted.find((d) => d.key === 'supply')?.value).toMatch(/^0 … 15 V \(written as one value/)
  })
  it('reads the limit and calibration keys (DESIGN §4.6)', () => {
    const r = blocksOf(note([...BODY, 'signal-frequency: 2 kHz', 'rload: 2k', 'calibration: offset-and-gain'],
      [...OPAMP.slice(0, -1), 'cm-headroom-neg: -0.1 V', 'cm-headroom-pos: 1.5 V', 'swing-headroom-pos: 0.2 V', 'iout-max: 20 mA', 'rout: 40', 'slew: 2 V/us', '```']))
    expect(r.diagnostics).toEqual([])
    const s = r.stages[0]!.input!
    expect(s).toMatchObject({signalFrequency: 2e3, rload: 2e3, calibration: 'offset-and-gain'})
    expect(s.opamp).toMatchObject({cmHeadroomNeg: -0.1, cmHeadroomPos: 1.5, cmHeadroom: null, swingHeadroom: null, swingHeadroomPos: 0.2, ioutMax: 20e-3, rout: 40, slew: 2e6})
  })
  it('refuses an unknown calibration with a hint', () => {
    const r = blocksOf(note([...BODY, 'calibration: offset-gain']))
    expect(r.diagnostics.join('\n')).toMatch(/calibration/)
    expect(r.stages[0]?.input).toBeNull()
  })
})
