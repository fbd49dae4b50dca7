/**
 * The machine-readable result of DESIGN §6: exactly the contract's fields, in the
 * contract's order, report-only fields dropped. Numbers are plain SI; a value that does
 * not exist is null (never NaN or Infinity).
 */
import type {RequirementResult, YieldKey, YieldResult} from '../engine/types.js'
import type {StageEvaluation} from '../evaluate/index.js'
import type {JsonChain} from './chain-json.js'

export {jsonChain, type JsonChain} from './chain-json.js'
import {jsonYield, type JsonYield} from './yield-json.js'
export {jsonYield, type JsonYield} from './yield-json.js'
import {jsonAlternatives, type JsonAlternative} from './alternatives-json.js'
export type {JsonAlternative} from './alternatives-json.js'
import type {Topology} from '../engine/types.js'
import type {StageRole} from '../note/types.js'
import type {NoteRuleId} from '../rules/index.js'

/** One diagnostic of a note, as the contract carries it. */
export interface JsonDiagnostic {
  severity: 'error' | 'warning' | 'info'
  message: string
  line: number
  column: number
  /** What raised it: a rule id, `requirement-not-met`, `unknown-key`, …; null when none. */
  rule: string | null
  /** `input`, `note` (a rule's note), `requirement` or `build`. */
  kind: 'input' | 'note' | 'requirement' | 'build'
}

/** One note of a run: the path as given, the source's hash, its diagnostics and stages. */
export interface JsonNote {
  file: string
  sourceSha256: string
  diagnostics: JsonDiagnostic[]
  stages: JsonStage[]
  /** Measurement chains (DESIGN §8.6); absent in results written before chains existed. */
  chains?: JsonChain[]
}

/** The whole result of a run (`--json`, `<note>.json`, what `compare` and `merge` read). */
export interface JsonRun {
  files: JsonNote[]
}

export interface JsonStage {
  id: string
  topology: Topology
  opamp: string
  gain: number
  noiseGain: number
  dc: StageEvaluation['result']['dc']
  noise: StageEvaluation['result']['noise']
  stability: StageEvaluation['result']['stability']
  /** Low-pass stages (DESIGN §8.4); null elsewhere. */
  filter: StageEvaluation['result']['filter']
  requirements: StageEvaluation['result']['requirements']
  /** Practice and safety notes; `accepted` is the author's reason when the stage's `accept:` accepts the rule, else null. */
  notes: {rule: NoteRuleId; severity: string; text: string; accepted: string | null}[]
  /** `design`, or `baseline` (shown, not counted toward the verdict or the exit code). */
  role: StageRole
  /** The stage with each candidate amplifier (DESIGN §8.8); null when not asked for. */
  alternatives: JsonAlternative[] | null
  /** The Monte Carlo over the DC budget (DESIGN §8.7); null when off. */
  yield: JsonYield | null
}

/**
 * DESIGN §8.7's `yield` object, with what a reader needs to judge it: the distribution of the
 * resistor draws, `unavailable` (why there is no yield, else null), each result's limit and
 * count, which error the percentiles describe (`basis`) and its worst-case bound, and where
 * the variance shares were taken.
 */
/** Replace any non-finite number by null, so the JSON never carries NaN or Infinity. */
const finite = (n: number | null): number | null => (n === null || !Number.isFinite(n) ? null : n)

export function jsonStage(ev: StageEvaluation): JsonStage {
  const r = ev.result
  return {
    id: r.id,
    topology: r.topology,
    opamp: r.opamp,
    gain: r.gain,
    noiseGain: r.noiseGain,
    dc: {
      temperatureSpan: r.dc.temperatureSpan,
      fullScaleOutput: r.dc.fullScaleOutput,
      contributors: r.dc.contributors.map((c) => ({key: c.key, output: c.output})),
      worstCaseOutput: r.dc.worstCaseOutput,
      rssOutput: r.dc.rssOutput,
      worstCaseInput: r.dc.worstCaseInput,
      rssInput: r.dc.rssInput,
      calibrated: r.dc.calibrated === null ? null : {
        calibration: r.dc.calibrated.calibration,
        contributors: r.dc.calibrated.contributors.map((c) => ({key: c.key, output: c.output})),
        worstCaseOutput: r.dc.calibrated.worstCaseOutput,
        rssOutput: r.dc.calibrated.rssOutput,
        worstCaseInput: r.dc.calibrated.worstCaseInput,
        rssInput: r.dc.calibrated.rssInput
      },
      networkCmrr: finite(r.dc.networkCmrr)
    },
    noise: {
      band: [r.noise.band[0], r.noise.band[1]],
      temperature: r.noise.temperature,
      outputRms: r.noise.outputRms,
      zeroSignalOutputRms: r.noise.zeroSignalOutputRms,
      outputPeakToPeak: r.noise.outputPeakToPeak,
      inputRms: r.noise.inputRms,
      contributors: r.noise.contributors.map((c) => ({key: c.key, outputRms: c.outputRms}))
    },
    stability: {
      phaseMargin: finite(r.stability.phaseMargin),
      crossover: finite(r.stability.crossover),
      bandwidth: finite(r.stability.bandwidth),
      peaking: r.stability.peaking,
      suggestedCf: finite(r.stability.suggestedCf)
    },
    filter: r.filter === null ? null : {f0: finite(r.filter.f0), q: finite(r.filter.q), passbandGain: r.filter.passbandGain},
    requirements: r.requirements.map(jsonRequirement),
    notes: ev.notes.map((n) => ({rule: n.rule, severity: n.severity, text: n.text, accepted: n.accepted ?? null})),
    role: ev.role,
    alternatives: ev.alternatives === null ? null : jsonAlternatives(ev.alternatives),
    yield: jsonYield(r.yield)
  }
}

/** A requirement `{key, kind, limit, value, met}` or a limit (DESIGN §4.6), non-finite numbers as null. */
function jsonRequirement(q: RequirementResult): RequirementResult {
  if (q.kind === 'require') return {key: q.key, kind: q.kind, limit: q.limit, value: finite(q.value), met: q.met}
  switch (q.key) {
    case 'output-swing':
    case 'input-common-mode':
      return {key: q.key, kind: q.kind, limit: q.limit, value: q.value, met: q.met, missing: [...q.missing]}
    case 'slew':
      return {
        key: q.key, kind: q.kind, limit: q.limit, value: q.value, met: q.met, missing: [...q.missing],
        signalFrequency: q.signalFrequency, amplitude: q.amplitude, fullPowerBandwidth: finite(q.fullPowerBandwidth)
      }
    case 'output-current':
      return {key: q.key, kind: q.kind, limit: q.limit, value: q.value, met: q.met, missing: [...q.missing]}
  }
}
/** The §6 object of one note (exactly its fields, in order). */
export const noteJson = (o: JsonNote): JsonNote => ({
  file: o.file,
  sourceSha256: o.sourceSha256,
  diagnostics: o.diagnostics.map((d) => ({severity: d.severity, message: d.message, line: d.line, column: d.column, rule: d.rule, kind: d.kind})),
  stages: o.stages,
  chains: o.chains ?? []
})

/** JSON text with non-finite numbers as null (JSON.stringify already writes them as null; this makes it explicit). */
export const toJson = (value: unknown): string =>
  JSON.stringify(value, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2)
