/**
 * Fixtures for the chain engine: synthetic stage views with closed-form spectra (flat, or one
 * pole), real stage views built from `evaluateStage` the way the evaluate phase does, and an
 * ideal converter. All values are invented for tests.
 */
import {evaluateStage, stageSpectrum, type AdcParams, type ChainInput, type ChainStage, type StageInput, type StageResult} from '../../../src/engine/index.js'

/**
 * A stage view with output density e²·|P(f)|² plus an input density carried by the gain, and
 * transfer H(f) = G·P(f), P a one-pole low-pass at `pole` (Hz; Infinity = flat).
 */
export function syntheticStage(id: string, gain: number, e: number, pole = Infinity, contributors: {key: string; output: number}[] = []): ChainStage {
  return {
    id, gain, contributors, calibrated: null, outputSpan: [-1, 1], inputSpan: [-1 / gain, 1 / gain], bandwidth: Number.isFinite(pole) ? pole : null,
    spectrum: {
      dcGain: gain,
      signalNoise: false,
      at(f, out, offset) {
        const x = Number.isFinite(pole) ? f / pole : 0
        const d = 1 + x * x
        out[offset] = (e * e) / d
        out[offset + 1] = (e * e) / d
        out[offset + 2] = gain / d
        out[offset + 3] = (-gain * x) / d
      }
    }
  }
}

/** A chain input over `band` with an optional converter. */
export function chainInput(stages: string[], adc: AdcParams | null, band: [number, number] = [1, 100], overrides: Partial<ChainInput> = {}): ChainInput {
  return {id: 'c', title: 'c', stages, adc, temperature: [25, 25], band, calibration: 'none', require: {}, ...overrides}
}

/** An ideal converter: only its LSB. */
export const idealAdc = (bits: number, input: [number, number], sampleRate: number | null = null): AdcParams => ({
  name: 'ideal', archetype: false, bits, input, noise: 0, offset: 0, offsetDrift: 0, gainError: 0, gainDrift: 0, inl: 0, sampleRate
})

/** The view of a real stage, built from its own evaluation (as `src/evaluate/chains.ts` does). */
export function realStage(input: StageInput): {view: ChainStage; result: StageResult} {
  const result = evaluateStage(input)
  return {
    result,
    view: {
      id: input.id, gain: result.gain, contributors: result.dc.contributors, calibrated: null,
      outputSpan: result.swing.outputSpan, inputSpan: input.input, bandwidth: result.stability.bandwidth, spectrum: stageSpectrum(input)
    }
  }
}
