/**
 * A stage's spectral view for the cascade (DESIGN §8.6): its full output noise density
 * (every source of §4.3, `shot-signal` included, and the floor without it) and its complex
 * signal transfer H(f), both from the stage's own netlist and noise sources — the same
 * solve, compiled sources and densities as the stage's noise budget (`noise/budget.ts`), so
 * any topology that is a netlist for the nodal solver chains without code of its own.
 */
import {createWorkspace, solveClosed} from '../nodal.js'
import {noiseSources} from '../noise/sources.js'
import {compileSources, outputPsdInto} from '../noise/transfer.js'
import {stageNetlist} from '../topology/index.js'
import type {StageInput} from '../types.js'
import type {StageSpectrum} from './types.js'

/** The spectral view of a stage (one workspace, reused for every frequency). */
export function stageSpectrum(input: StageInput): StageSpectrum {
  const ws = createWorkspace(stageNetlist(input))
  const compiled = compileSources(ws, noiseSources(input, ws.net))
  const k = compiled.sources.length
  const signalAt = compiled.sources.findIndex((s) => s.key === 'shot-signal')
  const scratch = new Float64Array(k)
  solveClosed(ws, 0)
  const dcGain = ws.hre
  return {
    dcGain,
    signalNoise: signalAt >= 0,
    at(f, out, offset) {
      solveClosed(ws, f)
      outputPsdInto(ws, compiled, f, scratch, 0)
      let sum = 0
      for (let i = 0; i < k; i++) sum += scratch[i]
      out[offset] = sum
      out[offset + 1] = signalAt < 0 ? sum : Math.max(0, sum - scratch[signalAt])
      out[offset + 2] = ws.hre
      out[offset + 3] = ws.him
    }
  }
}
