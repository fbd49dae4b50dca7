/**
 * The parameter tables: a stage's keys as written plus every default applied, and an
 * op-amp's datasheet values (as written for a block, as used for an archetype).
 */
import type {BlockContent, Table} from 'mdast'
import {ARCHETYPE_DISCLAIMER} from '../../engine/archetypes.js'
import type {InaParams, OpampParams} from '../../engine/types.js'
import type {BlockEntry, DefaultedValue} from '../../note/types.js'
import {q as fq} from '../format.js'
import {formatSlew} from '../../units/format.js'
import {OPAMP_KEYS} from '../../note/keys.js'
import {dimensionOfKey, echoValue} from '../echo.js'
import {callout, code, emphasis, paragraph, table} from '../mdast.js'

/** A 1/f corner, or "none" when there is none (0 Hz is no corner, not a frequency). */

/** The sentence that stands once for every "as written" row of a parameter table. */
export const AS_WRITTEN = 'Values are as written in the note (prefix kept, unit added) unless the Source column says otherwise.'

/**
 * Keys as written (Source left empty: `AS_WRITTEN` says it once), then the defaults applied,
 * marked as such; for a stage, then the op-amp's values as the engine uses them.
 */
export function entriesTable(entries: BlockEntry[], defaulted: DefaultedValue[], block: 'stage' | 'opamp' = 'stage', op: OpampParams | null = null,
  opEntries: readonly BlockEntry[] = []): Table {
  const rows: (string | ReturnType<typeof code>[] | ReturnType<typeof emphasis>[])[][] = [
    ...entries.map((e) => [[code(e.key)], echoValue(e.raw, dimensionOfKey(e.key.replace(/^require\./, ''), block)), '']),
    ...defaulted.map((d) => [[code(d.key)], echoValue(d.value, null), [emphasis('default applied')]])
  ]
  if (op !== null) {
    for (const [name, value] of opampRows(op, opEntries)) rows.push([name, value, [emphasis('op-amp, used')]])
  }
  return table(['Key', 'Value', 'Source'], rows)
}

const dbOfLinear = (linear: number): string => `${(20 * Math.log10(linear)).toFixed(1)} dB`

/** An op-amp's values as the engine uses them. */
export function opampValuesTable(op: OpampParams): Table {
  return table(['Parameter', 'Value used'], opampRows(op), ['left', 'right'])
}

/** The op-amp's values; a value its block wrote is echoed as written (the author's prefix kept). */
function opampRows(op: OpampParams, written: readonly BlockEntry[] = []): string[][] {
  const raw = new Map<string, string>()
  for (const e of written) {
    const spec = (OPAMP_KEYS as Record<string, {field: string} | undefined>)[e.key]
    if (spec !== undefined) raw.set(spec.field, echoValue(e.raw, dimensionOfKey(e.key, 'opamp')))
  }
  const q = (value: number | null, unit: string, field?: string): string => (field !== undefined ? raw.get(field) : undefined) ?? fq(value, unit)
  const corner = (f: number, field: string): string => raw.get(field) ?? (f > 0 ? fq(f, 'Hz') : 'none')
  const dbOf = (linear: number, field: string): string => raw.get(field) ?? dbOfLinear(linear)
  return [
    ['Input type', op.inputType],
    ['Offset voltage, max at 25 °C', q(op.vos, 'V', 'vos')],
    ['Offset drift, max', q(op.vosDrift, 'V/K', 'vosDrift')],
    ['Bias current, max at 25 °C', q(op.ib, 'A', 'ib')],
    ['Offset current, max at 25 °C', q(op.ios, 'A', 'ios')],
    ['Bias current, max over temperature', op.ibMax === null ? 'not entered' : q(op.ibMax, 'A', 'ibMax')],
    ['Offset current, max over temperature', op.iosMax === null ? 'not entered' : q(op.iosMax, 'A', 'iosMax')],
    ['Voltage noise density (white) / 1/f corner', `${q(op.en, 'V/√Hz', 'en')} / ${corner(op.enCorner, 'enCorner')}`],
    ['Current noise density (white) / 1/f corner', `${q(op.in, 'A/√Hz', 'in')} / ${corner(op.inCorner, 'inCorner')}`],
    ['Gain-bandwidth product', q(op.gbw, 'Hz', 'gbw')],
    ['Open-loop gain', dbOf(op.aol, 'aol')],
    ['Phase margin as unity follower', `${op.pmUnity.toFixed(1)}°`],
    ['CMRR / PSRR', `${dbOf(op.cmrr, 'cmrr')} / ${dbOf(op.psrr, 'psrr')}`],
    ['Input capacitance, differential / common-mode', `${q(op.cinDiff, 'F', 'cinDiff')} / ${q(op.cinCm, 'F', 'cinCm')}`],
    ['Slew rate', op.slew === null ? 'not entered' : raw.get('slew') ?? formatSlew(op.slew)],
    ['Output swing headroom, negative / positive rail',
      `${entered(op.swingHeadroomNeg ?? op.swingHeadroom, 'V')} / ${entered(op.swingHeadroomPos ?? op.swingHeadroom, 'V')}`],
    ['Input common-mode headroom, negative / positive rail',
      `${entered(op.cmHeadroomNeg ?? op.cmHeadroom, 'V')} / ${entered(op.cmHeadroomPos ?? op.cmHeadroom, 'V')}`],
    ['Output current, max', entered(op.ioutMax, 'A')],
    ['Open-loop output resistance', entered(op.rout, 'Ω')]
  ]
}

const entered = (v: number | null, unit: string): string => (v === null ? 'not entered' : fq(v, unit))

/** The archetype disclaimer, wherever an archetype is used. */
export const archetypeNotice = (op: OpampParams): BlockContent =>
  callout('info', 'ARCHETYPE', [paragraph(`Op-amp “${op.name}” is a built-in archetype. `, ARCHETYPE_DISCLAIMER)])

const q = fq
const dbOf = (linear: number): string => `${(20 * Math.log10(linear)).toFixed(1)} dB`

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
