/**
 * Requirement verdicts (DESIGN §3.3, §6): each key of `require` against its figure; `max`
 * limits are met when value ≤ limit, `min` limits when value ≥ limit; a figure that does not
 * exist (null) never meets its limit.
 */
import {REQUIREMENT_KEYS, type RequireResult, type RequirementKey, type StageInput, type StageResult} from './types.js'

type Figures = Pick<StageResult, 'dc' | 'noise' | 'stability'> & {yield?: StageResult['yield']}

const FIGURE: Record<RequirementKey, (r: Figures) => number | null> = {
  'output-error': (r) => r.dc.worstCaseOutput,
  'output-error-rss': (r) => r.dc.rssOutput,
  'input-error': (r) => r.dc.worstCaseInput,
  'noise-rms': (r) => r.noise.outputRms,
  'noise-pp': (r) => r.noise.outputPeakToPeak,
  'phase-margin': (r) => r.stability.phaseMargin,
  bandwidth: (r) => r.stability.bandwidth,
  // Without a calibration the residual is the whole error (our reading of DESIGN §4.6).
  'output-error-calibrated': (r) => r.dc.calibrated?.worstCaseOutput ?? r.dc.worstCaseOutput,
  'input-error-calibrated': (r) => r.dc.calibrated?.worstCaseInput ?? r.dc.worstCaseInput,
  // The lowest yield of the stage's DC requirements (DESIGN §8.7); none computed: null.
  yield: (r) => {
    const rows = r.yield?.results ?? []
    return rows.length === 0 ? null : Math.min(...rows.map((x) => x.yield))
  }
}

/** Verdicts for every key the stage requires, in the order of REQUIREMENT_KEYS. */
export function checkRequirements(input: StageInput, figures: Figures): RequireResult[] {
  const out: RequireResult[] = []
  for (const key of Object.keys(REQUIREMENT_KEYS) as RequirementKey[]) {
    const limit = input.require[key]
    if (limit === undefined) continue
    const value = FIGURE[key](figures)
    const met = value !== null && (REQUIREMENT_KEYS[key].sense === 'max' ? value <= limit : value >= limit)
    out.push({key, kind: 'require', limit, value, met})
  }
  return out
}
