/**
 * Input-technology alternatives (DESIGN §8.8), src/evaluate/alternatives.ts: the candidates
 * of a stage, each candidate's figures against a separate evaluation of the stage built with
 * that amplifier directly, the score's order, and how the note and the option switch it on.
 */
import {describe, expect, it} from 'vitest'
import {VFile} from 'vfile'
import {ARCHETYPES, ARCHETYPE_NAMES} from '../../src/engine/archetypes.js'
import {evaluateStage} from '../../src/engine/index.js'
import {INA_ARCHETYPES, INA_ARCHETYPE_NAMES, inaAsOpamp} from '../../src/engine/ina-archetypes.js'
import type {OpampParams, StageInput, StageResult} from '../../src/engine/types.js'
import {candidatesOf, compareScores, evaluateAlternatives, type AlternativeScore} from '../../src/evaluate/alternatives.js'
import type {OpampBlockNode} from '../../src/note/types.js'
import {res, stageFrom, testOpamp} from '../support/stage-input.js'
import {evaluatedOf, fence, gainStage} from './helpers.js'

const opampBlock = (id: string, opamp: OpampParams | null): OpampBlockNode => ({type: 'opampBlock', id, entries: [], opamp, defaulted: []})

/** A noninverting gain of 11 on 100 kΩ / 10 kΩ from a 20 kΩ source with rcomp: bias currents matter. */
const overrides = (opamp: OpampParams): Partial<StageInput> => ({
  opamp, rf: res(100e3, 0.001, 25e-6), rg: res(10e3, 0.001, 25e-6), rs: res(20e3), rcomp: res(10e3, 0.01),
  temperature: [-20, 70], require: {'output-error': 5e-3, 'noise-rms': 20e-6, 'phase-margin': 45}
})
const NOTE_AMP = testOpamp({name: 'note-amp', inputType: 'jfet', ib: 8e-12, ios: 3e-12})

function alternativesOf(input: StageInput, blocks: OpampBlockNode[] = []) {
  const file = new VFile()
  return {alts: evaluateAlternatives(input, evaluateStage(input), blocks, file), messages: file.messages}
}

/** The largest DC contributor, found here by sorting (not by the code under test). */
const largest = (r: StageResult): string | null => {
  const sorted = [...r.dc.contributors].sort((a, b) => b.output - a.output)
  return sorted[0] !== undefined && sorted[0].output > 0 ? sorted[0].key : null
}

describe('candidatesOf()', () => {
  it('lists the note’s op-amp blocks first, then the six archetypes', () => {
    const input = stageFrom('rules', overrides({...ARCHETYPES['precision-bipolar']}))
    expect(candidatesOf(input, [opampBlock('note-amp', NOTE_AMP)]).map((c) => c.name)).toEqual(['note-amp', ...ARCHETYPE_NAMES])
  })

  it('leaves out a block with errors and an ina block, and lets a block take an archetype’s name', () => {
    const input = stageFrom('rules', overrides({...ARCHETYPES['precision-bipolar']}))
    const ina: OpampBlockNode = {...opampBlock('my-ina', null), ina: {...INA_ARCHETYPES['general-ina'], name: 'my-ina', archetype: false}}
    const shadow = testOpamp({name: 'zero-drift'})
    const list = candidatesOf(input, [opampBlock('broken', null), ina, opampBlock('zero-drift', shadow)])
    expect(list.map((c) => `${c.name}:${c.source}`)).toEqual(['zero-drift:block', ...ARCHETYPE_NAMES.filter((n) => n !== 'zero-drift').map((n) => `${n}:archetype`)])
  })

  it('gives an instrumentation stage the ina blocks and the INA archetypes', () => {
    const ina = INA_ARCHETYPES['general-ina']
    const input = stageFrom('rules', {topology: 'instrumentation', ina: {...ina}, opamp: inaAsOpamp(ina), rf: null, rg: res(4.99e3, 0.001), inputCm: [2, 3]})
    const block: OpampBlockNode = {...opampBlock('my-ina', null), ina: {...INA_ARCHETYPES['precision-ina'], name: 'my-ina', archetype: false}}
    expect(candidatesOf(input, [block, opampBlock('note-amp', NOTE_AMP)]).map((c) => c.name)).toEqual(['my-ina', ...INA_ARCHETYPE_NAMES])
  })
})

