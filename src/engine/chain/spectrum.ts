/**
 * A stage's spectral view for the cascade (DESIGN §8.6): its full output noise density
 * (every source of §4.3, `shot-signal` included, and the floor without it) and its complex
 * signal transfer H(f), both from the stage's own netlist and noise sources — the same
 * solve, compiled sources and densities as the stage's noise budget (`noise/budget.ts`), so
 * any topology that is a netlist for the nodal solver chains without code of its own.
 *
 * An instrumentation stage has no netlist (DESIGN §8.2): its view is the block model of
 * `../instrumentation.ts` — the same output densities as its own noise budget (en-in, en-out,
 * in+, in-, r:rs, r:rg, each already through |H|²) and H = G/(1 + jf/(gbw/G)).
 */
import {INA_NOISE_KEYS, inaDensitiesInto, inaGain, inaTransfer} from '../instrumentation.js'
import {createWorkspace, solveClosed} from '../nodal.js'
import {noiseSources} from '../noise/sources.js'
import {compileSources, outputPsdInto} from '../noise/transfer.js'
import {stageNetlist} from '../topology/index.js'
import type {StageInput} from '../types.js'
import type {StageSpectrum} from './types.js'

/** The spectral view of a stage (one workspace, reused for every frequency). */
export function stageSpectrum(input: StageInput): StageSpectrum {
  if (input.topology === 'instrumentation') return instrumentationSpectrum(input)
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

/** The spectral view of an instrumentation stage, from the block model (see module header). */
export function instrumentationSpectrum(input: StageInput): StageSpectrum {
  if (input.ina === null || input.rg === null) throw new RangeError(`Unexpected instrumentation stage \`${input.id}\` without \`ina\` or \`rg\`, expected both`)
  const k = INA_NOISE_KEYS.length
  const scratch = new Float64Array(k)
  return {
    dcGain: inaGain(input.ina, input.rg.value),
    signalNoise: false,
    at(f, out, offset) {
      inaDensitiesInto(input, f, scratch, 0)
      let sum = 0
      for (let i = 0; i < k; i++) sum += scratch[i]
      const [re, im] = inaTransfer(input, f)
      out[offset] = sum
      out[offset + 1] = sum
      out[offset + 2] = re
      out[offset + 3] = im
    }
  }
}
