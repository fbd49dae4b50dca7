/**
 * The parameter tables: a stage's keys as written plus every default applied, and an
 * op-amp's datasheet values (as written for a block, as used for an archetype).
 */
import type {BlockContent, Table} from 'mdast'
import {ARCHETYPE_DISCLAIMER} from '../../engine/archetypes.js'
import type {InaParams, OpampParams} from '../../engine/types.js'
import type {BlockEntry, DefaultedValue} from '../../note/types.js'
import {q} from '../format.js'
import {callout, code, emphasis, paragraph, table} from '../mdast.js'

/** Keys as written, then the defaults applied, marked as such. */
/** A 1/f corner, or "none" when there is none (0 Hz is no corner, not a frequency). */
const corner = (f: number): string => (f > 0 ? q(f, 'Hz') : 'none')

export function entriesTable(entries: BlockEntry[], defaulted: DefaultedValue[]): Table {
  const rows = [
    ...entries.map((e) => [[code(e.key)], e.raw, 'as written']),
    ...defaulted.map((d) => [[code(d.key)], d.value, [emphasis('default applied')]])
  ]
  return table(['Key', 'Value', 'Source'], rows)
}

const dbOf = (linear: number): string => `${(20 * Math.log10(linear)).toFixed(1)} dB`

/** An op-amp's values as the engine uses them. */
export function opampValuesTable(op: OpampParams): Table {
  const rows: string[][] = [
    ['Input type', op.inputType],
    ['Offset voltage, max at 25 °C', q(op.vos, 'V')],
    ['Offset drift, max', q(op.vosDrift, 'V/K')],
    ['Bias current, max at 25 °C', q(op.ib, 'A')],
    ['Offset current, max at 25 °C', q(op.ios, 'A')],
    ['Bias current, max over temperature', op.ibMax === null ? 'not entered' : q(op.ibMax, 'A')],
    ['Offset current, max over temperature', op.iosMax === null ? 'not entered' : q(op.iosMax, 'A')],
    ['Voltage noise density (white) / 1/f corner', `${q(op.en, 'V/√Hz')} / ${corner(op.enCorner)}`],
    ['Current noise density (white) / 1/f corner', `${q(op.in, 'A/√Hz')} / ${corner(op.inCorner)}`],
    ['Gain-bandwidth product', q(op.gbw, 'Hz')],
    ['Open-loop gain', dbOf(op.aol)],
    ['Phase margin as unity follower', `${op.pmUnity.toFixed(1)}°`],
    ['CMRR / PSRR', `${dbOf(op.cmrr)} / ${dbOf(op.psrr)}`],
    ['Input capacitance, differential / common-mode', `${q(op.cinDiff, 'F')} / ${q(op.cinCm, 'F')}`],
    ['Slew rate', op.slew === null ? 'not entered' : q(op.slew, 'V/s')],
    ['Output swing headroom, negative / positive rail',
      `${entered(op.swingHeadroomNeg ?? op.swingHeadroom, 'V')} / ${entered(op.swingHeadroomPos ?? op.swingHeadroom, 'V')}`],
    ['Input common-mode headroom, negative / positive rail',
      `${entered(op.cmHeadroomNeg ?? op.cmHeadroom, 'V')} / ${entered(op.cmHeadroomPos ?? op.cmHeadroom, 'V')}`],
    ['Output current, max', entered(op.ioutMax, 'A')],
    ['Open-loop output resistance', entered(op.rout, 'Ω')]
  ]
  return table(['Parameter', 'Value used'], rows, ['left', 'right'])
}

const entered = (v: number | null, unit: string): string => (v === null ? 'not entered' : q(v, unit))

/** The archetype disclaimer, wherever an archetype is used. */
export const archetypeNotice = (op: OpampParams): BlockContent =>
  callout('info', 'ARCHETYPE', [paragraph(`Op-amp “${op.name}” is a built-in archetype. `, ARCHETYPE_DISCLAIMER)])

/** A number to 3 significant digits without prefix. */
const plain = (x: number): string => String(Number(x.toPrecision(3)))

/** An instrumentation amplifier's values as the engine uses them (DESIGN §8.2). */
export function inaValuesTable(ina: InaParams): Table {
  const rows: string[][] = [
    ['Input type', ina.inputType],
    ['Gain constant (G = 1 + constant/rg)', q(ina.gainConstant, 'Ω')],
    ['Gain error / drift, excluding rg', `${plain(ina.gainError * 100)} % / ${plain(ina.gainDrift * 1e6)} ppm/K`],
    ['Nonlinearity, of the output span', `${plain(ina.nonlinearity * 1e6)} ppm`],
    ['Offset, input / output stage', `${q(ina.vosIn, 'V')} / ${q(ina.vosOut, 'V')}`],
    ['Offset drift, input / output stage', `${q(ina.vosInDrift, 'V/K')} / ${q(ina.vosOutDrift, 'V/K')}`],
    ['Bias / offset current, max at 25 °C', `${q(ina.ib, 'A')} / ${q(ina.ios, 'A')}`],
    ['Voltage noise, input / output stage; 1/f corner', `${q(ina.enIn, 'V/√Hz')} / ${q(ina.enOut, 'V/√Hz')}; ${q(ina.enCorner, 'Hz')}`],
    ['Current noise; 1/f corner', `${q(ina.in, 'A/√Hz')}; ${q(ina.inCorner, 'Hz')}`],
    ['CMRR at the stage gain / PSRR (input-referred)', `${dbOf(ina.cmrr)} / ${dbOf(ina.psrr)}`],
    ['Gain-bandwidth (bandwidth ≈ gbw/G)', q(ina.gbw, 'Hz')]
  ]
  return table(['Parameter', 'Value used'], rows, ['left', 'right'])
}