describe('evaluateAlternatives()', () => {
  const stage = stageFrom('rules', overrides({...ARCHETYPES['precision-bipolar']}))
  const {alts, messages} = alternativesOf(stage, [opampBlock('note-amp', NOTE_AMP)])

  it('evaluates every candidate without a message', () => {
    expect(alts.candidates.map((c) => c.candidate)).toEqual(['note-amp', ...ARCHETYPE_NAMES])
    expect(messages).toEqual([])
  })

  // Each candidate against the stage built with that op-amp directly (the test builder, not withCandidate).
  it.each([['note-amp', NOTE_AMP] as const, ...ARCHETYPE_NAMES.map((n) => [n, ARCHETYPES[n]] as const)])(
    'gives %s the figures of a separate evaluation of the stage built with it', (name, opamp) => {
      const separate = evaluateStage(stageFrom('rules', overrides({...opamp})))
      const a = alts.candidates.find((c) => c.candidate === name)!
      expect(a.inputType).toBe(opamp.inputType)
      expect(a.result.dc.worstCaseOutput).toBe(separate.dc.worstCaseOutput)
      expect(a.result.noise.outputRms).toBe(separate.noise.outputRms)
      expect(a.result.stability.phaseMargin).toBe(separate.stability.phaseMargin)
      expect(a.result.requirements.map((r) => [r.key, r.met])).toEqual(separate.requirements.map((r) => [r.key, r.met]))
      expect(a.dominant).toBe(largest(separate))
    })

  it('runs a candidate’s Monte Carlo only when a yield requirement is judged on it (the table shows no yield)', () => {
    const withRun = {...stage, yield: {trials: 2000, seed: 1, distribution: 'uniform' as const}}
    const shown = evaluateAlternatives(withRun, evaluateStage(withRun), [], new VFile())
    for (const c of shown.candidates) expect(c.result.yield === null).toBe(!c.current)
    const required = {...withRun, require: {...withRun.require, 'output-error': 5e-3, yield: 0.99}}
    const judged = evaluateAlternatives(required, evaluateStage(required), [], new VFile())
    for (const c of judged.candidates) {
      expect(c.result.yield?.trials).toBe(2000)
      // The yield verdict equals that of a separate evaluation with the same Monte Carlo.
      const separate = evaluateStage({...required, opamp: {...ARCHETYPES[c.candidate as keyof typeof ARCHETYPES]}})
      const verdict = (r: StageResult) => r.requirements.find((q) => q.key === 'yield')
      expect(verdict(c.result)?.met).toBeTypeOf('boolean')
      expect(verdict(c.result)).toEqual(verdict(separate))
    }
  })

  it('marks the op-amp in use, and only it, as current, reusing the stage’s own result', () => {
    const own = evaluateStage(stage)
    const r = evaluateAlternatives(stage, own, [], new VFile())
    expect(r.candidates.filter((c) => c.current).map((c) => c.candidate)).toEqual(['precision-bipolar'])
    expect(r.candidates.find((c) => c.current)!.result).toBe(own)
  })

  it('leaves out a candidate the engine refuses, with a warning that names it', () => {
    const {alts: r, messages: m} = alternativesOf(stage, [opampBlock('no-gbw', testOpamp({name: 'no-gbw', gbw: 0}))])
    expect(r.candidates.map((c) => c.candidate)).toEqual([...ARCHETYPE_NAMES])
    expect(m.map((x) => [x.fatal, x.ruleId, x.reason.split(':')[0]])).toEqual([[false, 'alternative-failed', 'Alternative `no-gbw` of stage `test-stage` could not be evaluated']])
  })

  it('differs between candidates where the input type matters: the JFET’s bias terms are far below the general bipolar’s', () => {
    const ibOf = (name: string): number => alts.candidates.find((c) => c.candidate === name)!.result.dc.contributors.find((c) => c.key === 'ios')!.output
    expect(ibOf('precision-jfet')).toBeLessThan(ibOf('general-bipolar') / 1000)
  })

  it('gives an instrumentation stage’s candidates the figures of a separate evaluation with that INA', () => {
    const base = (name: (typeof INA_ARCHETYPE_NAMES)[number]): StageInput => {
      const ina = INA_ARCHETYPES[name]
      return stageFrom('rules', {topology: 'instrumentation', ina: {...ina}, opamp: inaAsOpamp(ina), rf: null, rg: res(4.99e3, 0.001), inputCm: [2, 3], input: [-0.01, 0.01]})
    }
    const {alts: inaAlts} = alternativesOf(base('general-ina'))
    for (const name of INA_ARCHETYPE_NAMES) {
      const a = inaAlts.candidates.find((c) => c.candidate === name)!
      const separate = evaluateStage(base(name))
      expect([name, a.result.dc.worstCaseOutput, a.result.noise.outputRms]).toEqual([name, separate.dc.worstCaseOutput, separate.noise.outputRms])
    }
  })
})

