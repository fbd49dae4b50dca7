/**
 * Input-technology alternatives (DESIGN §8.8): a stage evaluated again, unchanged but for its
 * amplifier, with every candidate of its kind, and the candidates ranked.
 *
 * Candidates: for an op-amp stage, the note's valid opamp blocks (document order, first
 * definition per id), then the built-in op-amp archetypes whose names no block takes; for an
 * instrumentation stage, the note's ina blocks, then the INA archetypes. Each is named by its
 * block id or archetype name only. Each candidate goes through the same `evaluateStage` as
 * the stage itself (no second engine); the candidate in use reuses the stage's own result.
 * The rules are not run for candidates: their notes belong to the design as drawn. A
 * candidate runs the stage's Monte Carlo only when the stage requires a `yield` (its verdict
 * counts in the score); a `yield` map or `--yield` alone asks for figures the table does not
 * show, so the candidates are evaluated without it.
 *
 * The score, best first (our decision; DESIGN §8.8 names no order):
 *   1. fewest verdicts not met: the author's requirements and the checked physical limits
 *      (a limit skipped for want of data counts neither way);
 *   2. the smallest DC figure relative to its requirement: the largest value/limit ratio over
 *      the DC requirements the stage states (output-error, output-error-rss, input-error and
 *      their calibrated forms); a stage with no DC requirement ranks by the worst-case DC
 *      error at the output itself;
 *   3. the lower output noise (rms over the band);
 *   4. the listing order above (the note's own blocks before the archetypes).
 * The dominant term of a candidate is its largest DC contributor at the output.
 */
import type {VFile} from 'vfile'
import {ARCHETYPES, ARCHETYPE_NAMES} from '../engine/archetypes.js'
import {evaluateStage, type EvaluateContext} from '../engine/index.js'
import {INA_ARCHETYPES, INA_ARCHETYPE_NAMES, inaAsOpamp} from '../engine/ina-archetypes.js'
import type {DcKey, InaParams, InputType, OpampParams, RequirementKey, StageInput, StageResult} from '../engine/types.js'
import type {OpampBlockNode} from '../note/types.js'

/** An amplifier a stage may be evaluated with. */
export interface AlternativeCandidate {
  /** Block id or archetype name. */
  name: string
  /** Where it comes from: an amplifier block of the note, or a built-in archetype. */
  source: 'block' | 'archetype'
  /** The op-amp (op-amp stages) or the instrumentation amplifier (instrumentation stages). */
  amplifier: {kind: 'opamp'; params: OpampParams} | {kind: 'ina'; params: InaParams}
}

/** What the ranking compares (see the module header). */
export interface AlternativeScore {
  /** Verdicts not met: requirements and checked limits. */
  notMet: number
  /** Largest value/limit over the stage's DC requirements; null when it states none. */
  dcRatio: number | null
  /** The requirement that ratio is taken against; null with it. */
  dcRequirement: RequirementKey | null
  /** Worst-case DC error at the output, V (ranks when `dcRatio` is null). */
  worstCaseOutput: number
  /** Output noise, rms over the band, V. */
  outputRms: number
}

/** One candidate's evaluation. */
export interface AlternativeEvaluation {
  candidate: string
  source: AlternativeCandidate['source']
  inputType: InputType
  /** True for the amplifier the stage uses. */
  current: boolean
  /** The stage with this candidate in place. */
  input: StageInput
  result: StageResult
  /** Largest DC contributor at the output; null when every contributor is zero. */
  dominant: DcKey | null
  score: AlternativeScore
}

export interface StageAlternatives {
  /** In listing order (see the module header). */
  candidates: AlternativeEvaluation[]
  /** Indices into `candidates`, best-scoring first. */
  ranking: number[]
}

/** DC requirements the score compares against (module header, step 2). */
const DC_REQUIREMENTS: readonly RequirementKey[] = ['output-error', 'output-error-rss', 'input-error', 'output-error-calibrated', 'input-error-calibrated']

