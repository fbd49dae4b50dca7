/**
 * One stage's section, replacing its block in the document (DESIGN §5): parameters,
 * results summary, DC budget with chart, noise budget with charts, stability with chart,
 * requirement verdicts, then the practice and safety notes.
 */
import type {BlockContent} from 'mdast'
import type {StageEvaluation} from '../../evaluate/index.js'
import type {StageBlockNode} from '../../note/types.js'
import {nextTable, type ReportContext} from '../context.js'
import {TOPOLOGY_LABELS} from '../../results/labels.js'
import {q} from '../format.js'
import {formatRange} from '../../units/format.js'
import {callout, caption, code, heading, paragraph} from '../mdast.js'
import {dcTable, filterTable, noiseTable, stabilityTable, summaryTable} from './budget-tables.js'
import {dcFigure, loopFigure, noiseFigures, responseFigure} from './figures.js'
import {AS_WRITTEN, archetypeNotice, entriesTable, inaValuesTable} from './parameters.js'
import {INA_ARCHETYPE_DISCLAIMER} from '../../engine/ina-archetypes.js'
import {requirementBlocks} from './requirements.js'
import {alternativesBlocks} from './alternatives.js'
import {noteBlocks} from './notes.js'
import type {RuleNote} from '../../rules/types.js'
import type {StageInput} from '../../engine/types.js'
import {stageSchematic} from '../schematic/stage.js'
import {yieldBlocks} from './yield.js'

/** The stage's schematic, first in its section. */
function schematicBlock(ctx: ReportContext, input: StageInput): BlockContent {
  const drawing = stageSchematic(input)
  return {type: 'schematic', number: ++ctx.figure, drawing,
    caption: `Schematic of stage ${input.id}: every part with its key and nominal value (tolerances in the parameters table)`}
}

function swingBlocks(ev: StageEvaluation): BlockContent[] {
  const s = ev.result.swing
  const span = formatRange(s.outputSpan[0], s.outputSpan[1], 'V')
  const allowed = formatRange(s.allowed[0], s.allowed[1], 'V')
  const swing = ev.result.requirements.find((r) => r.kind === 'limit' && r.key === 'output-swing')
  if (swing?.met === null) return [paragraph(`Output span over the input range: ${span}; no swing headroom entered, so it is not checked against the rails.`)]
  if (s.fits) return [paragraph(`Output span over the input range: ${span}, inside the usable swing ${allowed} (supply at its low tolerance less headroom).`)]
  return [callout('warning', 'OUTSIDE SWING', [paragraph(
    `Output span over the input range is ${span}, outside the usable swing ${allowed}: ` +
    `short by ${q(s.excess[0], 'V')} at the low end and ${q(s.excess[1], 'V')} at the high end.`)])]
}

function biasBlocks(ev: StageEvaluation): BlockContent[] {
  const b = ev.result.bias
  const how = {'ib-max': 'as entered (ib-max)', 'ios-max': 'as entered (ios-max)', doubling: 'from the 25 °C value doubled per ib-doubling interval', 'datasheet-25C': 'the 25 °C datasheet value'} as const
  const dark = ev.input.topology === 'transimpedance' && ev.input.idark > 0
    ? ` Dark current at the hot end ${q(b.idarkMax, 'A')}, ${b.idarkSource === 'idark-max' ? 'as entered (idark-max)' : `from ${q(ev.input.idark, 'A')} at 25 °C doubled every ${q(ev.input.idarkDoubling, 'K')}`}.`
    : ''
  const cal = ev.result.dc.calibrated
  const calibration = cal === null ? '' : ` Calibration ${cal.calibration}: the last column is the residual after a room-temperature calibration, ` +
    (cal.calibration === 'offset' ? 'which removes vos and the 25 °C part of the bias and offset currents; the rest remain.'
      : 'which removes vos, the 25 °C part of the currents, and the resistor-tolerance, aol-gain and cmrr terms; drift, tempco and psrr remain.')
  return [paragraph(
    `Bias current used over ${q(ev.input.temperature[0], '°C')} … ${q(ev.input.temperature[1], '°C')}: ${q(b.ibMax, 'A')}, ${how[b.ibSource]}; ` +
    `offset current ${q(b.iosMax, 'A')}, ${how[b.iosSource]}.${dark}${calibration}`)]
}

