/**
 * The `alternatives` entry of a stage's JSON (DESIGN §8.8) and what `compare` makes of it.
 */
import {describe, expect, it} from 'vitest'
import {ARCHETYPE_NAMES} from '../../src/engine/archetypes.js'
import {compareRuns, type RunJson} from '../../src/results/compare.js'
import {jsonStage, type JsonStage} from '../../src/results/json.js'
import {evaluatedOf, gainStage} from '../evaluate/helpers.js'

const stageJson = (extra: string): JsonStage => {
  const {stages} = evaluatedOf(gainStage('amp', '100k', '10k', '-10m .. 10m V', `\nrs: 20k\nrcomp: 9.09k${extra}\nrequire:\n  output-error: 2 mV\n  noise-rms: 20 uV`))
  return jsonStage(stages[0]!)
}

describe('jsonStage() alternatives', () => {
  it('is null when the stage does not ask for them', () => {
    expect(stageJson('').alternatives).toBeNull()
  })

  it('has one row per candidate with the contract’s fields, in order', () => {
    const rows = stageJson('\nalternatives: true').alternatives!
    expect(rows.map((r) => r.candidate)).toEqual([...ARCHETYPE_NAMES])
    for (const r of rows) {
      expect(Object.keys(r)).toEqual(['candidate', 'inputType', 'worstCaseOutput', 'outputRms', 'phaseMargin', 'dominant', 'met', 'current', 'best'])
      expect(Object.keys(r.met)).toEqual(['output-error', 'noise-rms', 'output-swing', 'input-common-mode', 'slew', 'output-current'])
    }
    expect(rows.filter((r) => r.current).map((r) => r.candidate)).toEqual(['precision-bipolar'])
    expect(rows.filter((r) => r.best)).toHaveLength(1)
  })

  it('gives the op-amp in use the stage’s own figures', () => {
    const s = stageJson('\nalternatives: true')
    const own = s.alternatives!.find((r) => r.current)!
    expect([own.worstCaseOutput, own.outputRms, own.phaseMargin]).toEqual([s.dc.worstCaseOutput, s.noise.outputRms, s.stability.phaseMargin])
    expect(own.met['output-error']).toBe(s.requirements.find((r) => r.key === 'output-error')!.met)
  })
})

describe('compareRuns() with alternatives', () => {
  const run = (s: JsonStage): RunJson => ({files: [{file: 'note.md', stages: [s]}]})

  it('lists a changed alternative’s figures and counts no regression', () => {
    const before = stageJson('\nalternatives: true')
    const after: JsonStage = {...before, alternatives: before.alternatives!.map((r) => (r.candidate === 'zero-drift' ? {...r, worstCaseOutput: r.worstCaseOutput * 2, met: {...r.met, 'output-error': false}} : r))}
    const c = compareRuns(run(before), run(after))
    expect(c.changes.map((x) => x.name)).toEqual(['alternatives.zero-drift.worstCaseOutput'])
    expect(c.flips).toEqual([])
    expect(c.regressed).toBe(false)
  })

  it('reads a result written without alternatives', () => {
    const s = stageJson('')
    const {alternatives: _drop, ...old} = s
    expect(compareRuns(run(old as JsonStage), run(s)).changes).toEqual([])
  })
})
