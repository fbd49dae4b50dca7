/**
 * One chain's section, where its block stands (DESIGN §8.6): the block diagram, the signal
 * range at every node, the parameters, the DC budget carried to the converter (and to the
 * input and to LSB) with each stage's share as a table and a bar chart, the cascaded noise
 * (each stage's part and the total, density and cumulative rms), the resolution figures,
 * the verdicts and the chain's notes.
 */
import type {BlockContent} from 'mdast'
import {ADC_ARCHETYPE_DISCLAIMER} from '../../engine/chain/archetypes.js'
import type {ChainEvaluation} from '../../evaluate/chains.js'
import type {StageEvaluation} from '../../evaluate/index.js'
import type {AdcBlockNode, ChainBlockNode} from '../../note/chain-types.js'
import {TOPOLOGY_LABELS} from '../../results/labels.js'
import {chainDiagramSpec, chainNoiseDensitySpec, cumulativeRmsSpec, dcBarsSpec, stagesUnderTotal} from '../charts/index.js'
import {nextTable, type ReportContext} from '../context.js'
import {pct, q, verdictText} from '../format.js'
import {callout, caption, code, heading, paragraph, strong, table} from '../mdast.js'
import {chainDcTables, chainNoiseTable, resolutionTable} from './chain-tables.js'
import {chainFigure} from './chain-figure.js'
import {chainMargin, chainLimitText, chainRequirementLabel, chainRequirementValue, chainVerdictOf} from '../chain-verdicts.js'
import {combine} from '../verdicts.js'
import {entriesTable} from './parameters.js'
import {noteBlocks} from './notes.js'

const rangeText = (r: readonly [number, number], unit: string): string => `${q(r[0], unit)} … ${q(r[1], unit)}`

function diagram(ev: ChainEvaluation, stages: ReadonlyMap<string, StageEvaluation>) {
  const r = ev.result
  const unitIn = ev.topologies[0] === 'transimpedance' ? 'A' : 'V'
  const boxes = r.stages.map((id) => {
    const s = stages.get(id)
    const topology = s ? (TOPOLOGY_LABELS as Record<string, string>)[s.input.topology] ?? s.input.topology : ''
    const g = s ? s.result.gain : 0
    const gainText = s?.input.topology === 'transimpedance' ? `G = ${q(g, 'Ω')}` : `G = ${q(g, 'V/V', 4)}`
    return {title: id, lines: [topology.split(' ')[0] ?? topology, gainText] as [string, string], converter: false}
  })
  const c = r.converter
  if (c !== null) boxes.push({title: c.name, lines: [`${c.bits} bits`, rangeText(c.input, 'V')], converter: true})
  const nodeLabels = r.nodes.map((n) => rangeText(n.output, 'V'))
  return chainDiagramSpec({inputLabel: rangeText(r.nodes[0]!.input, unitIn), boxes, nodeLabels: c === null ? nodeLabels.slice(0, -1) : nodeLabels})
}

function nodeTable(ev: ChainEvaluation) {
  const r = ev.result
  const unitIn = ev.topologies[0] === 'transimpedance' ? 'A' : 'V'
  const rows: string[][] = [[`Chain input (into ${r.stages[0]})`, rangeText(r.nodes[0]!.input, unitIn), q(r.nodes[0]!.input[1] - r.nodes[0]!.input[0], unitIn)]]
  for (const [i, n] of r.nodes.entries()) {
    const into = r.nodes[i + 1]?.stage ?? r.converter?.name
    rows.push([`Output of ${n.stage}${into ? ` (into ${into})` : ''}`, rangeText(n.output, 'V'), q(n.output[1] - n.output[0], 'V')])
  }
  if (r.converter !== null) {
    const e = r.dc.worstCaseOutput
    rows.push([`Converter ${r.converter.name} input range`, rangeText(r.converter.input, 'V'), q(r.converter.span, 'V')])
    rows.push(['Chain output widened by the worst-case DC error', rangeText([r.outputSpan[0] - e, r.outputSpan[1] + e], 'V'), q(r.outputSpan[1] - r.outputSpan[0] + 2 * e, 'V')])
    rows.push(['Fraction of the converter range used', r.rangeUsed === null ? '—' : pct(r.rangeUsed), ''])
  }
  return table(['Node', 'Range', 'Span'], rows, ['left', 'right', 'right'])
}

function requirementBlocks(ev: ChainEvaluation): BlockContent[] {
  const all = ev.result.requirements
  const counted = all.filter((r) => !(r.kind === 'limit' && r.met === null))
  const rows = all.map((r) => [
    [chainRequirementLabel(r), ' (', code(r.key), ')'],
    chainRequirementValue(ev, r, 'value'), chainLimitText(ev, r), chainMargin(ev, r),
    r.kind === 'limit' && r.met === null ? '– skipped' : verdictText(chainVerdictOf(r))
  ])
  const overall = combine(counted.map(chainVerdictOf))
  const failed = counted.filter((r) => chainVerdictOf(r) === 'not-met').map((r) => r.key)
  return [
    table(['Requirement', 'Value', 'Limit', 'Margin', 'Verdict'], rows, ['left', 'right', 'right', 'right', 'left']),
    callout(overall, overall === 'met' ? 'ALL MET' : overall === 'not-met' ? 'NOT MET' : 'NOT EVALUATED', [paragraph(
      overall === 'met' ? `Chain ${ev.input.id} meets all ${counted.length} of its requirements and checked limits.`
        : overall === 'not-met' ? `Chain ${ev.input.id} does not meet ${failed.length} of its ${counted.length} requirements and checked limits: ${failed.join(', ')}.`
          : `Chain ${ev.input.id} states no requirement that could be evaluated.`)])
  ]
}

