/**
 * The stage's input-technology alternatives (DESIGN §8.8): the same circuit with each
 * candidate amplifier, as two tables in score order (figures; verdicts per requirement),
 * the one in use marked, and a sentence naming the best-scoring candidate by its id and
 * input type. The evaluation and the score are src/evaluate/alternatives.ts's; this only
 * lays them out.
 */
import type {BlockContent, PhrasingContent} from 'mdast'
import type {AlternativeEvaluation, StageAlternatives, StageEvaluation} from '../../evaluate/index.js'
import {isRequire, type RequirementResult, type StageInput} from '../../engine/types.js'
import {DC_LABELS, INPUT_TYPE_LABELS} from '../../results/labels.js'
import {nextTable, type ReportContext} from '../context.js'
import {deg, pct, q} from '../format.js'
import {caption, code, heading, paragraph, table, type Phrase} from '../mdast.js'
import {verdictOf} from '../verdicts.js'

const MARK = {met: '✓', 'not-met': '✗', 'not-evaluated': '–'} as const

/** "JFET input", "bias-cancelled bipolar input". */
const inputText = (a: AlternativeEvaluation): string => `${INPUT_TYPE_LABELS[a.inputType]} input`

/** The limits column: the checked limits not met, or a tick when all checked ones are met. */
function limitsCell(rows: readonly RequirementResult[]): string {
  const checked = rows.filter((r) => r.kind === 'limit' && r.met !== null)
  if (checked.length === 0) return '– not checked'
  const failed = checked.filter((r) => r.met === false).map((r) => r.key)
  return failed.length === 0 ? MARK.met : `${MARK['not-met']} ${failed.join(', ')}`
}

/** The dominant term by its label (short words wrap in a narrow column), with its share of the worst case. */
function dominantCell(a: AlternativeEvaluation): string {
  if (a.dominant === null) return '—'
  const c = a.result.dc.contributors.find((x) => x.key === a.dominant)
  const share = c !== undefined && a.result.dc.worstCaseOutput > 0 ? ` (${pct(c.output / a.result.dc.worstCaseOutput)})` : ''
  return `${DC_LABELS[a.dominant]}${share}`
}

/** How a candidate stands against the requirements, for the sentence. */
function standing(a: AlternativeEvaluation): string {
  const rows = a.result.requirements.filter((r) => isRequire(r) || r.met !== null)
  const failed = rows.filter((r) => r.met === false).map((r) => r.key)
  return failed.length === 0
    ? `meets all ${rows.length} of the stage’s requirements and checked limits`
    : `misses ${failed.length} of ${rows.length} (${failed.join(', ')})`
}

/** The DC figure the score ranks, as words. */
function dcText(a: AlternativeEvaluation): string {
  const wc = q(a.result.dc.worstCaseOutput, 'V')
  const {dcRatio, dcRequirement} = a.score
  return dcRatio === null || dcRequirement === null ? `worst-case DC error ${wc} at the output`
    : `worst-case DC error ${wc} at the output (its tightest DC requirement, ${dcRequirement}, at ${Number.isFinite(dcRatio) ? pct(dcRatio) : 'no finite share'} of its limit)`
}

function bestSentence(alts: StageAlternatives, input: StageInput): Phrase[] {
  const best = alts.candidates[alts.ranking[0]!]!
  const out: Phrase[] = [
    'Best-scoring candidate: ', code(best.candidate), ` (${inputText(best)}${best.source === 'archetype' ? ', archetype' : ''}), which ${standing(best)}, ` +
    `with ${dcText(best)} and output noise ${q(best.result.noise.outputRms, 'V')} rms.`
  ]
  if (best.current) {
    out.push(' It is the amplifier the stage uses.')
  } else {
    const place = alts.ranking.findIndex((i) => alts.candidates[i]!.current)
    const current = alts.candidates[alts.ranking[place]!]
    if (current !== undefined) out.push(` The amplifier in use, `, code(current.candidate), ` (${inputText(current)}), ranks ${place + 1} of ${alts.candidates.length}: it ${standing(current)}.`)
  }
  return [...out, ...rcompSentence(alts, input, best.result.noiseGain)]
}

/** At most this share of the smallest worst case, what rcomp could balance is called little (our choice). */
const LITTLE = 0.05

/**
 * With a compensation resistor in the circuit: what it could balance with the FET-input
 * candidates (IB·rcomp, bias current at its worst over the range, times the noise gain at
 * the output) and what it costs (its own thermal noise at the output).
 */
