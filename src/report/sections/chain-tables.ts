/**
 * A chain's computed tables: DC error by source and by contributor (at the converter input,
 * referred to the chain input, in LSB, share of the worst case), noise by stage, and the
 * resolution figures.
 */
import type {BlockContent, Table} from 'mdast'
import type {ChainEvaluation} from '../../evaluate/chains.js'
import {DC_LABELS} from '../../results/labels.js'
import {db, pct, q} from '../format.js'
import {code, paragraph, strong, table} from '../mdast.js'

const CONVERTER_LABELS: Record<string, string> = {
  offset: 'Converter offset',
  'offset-drift': 'Converter offset drift',
  'gain-error': 'Converter gain error',
  'gain-drift': 'Converter gain drift (reference included)',
  inl: 'Converter integral nonlinearity'
}

const label = (source: string, key: string, converter: string | null): string =>
  source === converter ? CONVERTER_LABELS[key] ?? key : (DC_LABELS as Record<string, string>)[key] ?? key

/** A count of LSB: the number alone in the tables' "In LSB" columns, with the unit elsewhere. */
const lsbNumber = (v: number | null): string => (v === null ? '—' : v.toFixed(v < 10 ? 2 : v < 100 ? 1 : 0))
const lsbText = (v: number | null): string => (v === null ? '—' : `${lsbNumber(v)} LSB`)

export function chainDcTables(ev: ChainEvaluation): {bySource: Table; sourceRows: {key: string; output: number}[]; contributors: Table; zeros: BlockContent[]} {
  const r = ev.result
  const unitIn = ev.topologies[0] === 'transimpedance' ? 'A' : 'V'
  const g = Math.abs(r.gain)
  const lsb = r.converter?.lsb ?? null
  const total = r.dc.worstCaseOutput
  const sources = [...r.stages, ...(r.converter === null ? [] : [r.converter.name])]
  const sourceRows = sources.map((s) => ({key: s === r.converter?.name ? `converter ${s}` : `stage ${s}`, output: r.dc.contributors.filter((c) => c.source === s).reduce((a, c) => a + c.output, 0)}))
  const row = (name: string | ReturnType<typeof strong>, v: number, share: string) =>
    [[name], q(v, 'V'), q(g > 0 ? v / g : null, unitIn), lsbNumber(lsb === null ? null : v / lsb), share]
  const rows = sourceRows.map((s) => row(s.key, s.output, total > 0 ? pct(s.output / total) : '—'))
  rows.push(row(strong('Worst case (sum)'), total, '100.0 %'), row(strong('RSS'), r.dc.rssOutput, '—'))
  if (r.dc.calibrated !== null) {
    rows.push(row(strong(`After calibration (${r.dc.calibrated.calibration}), worst case`), r.dc.calibrated.worstCaseOutput, '—'),
      row(strong(`After calibration, RSS`), r.dc.calibrated.rssOutput, '—'))
  }
  const bySource = table(['Source', 'At converter input', 'Referred to chain input', 'In LSB', 'Share of worst case'], rows, ['left', 'right', 'right', 'right', 'right'])

  const converter = r.converter?.name ?? null
  const nonzero = r.dc.contributors.map((c, i) => ({...c, i})).filter((c) => c.output > 0).sort((a, b) => b.output - a.output || a.i - b.i)
  const calibrated = r.dc.calibrated?.contributors ?? null
  const contributorRows = nonzero.map((c) => [
    c.source, [label(c.source, c.key, converter), ' (', code(c.key), ')'], q(c.output, 'V'),
    ...(calibrated === null ? [] : [q(calibrated[c.i]?.output ?? null, 'V')]),
    lsbNumber(lsb === null ? null : c.output / lsb), total > 0 ? pct(c.output / total) : '—'
  ])
  const contributors = table(['Source', 'Contributor', 'At converter input', ...(calibrated === null ? [] : ['After calibration']), 'In LSB', 'Share'],
    contributorRows, ['left', 'left', 'right', ...(calibrated === null ? [] : ['right' as const]), 'right', 'right'])
  const zeroRows = r.dc.contributors.filter((c) => !(c.output > 0))
  const zeros: BlockContent[] = zeroRows.length === 0 ? [] : [paragraph(`Terms that are zero for this chain (listed for completeness): ${zeroRows.map((c) => `${c.source} ${c.key}`).join(', ')}.`)]
  return {bySource, sourceRows, contributors, zeros}
}