describe('compareScores()', () => {
  const score = (s: Partial<AlternativeScore>): AlternativeScore => ({notMet: 0, dcRatio: 0.5, dcRequirement: 'output-error', worstCaseOutput: 1e-3, outputRms: 1e-6, ...s})

  it('ranks fewer verdicts not met first, whatever the DC error', () => {
    expect(compareScores(score({notMet: 0, dcRatio: 0.9}), score({notMet: 1, dcRatio: 0.1}))).toBeLessThan(0)
  })

  it('then the smaller DC error relative to its requirement', () => {
    expect(compareScores(score({dcRatio: 0.2, outputRms: 9e-6}), score({dcRatio: 0.3, outputRms: 1e-6}))).toBeLessThan(0)
  })

  it('then the lower noise', () => {
    expect(compareScores(score({outputRms: 2e-6}), score({outputRms: 1e-6}))).toBeGreaterThan(0)
  })

  it('uses the worst-case output error when the stage states no DC requirement', () => {
    expect(compareScores(score({dcRatio: null, worstCaseOutput: 2e-3}), score({dcRatio: null, worstCaseOutput: 1e-3}))).toBeGreaterThan(0)
  })

  it('puts first a candidate no other candidate of the stage beats', () => {
    const stage = stageFrom('rules', overrides({...ARCHETYPES['precision-bipolar']}))
    const {alts} = alternativesOf(stage)
    const best = alts.candidates[alts.ranking[0]!]!
    for (const c of alts.candidates) expect(compareScores(best.score, c.score)).toBeLessThanOrEqual(0)
    expect(alts.ranking.slice().sort()).toEqual(alts.candidates.map((_, i) => i))
  })
})

describe('alternatives in a note', () => {
  const note = (extra: string): string => gainStage('amp', '100k', '10k', '-10m .. 10m V', `\nrs: 20k\nrcomp: 9.09k${extra}`)

  it('are evaluated for a stage that says `alternatives: true`', () => {
    const {stages, diagnostics} = evaluatedOf(note('\nalternatives: true'))
    expect(diagnostics.filter((d) => d.includes('error'))).toEqual([])
    expect(stages[0]!.alternatives?.candidates.map((c) => c.candidate)).toEqual([...ARCHETYPE_NAMES])
  })

  it('are null for a stage that says nothing or `alternatives: false`', () => {
    expect(evaluatedOf(note('')).stages[0]!.alternatives).toBeNull()
    expect(evaluatedOf(note('\nalternatives: false')).stages[0]!.alternatives).toBeNull()
  })

  it('include the note’s op-amp blocks, defined above or below the stage', () => {
    const amp = (id: string): string => fence(`opamp ${id}`, 'input-type: cmos\nvos: 100 uV\nib: 1 pA\nios: 1 pA\nen: 15 nV/√Hz\nin: 1 fA/√Hz\ngbw: 2 MHz\naol: 110 dB\npm-unity: 60 deg\ncmrr: 100 dB\npsrr: 100 dB')
    const {stages} = evaluatedOf(amp('above-amp') + note('\nalternatives: true') + amp('below-amp'))
    expect(stages[0]!.alternatives?.candidates.slice(0, 2).map((c) => `${c.candidate}:${c.inputType}`)).toEqual(['above-amp:cmos', 'below-amp:cmos'])
  })

  it('give an instrumentation stage the note’s ina blocks, the one in use marked, and the INA archetypes', async () => {
    const {readFileSync} = await import('node:fs')
    const {join} = await import('node:path')
    const md = readFileSync(join(import.meta.dirname, '..', 'fixtures', 'topologies', 'instrumentation.md'), 'utf8')
    const {stages} = evaluatedOf(md.replace('band: 0.1 .. 1k Hz', 'band: 0.1 .. 1k Hz\nalternatives: true'))
    const alts = stages[0]!.alternatives!
    expect(alts.candidates.map((c) => `${c.candidate}${c.current ? ' (in use)' : ''}`)).toEqual(['my-ina (in use)', ...INA_ARCHETYPE_NAMES])
  })

  it('are evaluated for every stage with the option on', async () => {
    const {parseNote} = await import('../../src/note/index.js')
    const {evaluateNote} = await import('../../src/evaluate/index.js')
    const md = gainStage('one', '10k', '1k', '-10m .. 10m V') + gainStage('two', '20k', '1k', '-10m .. 10m V')
    const file = new VFile({path: 'note.md', value: md})
    const evs = evaluateNote(parseNote(file), file, {alternatives: true})
    expect(evs.map((ev) => ev.alternatives?.candidates.length)).toEqual([ARCHETYPE_NAMES.length, ARCHETYPE_NAMES.length])
  })
})
