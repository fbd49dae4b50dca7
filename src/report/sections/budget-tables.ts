/**
 * The stage's computed tables: results summary, DC error budget, noise budget, stability.
 */
import type {Table} from 'mdast'
import type {StageInput, StageResult} from '../../engine/types.js'
import {dcPresent, noisePresent} from '../present.js'
import {DC_LABELS, NOISE_LABELS, gainUnit, inputUnit} from '../../results/labels.js'
import {column, db, deg, pct, q} from '../format.js'
import {code, strong} from '../mdast.js'
import {table} from '../mdast.js'

/** Gain, noise gain and the headline figures of the three budgets. */
export function summaryTable(r: StageResult): Table {
  const iu = inputUnit(r.topology)
  return table(['Quantity', 'Value'], [
    ['Signal gain at DC', q(r.gain, gainUnit(r.topology), 4)],
    ['Noise gain at DC', q(r.noiseGain, 'V/V', 4)],
    ['DC error at output, worst case / RSS', `${q(r.dc.worstCaseOutput, 'V')} / ${q(r.dc.rssOutput, 'V')}`],
    ['DC error referred to input, worst case / RSS', `${q(r.dc.worstCaseInput, iu)} / ${q(r.dc.rssInput, iu)}`],
    [`Output noise over ${q(r.noise.band[0], 'Hz')} … ${q(r.noise.band[1], 'Hz')}, rms / p-p${signalShot(r) ? ', at full-scale signal' : ''}`,
      `${q(r.noise.outputRms, 'V')} / ${q(r.noise.outputPeakToPeak, 'V')}`],
    ...(signalShot(r) ? [['Output noise at zero signal (the floor), rms', q(r.noise.zeroSignalOutputRms, 'V')]] : []),
    ...(r.dc.calibrated === null ? [] : [[`DC error at output after calibration (${r.dc.calibrated.calibration}), worst case / RSS`,
      `${q(r.dc.calibrated.worstCaseOutput, 'V')} / ${q(r.dc.calibrated.rssOutput, 'V')}`]]),
    r.topology === 'instrumentation'
      ? ['Phase margin', 'not analysed (compensated inside the part)']
      : ['Phase margin at crossover', `${deg(r.stability.phaseMargin)} at ${q(r.stability.crossover, 'Hz')}`],
    ['Closed-loop −3 dB bandwidth', q(r.stability.bandwidth, 'Hz')]
  ], ['left', 'right'])
}

/** True when the stage has a signal-dependent noise source (the transimpedance signal's shot noise). */
const signalShot = (r: StageResult): boolean => r.noise.contributors.some((c) => c.key === 'shot-signal')

/**
 * Every DC contributor the circuit has, output- and input-referred, with its share of the
 * worst case; with a calibration (DESIGN §4.6), a column of the residual after calibration.
 */
export function dcTable(r: StageResult, input: StageInput): Table {
  const iu = inputUnit(r.topology)
  const g = Math.abs(r.gain)
  const cal = r.dc.calibrated
  const present = r.dc.contributors.filter((c) => dcPresent(input, c.key))
  // One prefix a column (its largest value's): the contributors, then the worst case and RSS.
  const out = column([...present.map((c) => c.output), r.dc.worstCaseOutput, r.dc.rssOutput], 'V')
  const inp = column([...present.map((c) => (g > 0 ? c.output / g : null)), r.dc.worstCaseInput, r.dc.rssInput], iu)
  const after = cal === null ? null
    : column([...present.map((c) => cal.contributors.find((k) => k.key === c.key)?.output ?? null), cal.worstCaseOutput, cal.rssOutput], 'V')
  const residual = (i: number): string[] => (after === null ? [] : [after[i] as string])
  const n = present.length
  const rows = present.map((c, i) => [
    [DC_LABELS[c.key], ' (', code(c.key), ')'],
    out[i] as string,
    inp[i] as string,
    r.dc.worstCaseOutput > 0 ? pct(c.output / r.dc.worstCaseOutput) : '—',
    ...residual(i)
  ])
  rows.push(
    [[strong('Worst case (sum)')], out[n] as string, inp[n] as string, '100.0 %', ...residual(n)],
    [[strong('RSS')], out[n + 1] as string, inp[n + 1] as string, '—', ...residual(n + 1)]
  )
  const head = ['Contributor', 'At output', 'Referred to input', 'Share of worst case', ...(cal === null ? [] : ['At output after calibration'])]
  return table(head, rows, ['left', 'right', 'right', 'right', ...(cal === null ? [] : ['right' as const])])
}