/** The section of an adc block: its values as written and as used. */
/** The caption's clause for stage lines that lie under the total's (within 2 %). */
const underTotal = (ids: readonly string[]): string =>
  ids.length === 0 ? '' : `; ${ids.map((id) => `stage ${id}`).join(' and ')} ${ids.length === 1 ? 'carries' : 'carry'} nearly all of it (within 2 % of the total), so ${ids.length === 1 ? 'its line lies' : 'their lines lie'} under the total's`

export function adcSection(ctx: ReportContext, node: AdcBlockNode): BlockContent[] {
  return [heading(3, 'Converter ', code(node.id)), caption(nextTable(ctx, `Converter ${node.id}, as written`)), entriesTable(node.entries, node.defaulted)]
}

/** A chain block that was not evaluated (errors: the build stops before the PDF). */
export function failedChainSection(block: ChainBlockNode): BlockContent[] {
  return [heading(2, 'Chain ', code(block.id)), paragraph('This chain has errors and was not evaluated.')]
}

export function chainSection(ctx: ReportContext, ev: ChainEvaluation, stages: ReadonlyMap<string, StageEvaluation>): BlockContent[] {
  const r = ev.result
  const c = r.converter
  const unitIn = ev.topologies[0] === 'transimpedance' ? 'A' : 'V'
  const out: BlockContent[] = [
    heading(2, `Chain ${ev.input.id} — ${ev.input.title}`),
    paragraph(`Stages in signal order: ${r.stages.join(' → ')}${c === null ? ', ending at an analog output (no converter).' : ` → converter ${c.name}${c.archetype ? ' (archetype)' : ''}.`} ` +
      `Overall gain ${q(r.gain, unitIn === 'A' ? 'Ω' : 'V/V', 4)}; chain bandwidth ${q(r.bandwidth, 'Hz')}. ` +
      'Each later stage takes the previous stage’s output range as its input; stages are cascaded as ideal sources (each output impedance negligible against the next input).')
  ]
  if (c?.archetype) out.push(callout('info', 'ARCHETYPE', [paragraph(ADC_ARCHETYPE_DISCLAIMER)]))
  out.push(chainFigure(ctx, diagram(ev, stages), `Block diagram of chain ${ev.input.id}: stages with their gains, the range at every node`))
  out.push(heading(3, 'Signal range at every node'), caption(nextTable(ctx, `Signal range through chain ${ev.input.id}`)), nodeTable(ev))
  out.push(heading(3, 'Parameters'), caption(nextTable(ctx, `Parameters of chain ${ev.input.id}`)), entriesTable(ev.block.entries, ev.block.defaulted))

  const dc = chainDcTables(ev)
  out.push(heading(3, 'DC error budget of the chain'),
    paragraph(`Every stage’s worst-case contributors carried to the converter input through the gains of the later stages (Σ ek·Π|Gj|), ` +
      `then the converter’s own terms over ΔT = ${q(r.temperatureSpan, 'K')}` +
      (ev.input.calibration === 'none' ? '.' : `; the chain is calibrated (${ev.input.calibration}) as a whole.`)),
    caption(nextTable(ctx, `DC error of chain ${ev.input.id} by source`)), dc.bySource,
    chainFigure(ctx, dcBarsSpec({contributors: dc.sourceRows}, {labels: {}, axisTitle: 'Worst-case error at the converter input'}),
      `DC error of chain ${ev.input.id} by source, at the converter input, largest first`),
    caption(nextTable(ctx, `DC error contributors of chain ${ev.input.id}`)), dc.contributors, ...dc.zeros)

  out.push(heading(3, 'Noise of the chain'),
    paragraph(`Output density Sout(f) = Σ Sk(f)·Π|Hj(f)|² of the later stages, from each stage’s full output density and solved response, ` +
      `over ${q(r.band[0], 'Hz')} … ${q(r.band[1], 'Hz')} (brick-wall, after any digital filtering)` +
      (c === null ? '.' : `; at the converter σ = √(σchain² + noise² + LSB²/12).`)),
    caption(nextTable(ctx, `Noise of chain ${ev.input.id} by stage`)), chainNoiseTable(ev),
    chainFigure(ctx, chainNoiseDensitySpec(r.curves, r.stages), `Noise density of chain ${ev.input.id} at the converter input: each stage’s part and the total` +
      underTotal(stagesUnderTotal(r.curves, r.stages))),
    chainFigure(ctx, cumulativeRmsSpec({noiseFrequency: r.curves.frequency, cumulativeRms: r.curves.cumulativeRms}, {axisTitle: 'Cumulative noise at the converter input, rms'}),
      `Cumulative noise of chain ${ev.input.id} from the band’s lower edge (analog chain only)`))

  out.push(heading(3, 'Resolution'), caption(nextTable(ctx, `Resolution figures of chain ${ev.input.id}`)), resolutionTable(ev))
  if (c !== null) {
    out.push(paragraph(strong('How to read: '), 'noise-free bits log2(span/(6.6σ)) count the codes that do not flicker; effective resolution log2(span/σ) is the rms figure (not ENOB). ' +
      'Both are capped at the converter’s bits; an ideal converter shows about bits − 0.93 noise-free bits from its own quantisation (LSB/√12).'))
  }
  out.push(heading(3, 'Requirements'), ...requirementBlocks(ev))
  out.push(heading(3, 'Practice notes'), ...(ev.notes.length === 0 ? [paragraph('No chain rule was triggered by this chain.')] : noteBlocks(ev.notes)))
  return out
}