/** What the output drives (DESIGN §8.3). */
function loadBlocks(ev: StageEvaluation): BlockContent[] {
  const {input, result} = ev
  const out: BlockContent[] = []
  const parts = [
    input.opamp.rout ? `rout ${q(input.opamp.rout, 'Ω')}` : null,
    input.riso ? `riso ${q(input.riso.value, 'Ω')}` : null,
    input.cload > 0 ? `cload ${q(input.cload, 'F')}` : null,
    input.rload !== null ? `rload ${q(input.rload, 'Ω')}` : null
  ].filter((p): p is string => p !== null)
  if (input.cload > 0 || input.riso !== null || input.rload !== null) {
    out.push(paragraph(`The loop, the bandwidth and the noise include the load: ${parts.join(', ')}. ` +
      'Feedback is taken at the op-amp’s output pin; the signal, noise and DC figures at the load (after riso); the swing, slew and output-current limits at the pin.'))
  }
  return out
}

/** The difference network's own CMRR (DESIGN §8.1), beside the DC budget. */
function networkCmrrBlocks(ev: StageEvaluation): BlockContent[] {
  const c = ev.result.dc.networkCmrr
  if (c === null) return []
  return [paragraph(`Common-mode rejection of the resistor network alone at its worst tolerance corner: ${c.toFixed(1)} dB ` +
    '(ideal op-amp, tempco not included; the resistor terms above include the common mode it lets through, and the op-amp’s own CMRR is the separate cmrr term).')]
}

/** A section for a stage block that could not be evaluated (the build stops before the PDF). */
export function failedStageSection(block: StageBlockNode): BlockContent[] {
  return [heading(2, 'Stage ', code(block.id)), paragraph('This block has errors and was not evaluated.')]
}

