/**
 * A chain's verdicts (DESIGN §8.6): each key of its `require:` against its figure (`max`
 * limits met when value ≤ limit, `min` limits when value ≥ limit; a figure that does not
 * exist never meets its limit), then the `converter-range` limit: the chain's output span
 * inside the converter's input range (skipped without a converter).
 */
import type {ChainInput, ChainLimitResult, ChainRequireResult, ChainRequirementKey, ChainResult} from './types.js'
import {CHAIN_REQUIREMENT_KEYS} from './types.js'

type Figures = Pick<ChainResult, 'dc' | 'noise' | 'aliasRejection'> & {yield?: ChainResult['yield']}

const FIGURE: Record<ChainRequirementKey, (r: Figures) => number | null> = {
  'input-error': (r) => r.dc.worstCaseInput,
  'output-error': (r) => r.dc.worstCaseOutput,
  'error-lsb': (r) => r.dc.worstCaseLsb,
  'noise-free-bits': (r) => r.noise.noiseFreeBits,
  'effective-bits': (r) => r.noise.effectiveBits,
  'alias-rejection': (r) => r.aliasRejection,
  'noise-rms-input': (r) => r.noise.inputRms,
  // Without a calibration the residual is the whole error (as for a stage, DESIGN §4.6).
  'input-error-calibrated': (r) => r.dc.calibrated?.worstCaseInput ?? r.dc.worstCaseInput,
  'output-error-calibrated': (r) => r.dc.calibrated?.worstCaseOutput ?? r.dc.worstCaseOutput,
  'error-lsb-calibrated': (r) => (r.dc.calibrated === null ? r.dc.worstCaseLsb : r.dc.calibrated.worstCaseLsb),
  // The lowest yield of the chain's DC requirements (DESIGN §8.7); none computed (off, or unavailable): null.
  yield: (r) => {
    const rows = r.yield?.results ?? []
    return rows.length === 0 ? null : Math.min(...rows.map((x) => x.yield))
  }
}

export function checkChainRequirements(input: ChainInput, figures: Figures): ChainRequireResult[] {
  const out: ChainRequireResult[] = []
  for (const key of Object.keys(CHAIN_REQUIREMENT_KEYS) as ChainRequirementKey[]) {
    const limit = input.require[key]
    if (limit === undefined) continue
    const value = FIGURE[key](figures)
    const met = value !== null && (CHAIN_REQUIREMENT_KEYS[key].sense === 'max' ? value <= limit : value >= limit)
    out.push({key, kind: 'require', limit, value, met})
  }
  return out
}

export function converterRangeLimit(input: ChainInput, span: [number, number]): ChainLimitResult {
  if (input.adc === null) return {key: 'converter-range', kind: 'limit', value: span, limit: null, met: null, missing: ['adc']}
  const limit: [number, number] = [input.adc.input[0], input.adc.input[1]]
  return {key: 'converter-range', kind: 'limit', value: span, limit, met: span[0] >= limit[0] && span[1] <= limit[1], missing: []}
}
