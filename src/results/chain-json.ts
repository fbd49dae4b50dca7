/**
 * The `chains` entries of the machine-readable result (DESIGN §8.6): exactly the contract's
 * fields, in its order, report-only fields dropped, non-finite numbers as null.
 */
import type {ChainDcContributor, ChainRequirementResult, ChainResult, ChainYieldKey} from '../engine/chain/types.js'
import type {ChainEvaluation} from '../evaluate/chains.js'
import {jsonYield, type JsonYield} from './yield-json.js'

export interface JsonChain {
  id: string
  stages: string[]
  gain: number
  bandwidth: number | null
  rangeUsed: number | null
  dc: {
    contributors: ChainDcContributor[]
    worstCaseOutput: number
    rssOutput: number
    worstCaseInput: number
    worstCaseLsb: number | null
    calibrated: {calibration: string; contributors: ChainDcContributor[]; worstCaseOutput: number; rssOutput: number; worstCaseInput: number; worstCaseLsb: number | null} | null
  }
  noise: ChainResult['noise']
  aliasRejection: number | null
  requirements: ChainRequirementResult[]
  /** The chain rules' notes; `accepted` is the author's reason when the chain's `accept:` accepts the rule, else null. */
  notes: {rule: string; severity: string; text: string; accepted: string | null}[]
  /** The Monte Carlo over the chain's DC budget (DESIGN §8.7), errors at the converter's input; null when off. */
  yield: JsonYield<ChainYieldKey> | null
}

const finite = (n: number | null): number | null => (n === null || !Number.isFinite(n) ? null : n)
const rows = (c: readonly ChainDcContributor[]): ChainDcContributor[] => c.map((r) => ({source: r.source, key: r.key, output: r.output}))

function jsonRequirement(r: ChainRequirementResult): ChainRequirementResult {
  if (r.kind === 'require') return {key: r.key, kind: r.kind, limit: r.limit, value: finite(r.value), met: r.met}
  return {key: r.key, kind: r.kind, value: [r.value[0], r.value[1]], limit: r.limit === null ? null : [r.limit[0], r.limit[1]], met: r.met, missing: [...r.missing]}
}

export function jsonChain(ev: ChainEvaluation): JsonChain {
  const r = ev.result
  const n = r.noise
  return {
    id: r.id,
    stages: [...r.stages],
    gain: r.gain,
    bandwidth: finite(r.bandwidth),
    rangeUsed: finite(r.rangeUsed),
    dc: {
      contributors: rows(r.dc.contributors),
      worstCaseOutput: r.dc.worstCaseOutput,
      rssOutput: r.dc.rssOutput,
      worstCaseInput: r.dc.worstCaseInput,
      worstCaseLsb: finite(r.dc.worstCaseLsb),
      calibrated: r.dc.calibrated === null ? null : {
        calibration: r.dc.calibrated.calibration,
        contributors: rows(r.dc.calibrated.contributors),
        worstCaseOutput: r.dc.calibrated.worstCaseOutput,
        rssOutput: r.dc.calibrated.rssOutput,
        worstCaseInput: r.dc.calibrated.worstCaseInput,
        worstCaseLsb: finite(r.dc.calibrated.worstCaseLsb)
      }
    },
    noise: {
      outputRms: n.outputRms,
      zeroSignalOutputRms: n.zeroSignalOutputRms,
      inputRms: n.inputRms,
      converterRms: finite(n.converterRms),
      noiseFreeBits: finite(n.noiseFreeBits),
      effectiveBits: finite(n.effectiveBits),
      widebandRms: finite(n.widebandRms)
    },
    aliasRejection: finite(r.aliasRejection),
    requirements: r.requirements.map(jsonRequirement),
    notes: ev.notes.map((x) => ({rule: x.rule, severity: x.severity, text: x.text, accepted: x.accepted ?? null})),
    yield: jsonYield(r.yield)
  }
}
