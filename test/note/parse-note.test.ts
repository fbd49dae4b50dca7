import {readFileSync} from 'node:fs'
import {describe, expect, it} from 'vitest'
import {ARCHETYPES} from '../../src/engine/archetypes.js'
import type {StageInput} from '../../src/engine/types.js'
import {blocksOf, errorsOf, inputOf, noteOf} from './helpers.js'

const good = readFileSync(new URL('../fixtures/note/good.md', import.meta.url), 'utf8')
// dB to linear voltage ratio is 10^(dB/20) (common practice).
const dB = (x: number): number => 10 ** (x / 20)

describe('parseNote() on a good note', () => {
  it('raises no diagnostics', () => {
    expect(noteOf(good).diagnostics).toEqual([])
  })

  it('reads the front matter', () => {
    expect(noteOf(good).note.meta).toEqual({
      title: 'Weigh-scale front end',
      document: 'DOC-0042',
      revision: 'B',
      date: '2026-11-30',
      author: 'Kim Osei',
      reviewers: [
        {name: 'Ann Lee', role: 'Approver'},
        {name: 'Bo Varga', role: 'Reviewer'},
        {name: '', role: 'Quality'}
      ],
      project: 'Bench scale',
      status: 'for-review',
      context: ['battery'],
      template: null
    })
  })

  it('yields the full noninverting StageInput in SI', () => {
    const expected: StageInput = {
      id: 'bridge-amp',
      title: 'Bridge amplifier',
      topology: 'noninverting',
      opamp: {
        name: 'scale-amp', archetype: false, inputType: 'bipolar',
        vos: 60e-6, vosDrift: 0.6e-6, ib: 2e-9, ios: 1.8e-9, ibMax: 4e-9, iosMax: null, ibDoubling: null,
        en: 9e-9, enCorner: 4, in: 0.15e-12, inCorner: 60, gbw: 1.2e6,
        aol: dB(126), pmUnity: 60, cmrr: dB(120), psrr: dB(118), vcmRef: null,
        cinDiff: 3e-12, cinCm: 4e-12, slew: 0.5e6, swingHeadroom: 1.2,
        swingHeadroomNeg: null, swingHeadroomPos: null, cmHeadroom: null, cmHeadroomNeg: null, cmHeadroomPos: null,
        ioutMax: null, rout: null
      },
      rf: {value: 49.9e3, tolerance: 0.1e-2, tempco: 25e-6},
      rg: {value: 1e3, tolerance: 0.1e-2, tempco: 25e-6},
      rs: {value: 350, tolerance: 0, tempco: 0},
      rcomp: null,
      ccomp: 0,
      cf: 0,
      cstray: 2e-12,
      rshunt: null,
      csource: 0,
      idark: 0,
      idarkMax: null,
      idarkDoubling: 10,
      vref: 0,
      rp: null, rref: null, r1: null, r2: null, r3: null, c1: null, c2: null,
      riso: null, cload: 0, cstrayPlus: 0, inputCm: [0, 0], ina: null,
      input: [-10e-3, 10e-3],
      supply: [-15, 15],
      supplyTolerance: 0.02,
      temperature: [-40, 85],
      temperatureEntered: true,
      band: [0.1, 1e3],
      noiseTemperature: 40,
      signalFrequency: null,
      rload: null,
      calibration: 'none',
      require: {'output-error': 3e-3, 'noise-rms': 30e-6, 'phase-margin': 50, bandwidth: 2e3}
    }
    expect(inputOf(good, 'bridge-amp')).toEqual(expected)
  })

  it('resolves an archetype and reads a transimpedance stage (input in A)', () => {
    const s = inputOf(good, 'photo-rx')
    expect(s.opamp).toEqual(ARCHETYPES['precision-jfet'])
    expect(s).toMatchObject({
      topology: 'transimpedance', rf: {value: 10e6, tolerance: 0.01, tempco: 0}, rg: null, rs: null,
      cf: 1e-12, rshunt: 1e9, csource: 20e-12, idark: 50e-12, vref: 0.5, input: [0, 100e-9], supply: [0, 5],
      supplyTolerance: 0.05, temperature: [25, 25], band: [0.1, 10e3], noiseTemperature: 25, title: 'photo-rx'
    })
  })

  it('lists what it defaulted', () => {
    const {stages, opamps} = blocksOf(good)
    expect(stages[1]?.defaulted).toEqual([
      {key: 'title', value: 'photo-rx'},
      {key: 'rcomp', value: 'none (0 Ω)'},
      {key: 'ccomp', value: '0 F'},
      {key: 'cstray', value: '0 F'},
      {key: 'cstray-plus', value: '0 F'},
      {key: 'riso', value: 'none (a wire)'},
      {key: 'cload', value: '0 F'},
      {key: 'idark-max', value: 'not entered (idark doubled every idark-doubling above 25 °C)'},
      {key: 'idark-doubling', value: '10 K'},
      {key: 'signal-frequency', value: 'the band’s top'},
      {key: 'rload', value: 'none'},
      {key: 'calibration', value: 'none'},
      {key: 'supply-tolerance', value: '5 %'},
      {key: 'temperature', value: '25 … 25 °C'},
      {key: 'band', value: '100 mHz … 10 kHz'},
      {key: 'noise-temperature', value: '25 °C'},
      {key: 'rf.tempco', value: '0 ppm/K'}
    ])
    expect(opamps[0]?.defaulted.map((d) => d.key)).toEqual(['ios-max', 'ib-doubling', 'vcm-ref', 'swing-headroom-neg', 'swing-headroom-pos',
      'cm-headroom', 'cm-headroom-neg', 'cm-headroom-pos', 'iout-max', 'rout'])
  })

  it('keeps the entries as written with their places in the file', () => {
    const {stages} = blocksOf(good)
    expect(stages[0]?.entries.slice(3, 4)).toEqual([{key: 'rf', raw: '49.9k 0.1% 25ppm/K', line: 47, column: 1}])
    expect(stages[0]?.entries.find((e) => e.key === 'require.noise-rms')).toEqual({key: 'require.noise-rms', raw: '30 uV', line: 60, column: 3})
  })

  it('replaces blocks in the tree, keeps their position, and drops the front matter', () => {
    const {note} = noteOf(good)
    expect(note.tree.children.map((c) => c.type)).toEqual(['heading', 'paragraph', 'opampBlock', 'stageBlock', 'stageBlock', 'code'])
    expect(note.stages[0]?.position?.start).toEqual({line: 43, column: 1, offset: expect.any(Number)})
    expect(note.tree.children[3]).toBe(note.stages[0])
  })

  it('reads a note with prose only as valid, with no blocks', () => {
    const {note, diagnostics} = noteOf('# Notes\n\nNothing to evaluate here.\n')
    expect(diagnostics).toEqual([])
    expect(note.stages).toEqual([])
    expect(note.meta.status).toBe('draft')
  })

  it('reads an empty file without messages', () => {
    const {note, diagnostics} = noteOf('')
    expect(diagnostics).toEqual([])
    expect(note.tree.children).toEqual([])
  })

  it('accepts numbers that YAML reads as numbers (`rs: 350`, `rcomp: 0`)', () => {
    const s = inputOf(good.replace('rs: 350', 'rs: 1e3'), 'bridge-amp')
    expect(s.rs?.value).toBe(1000)
    expect(s.rcomp).toBeNull()
  })

  it('reads a follower without rf as a wire', () => {
    const md = good.replace(/```stage bridge-amp[\s\S]*?```/, '```stage buf\ntopology: follower\nopamp: zero-drift\ninput: 0 .. 2 V\nsupply: 5 V\n```')
    const s = inputOf(md, 'buf')
    expect(s.rf).toBeNull()
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([])
  })
})
