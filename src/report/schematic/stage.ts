/**
 * A stage's schematic (DESIGN §8.9): the parts come from the stage's compiled netlist (every
 * resistor and capacitor the engine solves, none it does not), the labels from the stage's
 * values, the drawing from its topology's layout. The op-amp's own input capacitances and
 * output resistance are part of its model, not of the board, and are not drawn. An
 * instrumentation stage has no netlist of ours (the part is a block model, DESIGN §8.2): its
 * board parts are rg, rs in each leg and rload.
 */
import {stageNetlist} from '../../engine/topology/index.js'
import type {StageInput, Topology} from '../../engine/types.js'
import {formatQuantity, formatRange} from '../../units/format.js'
import {drawLayout, type PartLabel} from './draw.js'
import {LAYOUTS} from './layouts/index.js'
import type {Drawing, PartKey} from './types.js'

/** Netlist labels that belong to the op-amp's model rather than to the board. */
const OPAMP_MODEL_LABELS: ReadonlySet<string> = new Set(['cin-cm+', 'cin-cm-', 'cin-diff', 'rout'])

/** Topologies with a reference node at `vref` (DESIGN §3.3, §8.1, §8.2, §8.4). */
const HAS_VREF: ReadonlySet<Topology> = new Set<Topology>(['inverting', 'transimpedance', 'difference', 'lowpass-mfb', 'instrumentation'])

/** Topologies driven by a differential source with a common mode (DESIGN §8.1, §8.2). */
const DIFFERENTIAL: ReadonlySet<Topology> = new Set<Topology>(['difference', 'instrumentation'])

export interface SchematicComponent {
  value: number
  unit: 'Ω' | 'F'
}

/** An instrumentation stage's board parts, one entry per drawn symbol (rs once per leg). */
function instrumentationComponents(input: StageInput): [PartKey, SchematicComponent][] {
  const out: [PartKey, SchematicComponent][] = []
  if (input.rg) out.push(['rg', {value: input.rg.value, unit: 'Ω'}])
  if (input.rs && input.rs.value > 0) out.push(['rs', {value: input.rs.value, unit: 'Ω'}], ['rs', {value: input.rs.value, unit: 'Ω'}])
  if (input.rload !== null && input.rload !== Infinity) out.push(['rload', {value: input.rload, unit: 'Ω'}])
  return out
}

/**
 * Every board component of the stage, one entry per symbol drawn: netlist label → SI value
 * and unit, in netlist order (a difference stage's rs once per leg). A capacitor of 0 F (the
 * engine keeps cf at 0 F for its Cf search) or a 0 Ω wire is not a component.
 */
export function schematicComponentList(input: StageInput): [PartKey, SchematicComponent][] {
  if (input.topology === 'instrumentation') return instrumentationComponents(input)
  const out: [PartKey, SchematicComponent][] = []
  for (const e of stageNetlist(input).elements) {
    if (OPAMP_MODEL_LABELS.has(e.label) || e.value === 0) continue
    out.push([e.label, e.kind === 'g' ? {value: 1 / e.value, unit: 'Ω'} : {value: e.value, unit: 'F'}])
  }
  return out
}

const v = (value: number, unit: string): string => formatQuantity(value, unit, {digits: 3})
const rail = (value: number): string => (value > 0 ? `+${v(value, 'V')}` : v(value, 'V'))

/** The stage's components by key (each key once): label → SI value and unit. */
export function schematicComponents(input: StageInput): Map<PartKey, SchematicComponent> {
  return new Map(schematicComponentList(input))
}

/** Labels of everything the stage's drawing shows: components, source, op-amp, supply, reference, output. */
export function schematicLabels(input: StageInput): Map<PartKey, PartLabel> {
  const labels = new Map<PartKey, PartLabel>()
  for (const [key, c] of schematicComponents(input)) labels.set(key, {lines: [key, v(c.value, c.unit)]})
  const current = input.topology === 'transimpedance'
  const range = formatRange(input.input[0], input.input[1], current ? 'A' : 'V')
  if (DIFFERENTIAL.has(input.topology)) {
    // Two halves of the differential voltage around the common mode: V± = vcm ± vd/2.
    labels.set('source', {lines: ['source', `vd ${range}`, 'vd/2']})
    labels.set('source-half', {lines: ['vd/2']})
    const [lo, hi] = input.inputCm
    if (lo !== 0 || hi !== 0) labels.set('vcm', {lines: ['vcm', lo === hi ? v(lo, 'V') : formatRange(lo, hi, 'V')]})
  } else {
    const source = ['source', range]
    if (current && input.idark > 0) source.push(`idark ${v(input.idark, 'A')}`)
    labels.set('source', {lines: source})
  }
  const amp = input.ina ?? input.opamp
  labels.set('opamp', {lines: amp.archetype ? [amp.name, '(archetype)'] : [amp.name]})
  labels.set('supply', {lines: [rail(input.supply[1]), rail(input.supply[0])]})
  if (HAS_VREF.has(input.topology) && input.vref !== 0) labels.set('vref', {lines: ['vref', v(input.vref, 'V')]})
  labels.set('out', {lines: labels.has('rload') || labels.has('cload') ? ['out'] : ['out', 'load: open']})
  return labels
}

/** The stage's schematic. */
export function stageSchematic(input: StageInput): Drawing {
  return drawLayout(LAYOUTS[input.topology], schematicLabels(input))
}
