/**
 * Hand-built stages and results for rule tests, so that most rules can be tested without the
 * engine. All values are invented. A result is assembled from the contributors a test names;
 * totals (worst case, RSS, noise rms and p-p) are worked out from them as the engine would.
 */
import {ARCHETYPES} from '../../src/engine/archetypes.js'
import type {
  BiasUsed, DcKey, NoiseKey, OpampParams, RequirementResult, Stability, StageInput, StageResult, SwingCheck
} from '../../src/engine/types.js'
import {DC_KEYS, NOISE_KEYS} from '../../src/engine/types.js'
import type {HazardContext} from '../../src/note/types.js'
import type {RuleContext} from '../../src/rules/rule.js'
import {res, stageFrom} from '../support/stage-input.js'

export const resistor = res

export const opamp = (over: Partial<OpampParams> = {}): OpampParams => ({...ARCHETYPES['precision-bipolar'], ...over})

/** A noninverting gain-of-11 stage (10 kΩ / 1 kΩ), ±15 V, 25 °C, 0.1 … 100 Hz (preset `rules`). */
export const stageInput = (over: Partial<StageInput> = {}): StageInput => stageFrom('rules', over)

export interface ResultParts {
  gain?: number
  noiseGain?: number
  fullScaleOutput?: number
  /** DC contributors, V; the rest are zero. */
  dc?: Partial<Record<DcKey, number>>
  /** Noise contributors, V rms; the rest are zero. */
  noise?: Partial<Record<NoiseKey, number>>
  stability?: Partial<Stability>
  swing?: Partial<SwingCheck>
  bias?: Partial<BiasUsed>
  requirements?: RequirementResult[]
}

function emptyDensity(): Record<NoiseKey, number[]> {
  const density = {} as Record<NoiseKey, number[]>
  for (const key of NOISE_KEYS) density[key] = []
  return density
}

/** A result with the named contributors; clean defaults (60°, wide bandwidth, output fits). */
export function stageResult(parts: ResultParts = {}, input: StageInput = stageInput()): StageResult {
  const gain = parts.gain ?? 11
  const dcContributors = DC_KEYS.map((key) => ({key, output: parts.dc?.[key] ?? 0}))
  const noiseContributors = NOISE_KEYS.map((key) => ({key, outputRms: parts.noise?.[key] ?? 0}))
  const worst = dcContributors.reduce((s, c) => s + c.output, 0)
  const rss = Math.sqrt(dcContributors.reduce((s, c) => s + c.output ** 2, 0))
  const rms = Math.sqrt(noiseContributors.reduce((s, c) => s + c.outputRms ** 2, 0))
  const fullScaleOutput = parts.fullScaleOutput ?? 1.1
  return {
    id: input.id,
    topology: input.topology,
    opamp: input.opamp.name,
    gain,
    noiseGain: parts.noiseGain ?? Math.abs(gain),
    dc: {
      temperatureSpan: 0, fullScaleOutput, contributors: dcContributors,
      worstCaseOutput: worst, rssOutput: rss, worstCaseInput: worst / Math.abs(gain), rssInput: rss / Math.abs(gain),
      calibrated: null, networkCmrr: null
    },
    noise: {
      band: [input.band[0], input.band[1]], temperature: 298.15, outputRms: rms, zeroSignalOutputRms: rms, outputPeakToPeak: 6.6 * rms,
      inputRms: rms / Math.abs(gain), contributors: noiseContributors
    },
    filter: null,
    yield: null,
    stability: {phaseMargin: 60, crossover: 90e3, bandwidth: 90e3, peaking: 0, suggestedCf: null, ...parts.stability},
    requirements: parts.requirements ?? [],
    curves: {
      noiseFrequency: [], noiseDensity: emptyDensity(),
      noiseTotal: [], noiseTotalZeroSignal: [], cumulativeRms: [], frequency: [], loopGainMagnitude: [], loopGainPhase: [], closedLoopMagnitude: [], closedLoopPhase: []
    },
    swing: {outputSpan: [-1.1, 1.1], allowed: [-13.8, 13.8], excess: [0, 0], fits: true, ...parts.swing},
    bias: {
      ibMax: input.opamp.ib, iosMax: input.opamp.ios, ibSource: 'datasheet-25C', iosSource: 'datasheet-25C',
      overTemperatureMissing: false, idarkMax: input.idark, idarkSource: 'doubling', ...parts.bias
    }
  }
}

export function ruleContext(input: StageInput, result: StageResult, context: readonly HazardContext[] = []): RuleContext {
  return {input, result, context}
}
