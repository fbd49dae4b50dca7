/**
 * `evaluateChain`: stages in series into a converter (DESIGN §8.6), from each stage's own
 * evaluation — its DC contributors, gain and output span, and its spectral view — never
 * re-deriving a stage.
 *
 *   1. gain ΠGk, node ranges, converter span and range used
 *   2. DC: contributors carried through the later gains, converter terms (./dc.ts)
 *   3. noise: Sout = Σ Sk·Π|Hj|² over the band (./noise.ts); at the converter
 *      σ = √(σchain² + noise² + LSB²/12); noise-free and effective bits
 *   4. response: bandwidth, alias rejection, wideband noise (./response.ts)
 *   5. requirements and the converter-range limit (./requirements.ts)
 *
 * Pure: no I/O, clock or randomness.
 */
import {PEAK_TO_PEAK_FACTOR} from '../constants.js'
import {chainDc, temperatureSpanOf} from './dc.js'
import {cascadeNoise, cascadeRms} from './noise.js'
import {checkChainRequirements, converterRangeLimit} from './requirements.js'
import {aliasRejection, chainBandwidth} from './response.js'
import {lsbOf, type ChainInput, type ChainNoise, type ChainResult, type ChainStage} from './types.js'

/** Noise-free bits log2(span/(6.6σ)), capped at `bits` (common practice). */
export const noiseFreeBitsOf = (span: number, sigma: number, bits: number): number =>
  Math.min(bits, Math.log2(span / (PEAK_TO_PEAK_FACTOR * sigma)))

/** Effective resolution log2(span/σ), capped at `bits` (common practice; not ENOB). */
export const effectiveBitsOf = (span: number, sigma: number, bits: number): number => Math.min(bits, Math.log2(span / sigma))

/** Evaluate a chain from its stages' views, in signal order. */
export function evaluateChain(input: ChainInput, stages: readonly ChainStage[]): ChainResult {
  if (stages.length === 0) throw new RangeError(`Unexpected empty chain \`${input.id}\`, expected at least one stage`)
  const [fL, fH] = input.band
  if (!(fL > 0 && fH > fL)) throw new RangeError(`Unexpected band ${fL} .. ${fH} Hz in chain \`${input.id}\`, expected 0 < fL < fH`)
  const adc = input.adc
  // 1. Gain, nodes, range.
  const gain = stages.reduce((g, s) => g * s.gain, 1)
  const last = stages[stages.length - 1]
  const outputSpan: [number, number] = [last.outputSpan[0], last.outputSpan[1]]
  const vmax = Math.max(Math.abs(outputSpan[0]), Math.abs(outputSpan[1]))
  const span = adc === null ? null : adc.input[1] - adc.input[0]
  const lsb = adc === null ? null : lsbOf(adc)
  const dT = temperatureSpanOf(input.temperature)

  // 2. DC.
  const dc = chainDc(stages, adc, dT, vmax, input.calibration)

  // 3. Noise.
  const cascaded = cascadeNoise(stages, fL, fH)
  const outputRms = Math.sqrt(cascaded.total)
  const quantization = lsb === null ? 0 : lsb / Math.sqrt(12)
  const converterRms = adc === null ? null : Math.sqrt(cascaded.total + adc.noise ** 2 + quantization ** 2)

  // 4. Response.
  const scratch = new Float64Array(4)
  const from = Math.min(fL, 1)
  const bandwidth = chainBandwidth(stages, from, scratch)
  const fs = adc?.sampleRate ?? null
  const alias = fs === null ? null : aliasRejection(stages, fs, fH, scratch)
  const widebandRms = fs === null || bandwidth === null ? null : cascadeRms(stages, fL, Math.max(10 * bandwidth, fH * 1.001))

  const noise: ChainNoise = {
    outputRms,
    zeroSignalOutputRms: Math.sqrt(cascaded.zeroSignal),
    inputRms: (converterRms ?? outputRms) / Math.abs(gain),
    converterRms,
    noiseFreeBits: adc === null || converterRms === null || span === null ? null : noiseFreeBitsOf(span, converterRms, adc.bits),
    effectiveBits: adc === null || converterRms === null || span === null ? null : effectiveBitsOf(span, converterRms, adc.bits),
    widebandRms
  }
  const figures = {dc, noise, aliasRejection: alias}
  // 5. Verdicts.
  const requirements = [...checkChainRequirements(input, figures), converterRangeLimit(input, outputSpan)]
  return {
    id: input.id,
    stages: stages.map((s) => s.id),
    gain,
    bandwidth,
    rangeUsed: span === null ? null : (outputSpan[1] - outputSpan[0]) / span,
    ...figures,
    requirements,
    nodes: stages.map((s) => ({stage: s.id, input: [s.inputSpan[0], s.inputSpan[1]], output: [s.outputSpan[0], s.outputSpan[1]]})),
    stageNoise: stages.map((s, k) => ({stage: s.id, outputRms: Math.sqrt(cascaded.parts[k])})),
    outputSpan,
    converter: adc === null || span === null || lsb === null ? null : {
      name: adc.name, archetype: adc.archetype, bits: adc.bits, span, lsb, input: [adc.input[0], adc.input[1]],
      sampleRate: adc.sampleRate, noise: adc.noise, quantization
    },
    temperatureSpan: dT,
    band: [fL, fH],
    curves: cascaded.curves,
    // The Monte Carlo needs the stages' inputs: the evaluate phase runs it (../yield/chain.ts).
    yield: null
  }
}