export function chainNoiseTable(ev: ChainEvaluation): Table {
  const r = ev.result
  const unitIn = ev.topologies[0] === 'transimpedance' ? 'A' : 'V'
  const g = Math.abs(r.gain)
  const c = r.converter
  const sigma2 = (r.noise.converterRms ?? r.noise.outputRms) ** 2
  const share = (v: number): string => (sigma2 > 0 ? pct(v ** 2 / sigma2) : '—')
  const rows: (string | ReturnType<typeof strong>[])[][] = r.stageNoise.map((s) => [`Stage ${s.stage}`, q(s.outputRms, 'V'), q(s.outputRms / g, unitIn), share(s.outputRms)])
  rows.push([[strong('Analog chain, rms')], q(r.noise.outputRms, 'V'), q(r.noise.outputRms / g, unitIn), share(r.noise.outputRms)])
  if (r.noise.zeroSignalOutputRms !== r.noise.outputRms) rows.push(['Analog chain at zero signal (floor)', q(r.noise.zeroSignalOutputRms, 'V'), q(r.noise.zeroSignalOutputRms / g, unitIn), '—'])
  if (c !== null && r.noise.converterRms !== null) {
    rows.push([`Converter ${c.name} noise`, q(c.noise, 'V'), q(c.noise / g, unitIn), share(c.noise)],
      ['Quantisation, LSB/√12', q(c.quantization, 'V'), q(c.quantization / g, unitIn), share(c.quantization)],
      [[strong('At the converter, rms')], q(r.noise.converterRms, 'V'), q(r.noise.inputRms, unitIn), '100.0 %'])
  }
  return table(['Source', 'At converter input, rms', 'Referred to chain input', 'Share of noise power'], rows, ['left', 'right', 'right', 'right'])
}

export function resolutionTable(ev: ChainEvaluation): Table {
  const r = ev.result
  const c = r.converter
  const n = r.noise
  const bits = (v: number | null): string => (v === null ? '—' : `${v.toFixed(2)} bits`)
  const rows: string[][] = []
  if (c !== null) {
    rows.push(['Converter', `${c.name}${c.archetype ? ' (archetype)' : ''}: ${c.bits} bits over ${q(c.input[0], 'V')} … ${q(c.input[1], 'V')}`],
      ['LSB = span / 2^bits', q(c.lsb, 'V')],
      ['Noise at the converter, rms / peak-to-peak (6.6 ×)', `${q(n.converterRms, 'V')} / ${q(n.converterRms === null ? null : 6.6 * n.converterRms, 'V')}`],
      ['Noise-free bits, log2(span / (6.6σ))', bits(n.noiseFreeBits)],
      ['Effective resolution, log2(span / σ)', bits(n.effectiveBits)],
      ['Fraction of the range used', r.rangeUsed === null ? '—' : pct(r.rangeUsed)],
      ['Worst-case DC error at the converter', `${q(r.dc.worstCaseOutput, 'V')} = ${lsbText(r.dc.worstCaseLsb)}`])
  }
  rows.push(['Chain −3 dB bandwidth', q(r.bandwidth, 'Hz')])
  if (c !== null) {
    rows.push(['Sample rate', c.sampleRate === null ? 'not entered' : q(c.sampleRate, 'Hz')])
    if (c.sampleRate !== null) {
      rows.push(['Alias rejection over fs − fH … fs + fH', r.aliasRejection === null ? 'not defined (fs ≤ 2·fH)' : db(r.aliasRejection)],
        ['Noise integrated to 10× the chain bandwidth', q(n.widebandRms, 'V')])
    }
  }
  return table(['Quantity', 'Value'], rows, ['left', 'right'])
}
