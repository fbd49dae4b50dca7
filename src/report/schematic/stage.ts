/**
 * A stage's schematic (DESIGN §8.9): the parts come from the stage's compiled netlist (every
 * resistor and capacitor the engine solves, none it does not), the labels from the stage's
 * values, the drawing from its topology's layout. The op-amp's own input capacitances are
 * part of its model, not of the board, and are not drawn.
 */
import {stageNetlist} from '../../engine/topology/index.js'
import type {StageInput} from '../../engine/types.js'
import {formatQuantity, formatRange} from '../../units/format.js'
import {drawLayout, type PartLabel} from './draw.js'
import {LAYOUTS} from './layouts/index.js'
import type {Drawing, PartKey} from './types.js'

/** Netlist labels that belong to the op-amp's model rather than to the board. */
const OPAMP_MODEL_LABELS: ReadonlySet<string> = new Set(['cin-cm+', 'cin-cm-', 'cin-diff'])

/** Topologies whose + input sits at `vref` (DESIGN §3.3). */
const HAS_VREF: ReadonlySet<string> = new Set(['inverting', 'transimpedance'])

const v = (value: number, unit: string): string => formatQuantity(value, unit, {digits: 3})
const rail = (value: number): string => (value > 0 ? `+${v(value, 'V')}` : v(value, 'V'))

/**
 * The stage's components as drawn: netlist label → SI value and unit. A capacitor of 0 F
 * (the engine keeps cf at 0 F for its Cf search) is not a component.
 */
export function schematicComponents(input: StageInput): Map<PartKey, {value: number; unit: 'Ω' | 'F'}> {
  const out = new Map<PartKey, {value: number; unit: 'Ω' | 'F'}>()
  for (const e of stageNetlist(input).elements) {
    if (OPAMP_MODEL_LABELS.has(e.label) || e.value === 0) continue
    out.set(e.label, e.kind === 'g' ? {value: 1 / e.value, unit: 'Ω'} : {value: e.value, unit: 'F'})
  }
  return out
}

/** Labels of everything the stage's drawing shows: components, source, op-amp, supply, reference, output. */
export function schematicLabels(input: StageInput): Map<PartKey, PartLabel> {
  const labels = new Map<PartKey, PartLabel>()
  for (const [key, c] of schematicComponents(input)) labels.set(key, {lines: [key, v(c.value, c.unit)]})
  const current = input.topology === 'transimpedance'
  const source = [current ? 'source' : 'source', formatRange(input.input[0], input.input[1], current ? 'A' : 'V')]
  if (current && input.idark > 0) source.push(`idark ${v(input.idark, 'A')}`)
  labels.set('source', {lines: source})
  labels.set('opamp', {lines: input.opamp.archetype ? [input.opamp.name, '(archetype)'] : [input.opamp.name]})
  labels.set('supply', {lines: [rail(input.supply[1]), rail(input.supply[0])]})
  if (HAS_VREF.has(input.topology) && input.vref !== 0) labels.set('vref', {lines: ['vref', v(input.vref, 'V')]})
  labels.set('out', {lines: ['out', 'load: open']})
  return labels
}

/** The stage's schematic, or null when its topology has no layout yet. */
export function stageSchematic(input: StageInput): Drawing | null {
  const layout = LAYOUTS[input.topology]
  return layout === undefined ? null : drawLayout(layout, schematicLabels(input))
}
