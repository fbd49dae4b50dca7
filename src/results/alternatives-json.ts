/**
 * The `alternatives` entry of a stage's machine-readable result (DESIGN §8.8): one row per
 * candidate amplifier, in listing order (the note's blocks, then the archetypes), with the
 * figures the report's table prints. Non-finite numbers are null.
 */
import type {DcKey, InputType, RequirementKey, LimitKey} from '../engine/types.js'
import type {StageAlternatives} from '../evaluate/alternatives.js'

export interface JsonAlternative {
  /** Block id or archetype name. */
  candidate: string
  inputType: InputType
  /** Worst-case DC error at the output, V. */
  worstCaseOutput: number
  /** Output noise, rms over the band, V. */
  outputRms: number
  /** Degrees; null when the loop gain never crosses 1 (and for an instrumentation stage). */
  phaseMargin: number | null
  /** The largest DC contributor at the output; null when all are zero. */
  dominant: DcKey | null
  /** Every verdict row of the stage with this candidate: requirement or limit key → met (null: a limit skipped for want of data). */
  met: Partial<Record<RequirementKey | LimitKey, boolean | null>>
  /** True for the amplifier the stage uses. */
  current: boolean
  /** True for the best-scoring candidate (src/evaluate/alternatives.ts states the score). */
  best: boolean
}

const finite = (n: number | null): number | null => (n === null || !Number.isFinite(n) ? null : n)

export function jsonAlternatives(a: StageAlternatives): JsonAlternative[] {
  const best = a.ranking[0]
  return a.candidates.map((c, i) => ({
    candidate: c.candidate,
    inputType: c.inputType,
    worstCaseOutput: c.result.dc.worstCaseOutput,
    outputRms: c.result.noise.outputRms,
    phaseMargin: finite(c.result.stability.phaseMargin),
    dominant: c.dominant,
    met: Object.fromEntries(c.result.requirements.map((r) => [r.key, r.met])),
    current: c.current,
    best: i === best
  }))
}