/** Every noise contributor the circuit has: rms over the band, with its share of the total power. */
export function noiseTable(r: StageResult, input: StageInput): Table {
  const iu = inputUnit(r.topology)
  const g = Math.abs(r.gain)
  const total2 = r.noise.outputRms ** 2
  const present = r.noise.contributors.filter((c) => noisePresent(input, c.key))
  const shot = signalShot(r)
  const z = r.noise.zeroSignalOutputRms
  // One prefix a column of rms values (its largest value's), totals included; the
  // peak-to-peak row is another quantity and keeps its own.
  const out = column([...present.map((c) => c.outputRms), r.noise.outputRms, ...(shot ? [z] : [])], 'V')
  const inp = column([...present.map((c) => (g > 0 ? c.outputRms / g : null)), r.noise.inputRms, ...(shot ? [g > 0 ? z / g : null] : [])], iu)
  const n = present.length
  const rows = present.map((c, i) => [
    [NOISE_LABELS[c.key], ' (', code(c.key), ')'],
    out[i] as string,
    inp[i] as string,
    total2 > 0 ? pct(c.outputRms ** 2 / total2) : '—'
  ])
  const atFull = shot ? ' at full-scale signal' : ''
  rows.push(
    [[strong(`Total, rms${atFull}`)], out[n] as string, inp[n] as string, '100.0 %'],
    [[strong(`Total, peak-to-peak (6.6 × rms)${atFull}`)], q(r.noise.outputPeakToPeak, 'V'), q(r.noise.inputRms * 6.6, iu), '—']
  )
  if (shot) {
    rows.push([[strong('Total, rms at zero signal (without shot-signal)')], out[n + 1] as string, inp[n + 1] as string, total2 > 0 ? pct(z ** 2 / total2) : '—'])
  }
  return table(['Contributor', 'Output rms', 'Referred to input', 'Share of noise power'], rows,
    ['left', 'right', 'right', 'right'])
}

/** Loop stability and closed-loop response figures. */
export function stabilityTable(r: StageResult): Table {
  const s = r.stability
  if (r.topology === 'instrumentation') {
    return table(['Quantity', 'Value'], [
      ['Phase margin', 'not analysed (compensated inside the part)'],
      ['Closed-loop −3 dB bandwidth (gbw/G)', q(s.bandwidth, 'Hz')]
    ], ['left', 'right'])
  }
  const rows: string[][] = [
    ['Loop-gain crossover', q(s.crossover, 'Hz')],
    ['Phase margin', s.phaseMargin === null ? 'no crossover' : deg(s.phaseMargin)],
    ['Closed-loop −3 dB bandwidth', s.bandwidth === null ? 'beyond the analysed span' : q(s.bandwidth, 'Hz')],
    ['Peaking of the signal response', db(s.peaking)]
  ]
  if (r.topology === 'transimpedance') {
    rows.push(['Smallest Cf for 60° phase margin',
      s.suggestedCf === null ? 'none up to 1 µF' : s.suggestedCf === 0 ? 'none needed (60° without Cf)' : q(s.suggestedCf, 'F')])
  }
  return table(['Quantity', 'Value'], rows, ['left', 'right'])
}

/** Low-pass figures from the solved response (DESIGN §8.4). */
export function filterTable(r: StageResult): Table | null {
  const f = r.filter
  if (f === null) return null
  return table(['Quantity', 'Value'], [
    ['f0 (phase of H/H(0) at −90°)', f.f0 === null ? 'not reached in the analysed span' : q(f.f0, 'Hz')],
    ['Q = |H(f0)/H(0)|', f.q === null ? '—' : f.q.toFixed(3)],
    ['Passband gain H(0)', q(f.passbandGain, 'V/V', 4)]
  ], ['left', 'right'])
}
