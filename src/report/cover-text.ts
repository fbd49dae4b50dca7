/**
 * The cover's sentences, shared by the PDF and the Markdown report: the overall verdict says
 * what it counts (stages and requirements, baseline stages left out).
 */
import type {Severity} from '../rules/types.js'
import type {CoverSummary} from './types.js'

export const SEVERITY_WORDS: Record<Severity, string> = {info: 'INFO', caution: 'CAUTION', warning: 'WARNING', safety: 'SAFETY'}

const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`

/** "Overall: all 4 requirements of 1 stage met (baseline stage ref-buffer not counted)". */
export function overallSentence(c: CoverSummary): string {
  const {stages, chains, requirements, notMet} = c.counted
  // Checked physical limits (DESIGN §4.6) count with the requirements; the sentence says so.
  const limits = c.verdicts.some((v) => v.counted && v.requirement.endsWith('(limit)'))
  const what = limits ? plural(requirements, 'requirement or physical limit', 'requirements and physical limits') : plural(requirements, 'requirement', 'requirements')
  const of = `${what} of ${plural(stages, 'stage', 'stages')}${chains > 0 ? ` and ${plural(chains, 'chain', 'chains')}` : ''}`
  const left = c.baseline.length === 0 ? '' : ` (baseline ${c.baseline.length === 1 ? 'stage' : 'stages'} ${c.baseline.join(', ')} not counted)`
  if (requirements === 0) return `Overall: no requirements stated for the ${plural(stages, 'counted stage', 'counted stages')}${left}`
  switch (c.overall) {
    case 'met': return `Overall: all ${of} met${left}`
    case 'not-met': return `Overall: ${notMet} of the ${of} not met${left}`
    case 'not-evaluated': return `Overall: the ${of} could not all be evaluated${left}`
  }
}
