/**
 * A chain's computed tables: DC error by source and by contributor (at the converter input,
 * referred to the chain input, in LSB, share of the worst case), noise by stage, and the
 * resolution figures.
 */
import type {BlockContent, Table} from 'mdast'
import type {ChainEvaluation} from '../../evaluate/chains.js'
import {DC_LABELS} from '../../results/labels.js'
import {column, db, pct, q} from '../format.js'
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
  // One prefix a column (its largest value's): every row of the table, totals included.
  const all = [...sourceRows.map((s) => s.output), total, r.dc.rssOutput,
    ...(r.dc.calibrated === null ? [] : [r.dc.calibrated.worstCaseOutput, r.dc.calibrated.rssOutput])]
  const atConverter = column(all, 'V')
  const atInput = column(all.map((v) => (g > 0 ? v / g : null)), unitIn)
  let at = 0
  const row = (name: string | ReturnType<typeof strong>, v: number, share: string) => {
    const i = at++
    return [[name], atConverter[i] as string, atInput[i] as string, lsbNumber(lsb === null ? null : v / lsb), share]
  }
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
  const outCol = column(nonzero.map((c) => c.output), 'V')
  const calCol = calibrated === null ? [] : column(nonzero.map((c) => calibrated[c.i]?.output ?? null), 'V')
  const contributorRows = nonzero.map((c, i) => [
    c.source, [label(c.source, c.key, converter), ' (', code(c.key), ')'], outCol[i] as string,
    ...(calibrated === null ? [] : [calCol[i] as string]),
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
  // Rows as [label, value at the converter, share]; the two value columns share one prefix each.
  const lines: [string | ReturnType<typeof strong>[], number, number | null, string][] = r.stageNoise.map((s) => [`Stage ${s.stage}`, s.outputRms, s.outputRms / g, share(s.outputRms)])
  lines.push([[strong('Analog chain, rms')], r.noise.outputRms, r.noise.outputRms / g, share(r.noise.outputRms)])
  if (r.noise.zeroSignalOutputRms !== r.noise.outputRms) lines.push(['Analog chain at zero signal (floor)', r.noise.zeroSignalOutputRms, r.noise.zeroSignalOutputRms / g, '—'])
  if (c !== null && r.noise.converterRms !== null) {
    lines.push([`Converter ${c.name} noise`, c.noise, c.noise / g, share(c.noise)],
      ['Quantisation, LSB/√12', c.quantization, c.quantization / g, share(c.quantization)],
      [[strong('At the converter, rms')], r.noise.converterRms, r.noise.inputRms, '100.0 %'])
  }
  const atConverter = column(lines.map((l) => l[1]), 'V')
  const atInput = column(lines.map((l) => l[2]), unitIn)
  const rows: (string | ReturnType<typeof strong>[])[][] = lines.map((l, i) => [l[0], atConverter[i] as string, atInput[i] as string, l[3]])
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