function rcompSentence(alts: StageAlternatives, input: StageInput, noiseGain: number): Phrase[] {
  const r = input.rcomp?.value ?? 0
  const fets = alts.candidates.filter((a) => a.inputType === 'jfet' || a.inputType === 'cmos')
  if (r <= 0 || fets.length === 0) return []
  const ib = Math.max(...fets.map((a) => a.result.bias.ibMax))
  const noise = Math.max(...fets.map((a) => a.result.noise.contributors.find((c) => c.key === 'r:rcomp')?.outputRms ?? 0))
  const balanced = ib * r * noiseGain
  const smallest = Math.min(...fets.map((a) => a.result.dc.worstCaseOutput))
  const little = smallest > 0 && balanced <= LITTLE * smallest
  const share = smallest > 0 ? `: ${pct(balanced / smallest)} of the smallest worst-case DC error among them` : ''
  return [' With the JFET and CMOS candidates the bias current that ', code('rcomp'), ` = ${q(r, 'Ω')} is there to balance is at most ${q(ib, 'A')} over the range, ` +
    `so IB·rcomp is at most ${q(ib * r, 'V')}, ${q(balanced, 'V')} at the output${share}. The resistor’s own thermal noise reaches ${q(noise, 'V')} rms at the output` +
    (little ? ', so with those inputs it costs noise and buys little DC accuracy.' : '.')]
}

/** The section's blocks; none when the stage did not ask for alternatives. */
export function alternativesBlocks(ctx: ReportContext, ev: StageEvaluation): BlockContent[] {
  const alts = ev.alternatives
  if (alts === null) return []
  const {input} = ev
  const ina = input.topology === 'instrumentation'
  const kind = ina ? 'instrumentation amplifier' : 'op-amp'
  const intro = paragraph(
    `The same circuit — resistors, supply, temperature range, band and requirements unchanged — evaluated with each ${kind} block of this note and each built-in ${kind} archetype ` +
    `(${alts.candidates.length} candidates; archetype rows are representative of their class, not real parts). ` +
    'Candidates are ranked: fewest verdicts not met (requirements and checked limits), then the smallest worst-case DC error relative to its requirement, then the lowest output noise. ' +
    'The first table gives each candidate’s figures, the dominant term being its largest DC contributor with its share of the worst case; the second its verdicts.')
  if (alts.candidates.length === 0) return [heading(3, 'Input-technology alternatives'), intro, paragraph('No candidate could be evaluated.')]
  const ranked = alts.ranking.map((i) => alts.candidates[i]!)
  const nameCell = (a: AlternativeEvaluation): PhrasingContent[] => (a.current ? [code(a.candidate), {type: 'text', value: ' (in use)'}] : [code(a.candidate)])
  const figures = table(
    ['#', 'Candidate', 'Input type', 'Worst-case DC error', 'Output noise, rms', ...(ina ? [] : ['Phase margin']), 'Dominant DC term'],
    ranked.map((a, rank) => [
      String(rank + 1), nameCell(a), INPUT_TYPE_LABELS[a.inputType], q(a.result.dc.worstCaseOutput, 'V'), q(a.result.noise.outputRms, 'V'),
      ...(ina ? [] : [deg(a.result.stability.phaseMargin)]), dominantCell(a)
    ]),
    ['right', 'left', 'left', 'right', 'right', ...(ina ? [] : ['right' as const]), 'left'])
  const reqs = ranked[0]!.result.requirements.filter(isRequire).map((r) => r.key)
  const verdicts = table(
    ['#', 'Candidate', ...reqs.map((k) => code(k)), 'Limits'],
    ranked.map((a, rank) => [
      String(rank + 1), nameCell(a),
      ...reqs.map((k) => {
        const r = a.result.requirements.find((x) => x.key === k)
        return r === undefined ? '—' : MARK[verdictOf(r)]
      }),
      limitsCell(a.result.requirements)
    ]),
    ['right', 'left', ...reqs.map(() => 'center' as const), 'left'])
  return [
    heading(3, 'Input-technology alternatives'), intro,
    caption(nextTable(ctx, `Alternatives of stage ${input.id}, best-scoring first`)), figures,
    caption(nextTable(ctx, `Verdicts of the alternatives of stage ${input.id} (✓ met, ✗ not met, – not evaluated)`)), verdicts,
    paragraph(...bestSentence(alts, input))
  ]
}