export function stageSection(ctx: ReportContext, ev: StageEvaluation, shared: readonly RuleNote[] = []): BlockContent[] {
  const {input, result} = ev
  const op = input.opamp
  const out: BlockContent[] = [
    heading(2, `Stage ${input.id} — ${input.title}`),
    input.ina
      ? paragraph('Integrated instrumentation amplifier ', code(op.name), op.archetype ? ' (archetype).' : '.')
      : paragraph(`${TOPOLOGY_LABELS[input.topology]} on op-amp `, code(op.name), op.archetype ? ' (archetype).' : '.')
  ]
  out.push(schematicBlock(ctx, input))
  if (input.ina) {
    // An instrumentation stage: its amplifier is an ina block, listed in a table of its own.
    if (op.archetype) out.push(callout('info', 'ARCHETYPE', [paragraph(`Instrumentation amplifier “${op.name}” is a built-in archetype. `, INA_ARCHETYPE_DISCLAIMER)]))
    out.push(heading(3, 'Parameters'), paragraph(AS_WRITTEN), caption(nextTable(ctx, `Parameters of stage ${input.id}`)),
      entriesTable(ev.block.entries, ev.block.defaulted, 'stage'))
    if (op.archetype) out.push(caption(nextTable(ctx, `Archetype ${op.name}, values used`)), inaValuesTable(input.ina))
  } else {
    if (op.archetype) out.push(archetypeNotice(op))
    // One table: the stage's keys, the defaults applied and the op-amp's values as used.
    out.push(heading(3, 'Parameters'), paragraph(AS_WRITTEN), caption(nextTable(ctx, `Parameters of stage ${input.id}`)),
      entriesTable(ev.block.entries, ev.block.defaulted, 'stage', op, ctx.opampEntries?.get(op.name) ?? []))
  }
  out.push(heading(3, 'Results summary'), caption(nextTable(ctx, `Results of stage ${input.id}`)), summaryTable(result))
  out.push(...swingBlocks(ev))

  out.push(heading(3, 'DC error budget'),
    paragraph(`Worst case over ${q(input.temperature[0], '°C')} … ${q(input.temperature[1], '°C')} ` +
      `(ΔT = ${q(result.dc.temperatureSpan, 'K')}), full-scale output ${q(result.dc.fullScaleOutput, 'V')} ` +
      '(the largest ideal output over the input range, reference term included).'),
    ...biasBlocks(ev),
    caption(nextTable(ctx, `DC error budget of stage ${input.id}`)), dcTable(result, input), ...networkCmrrBlocks(ev), dcFigure(ctx, ev))
  out.push(...yieldBlocks(ctx, ev))

  out.push(heading(3, 'Noise budget'),
    paragraph(`Over ${q(result.noise.band[0], 'Hz')} … ${q(result.noise.band[1], 'Hz')} (brick-wall) at ${q(result.noise.temperature - 273.15, '°C')}; ` +
      'all sources uncorrelated, summed in power.'),
    caption(nextTable(ctx, `Noise budget of stage ${input.id}`)), noiseTable(result, input), ...noiseFigures(ctx, ev))

  if (input.topology === 'instrumentation') {
    out.push(heading(3, 'Bandwidth'),
      paragraph('An integrated instrumentation amplifier is compensated internally and its loop is not accessible, so there is no loop-gain analysis ' +
        'and the phase margin is not given (null in the JSON); the bandwidth is the part’s gbw/G, a single pole. ' +
        'Follow the maker’s guidance for capacitive loads on the output and the reference pin.'),
      caption(nextTable(ctx, `Bandwidth of stage ${input.id}`)), stabilityTable(result))
  } else {
    out.push(heading(3, 'Stability'), ...loadBlocks(ev), caption(nextTable(ctx, `Stability of stage ${input.id}`)), stabilityTable(result),
      loopFigure(ctx, ev))
  }

  const filter = filterTable(result)
  const response = responseFigure(ctx, ev)
  if (filter !== null && response !== null) {
    out.push(heading(3, 'Filter response'),
      paragraph('f0, Q and the passband gain are read off the solved response, op-amp included: f0 where the phase of H(f)/H(0) passes −90°, Q = |H(f0)/H(0)|. ' +
        'Capacitor tolerances are listed with the parameters; they change none of these figures.'),
      caption(nextTable(ctx, `Filter figures of stage ${input.id}`)), filter, response)
  }

  out.push(heading(3, 'Requirements'), ...requirementBlocks(ev))
  out.push(...alternativesBlocks(ctx, ev))
  out.push(heading(3, 'Practice and safety notes'), ...noteBlocks(ev.notes, shared, input.id, ctx.coverNotes))
  return out
}

/** An opamp block's section: its datasheet values as written and as used. */
export function opampSection(ctx: ReportContext, node: import('../../note/types.js').OpampBlockNode): BlockContent[] {
  if (node.ina !== undefined) {
    const out: BlockContent[] = [heading(3, 'Instrumentation amplifier ', code(node.id)), paragraph(AS_WRITTEN),
      caption(nextTable(ctx, `Datasheet values of instrumentation amplifier ${node.id}`)), entriesTable(node.entries, node.defaulted, 'opamp')]
    if (node.ina) out.push(caption(nextTable(ctx, `Instrumentation amplifier ${node.id}, values used by the engine`)), inaValuesTable(node.ina))
    return out
  }
  // The values as written; the values the engine uses are in each stage's parameter table.
  return [heading(3, 'Op-amp ', code(node.id)), paragraph(AS_WRITTEN),
    caption(nextTable(ctx, `Datasheet values of op-amp ${node.id}`)), entriesTable(node.entries, node.defaulted, 'opamp')]
}