/** The candidates for a stage (module header): blocks first, then archetypes no block shadows. */
export function candidatesOf(input: StageInput, opamps: readonly OpampBlockNode[]): AlternativeCandidate[] {
  const seen = new Set<string>()
  const out: AlternativeCandidate[] = []
  const add = (c: AlternativeCandidate): void => {
    if (seen.has(c.name)) return
    seen.add(c.name)
    out.push(c)
  }
  if (input.topology === 'instrumentation') {
    for (const b of opamps) if (b.ina !== undefined && b.ina !== null) add({name: b.id, source: 'block', amplifier: {kind: 'ina', params: b.ina}})
    for (const n of INA_ARCHETYPE_NAMES) add({name: n, source: 'archetype', amplifier: {kind: 'ina', params: INA_ARCHETYPES[n]}})
  } else {
    for (const b of opamps) if (b.ina === undefined && b.opamp !== null) add({name: b.id, source: 'block', amplifier: {kind: 'opamp', params: b.opamp}})
    for (const n of ARCHETYPE_NAMES) add({name: n, source: 'archetype', amplifier: {kind: 'opamp', params: ARCHETYPES[n]}})
  }
  return out
}

/** The stage with the candidate's amplifier in place; nothing else changes. */
export function withCandidate(input: StageInput, c: AlternativeCandidate): StageInput {
  return c.amplifier.kind === 'ina'
    ? {...input, ina: {...c.amplifier.params}, opamp: inaAsOpamp(c.amplifier.params)}
    : {...input, opamp: {...c.amplifier.params}}
}

/** The stage without its Monte Carlo unless a `yield` requirement is judged on it (module header). */
export const withoutUnjudgedYield = (input: StageInput): StageInput =>
  input.require.yield === undefined && input.yield ? {...input, yield: null} : input

/** The name of the amplifier a stage uses (its ina for an instrumentation stage). */
const inUse = (input: StageInput): string => input.ina?.name ?? input.opamp.name

/** The largest DC contributor at the output, or null when all are zero. */
export function dominantOf(result: StageResult): DcKey | null {
  let best: {key: DcKey; output: number} | null = null
  for (const c of result.dc.contributors) if (c.output > 0 && (best === null || c.output > best.output)) best = c
  return best?.key ?? null
}

/** The score of one result (module header). */
export function scoreOf(result: StageResult): AlternativeScore {
  const notMet = result.requirements.filter((r) => r.met === false).length
  let dcRatio: number | null = null
  let dcRequirement: RequirementKey | null = null
  for (const r of result.requirements) {
    if (r.kind !== 'require' || !DC_REQUIREMENTS.includes(r.key)) continue
    const v = r.value ?? Infinity
    const ratio = r.limit > 0 ? v / r.limit : v > 0 ? Infinity : 0
    if (dcRatio === null || ratio > dcRatio) {
      dcRatio = ratio
      dcRequirement = r.key
    }
  }
  return {notMet, dcRatio, dcRequirement, worstCaseOutput: result.dc.worstCaseOutput, outputRms: result.noise.outputRms}
}

/** Negative when `a` scores better than `b` (module header, steps 1–3). */
export function compareScores(a: AlternativeScore, b: AlternativeScore): number {
  if (a.notMet !== b.notMet) return a.notMet - b.notMet
  const da = a.dcRatio ?? a.worstCaseOutput
  const db = b.dcRatio ?? b.worstCaseOutput
  if (da !== db) return da < db ? -1 : 1
  if (a.outputRms !== b.outputRms) return a.outputRms < b.outputRms ? -1 : 1
  return 0
}

/**
 * Evaluate the stage with every candidate (module header). `own` is the stage's own result,
 * reused for the candidate in use; `context` is passed on to each candidate's evaluation (a
 * required yield's Monte Carlo may use the trial threads). A candidate the engine refuses is left out with a
 * warning on `file`.
 */
export function evaluateAlternatives(input: StageInput, own: StageResult, opamps: readonly OpampBlockNode[], file: VFile, place?: {line: number; column: number}, context: EvaluateContext = {}): StageAlternatives {
  const candidates: AlternativeEvaluation[] = []
  for (const c of candidatesOf(input, opamps)) {
    const current = c.name === inUse(input)
    const candidateInput = current ? input : withoutUnjudgedYield(withCandidate(input, c))
    let result: StageResult
    try {
      result = current ? own : evaluateStage(candidateInput, context)
    } catch (error) {
      file.message(`Alternative \`${c.name}\` of stage \`${input.id}\` could not be evaluated: ${error instanceof Error ? error.message : String(error)}`,
        {place, ruleId: 'alternative-failed', source: 'ampreview'})
      continue
    }
    candidates.push({
      candidate: c.name, source: c.source, inputType: c.amplifier.params.inputType, current,
      input: candidateInput, result, dominant: dominantOf(result), score: scoreOf(result)
    })
  }
  const ranking = candidates.map((_, i) => i).sort((i, j) => compareScores(candidates[i]!.score, candidates[j]!.score) || i - j)
  return {candidates, ranking}
}
