/**
 * A stage's Monte Carlo yield (DESIGN §8.7): the table of requirement yields with their 95 %
 * Wilson intervals, the error histogram with the limits and the worst-case bound marked, the
 * ranked variance shares, and what the distributions assume.
 */
import type {BlockContent} from 'mdast'
import type {StageEvaluation} from '../../evaluate/index.js'
import type {YieldKey, YieldResult} from '../../engine/types.js'
import {nextTable, type ReportContext} from '../context.js'
import {varianceSharesSpec, yieldHistogramSpec} from '../charts/index.js'
import {inputUnit, yieldVariableLabel} from '../../results/labels.js'
import {q} from '../format.js'
import {caption, code, heading, paragraph, table} from '../mdast.js'
import type {FigureNode} from '../types.js'
import type {TopLevelSpec} from 'vega-lite'

const KEY_LABELS: Record<YieldKey, string> = {
  'output-error': 'DC error at output',
  'input-error': 'DC error referred to input',
  'output-error-calibrated': 'DC error at output after calibration',
  'input-error-calibrated': 'DC error referred to input after calibration'
}

/** A yield as a percentage with enough digits to tell 99.9 % from 99.99 %. */
export const yieldPct = (y: number): string => `${(y * 100).toFixed(y > 0.999 && y < 1 ? 3 : 2)} %`

const figure = (ctx: ReportContext, chart: TopLevelSpec, text: string): FigureNode => ({type: 'figure', number: ++ctx.figure, caption: text, chart})

function assumptions(ev: StageEvaluation, y: YieldResult): string {
  const fet = ev.input.opamp.inputType === 'jfet' || ev.input.opamp.inputType === 'cmos'
  const resistors = y.distribution === 'normal'
    ? 'resistor values and tempcos normal with σ = a third of their limit, truncated at the limit'
    : 'resistor values and tempcos uniform within their limits'
  return 'Distributions: ' + resistors + '; the op-amp’s offset, drift and offset current normal with σ = a third of the datasheet maximum, ' +
    'truncated there (common practice: a datasheet maximum sits near 3σ); the bias current uniform from zero to its maximum over the range ' +
    `(${ev.input.opamp.inputType === 'bipolar' ? 'one polarity, as for a bipolar input' : 'either polarity'}), used at all three temperatures` +
    `${fet ? ' — conservative for this FET input below the hot end, where its leakage is far smaller' : ''}; 1/CMRR, 1/PSRR and the supply uniform within their limits; ` +
    'the open-loop gain at its minimum. Each trial’s error is the largest signed error sum over both ends of the input range and ' +
    `${ev.input.temperature[0] === ev.input.temperature[1] && ev.input.temperature[0] === 25 ? '25 °C' : 'the range’s ends and 25 °C'}, with the budget’s own terms` +
    `${ev.input.calibration === 'none' ? '' : ` (the residuals after the ${ev.input.calibration} calibration for the calibrated rows)`}, ` +
    'so the worst-case sum bounds every trial. A yield is an estimate from these assumed distributions, not a guarantee: ' +
    'the parts’ real spreads, their correlations and lot-to-lot shifts decide the production figure.'
}

export function yieldBlocks(ctx: ReportContext, ev: StageEvaluation): BlockContent[] {
  const y = ev.result.yield
  if (y === null) return []
  const out: BlockContent[] = [heading(3, 'Monte Carlo yield')]
  if (y.unavailable !== null) {
    out.push(paragraph(`No yield is given: ${y.unavailable}. The worst-case and RSS budgets above stand on their own (see the notes).`))
    return out
  }
  const g = Math.abs(ev.result.gain)
  const iu = inputUnit(ev.input.topology)
  out.push(paragraph(
    `${y.trials.toLocaleString('en-US')} trials, seed ${y.seed}; every trial draws each part’s values at random within its limits ` +
    'and evaluates the DC budget’s signed terms from the drawn values (the resistors through the stage’s DC solution in closed form). ' +
    `Intervals are 95 % Wilson score intervals. The error ${y.basis === 'output' ? 'at the output' : 'at the output after calibration'} ` +
    `has median ${q(y.errorPercentiles!.p50, 'V')}, 99th percentile ${q(y.errorPercentiles!.p99, 'V')} and 99.9th percentile ` +
    `${q(y.errorPercentiles!.p999, 'V')}, against a worst-case sum of ${q(y.worstCase, 'V')}.`))
  if (y.results.length > 0) {
    const minimum = ev.input.require.yield
    out.push(caption(nextTable(ctx, `Monte Carlo yield of stage ${ev.input.id}`)), table(
      ['Requirement', 'Limit', 'Trials meeting it', 'Yield', '95 % interval', ...(minimum === undefined ? [] : ['Minimum'])],
      y.results.map((r) => [
        [`${KEY_LABELS[r.key]} (`, code(r.key), ')'],
        q(r.limit, r.key.startsWith('input') ? iu : 'V'),
        r.passed.toLocaleString('en-US'),
        yieldPct(r.yield),
        `${yieldPct(r.interval[0])} … ${yieldPct(r.interval[1])}`,
        ...(minimum === undefined ? [] : [yieldPct(minimum)])
      ]),
      ['left', 'right', 'right', 'right', 'right', ...(minimum === undefined ? [] : ['right' as const])]))
  } else {
    out.push(paragraph('The stage states no DC error requirement, so no yield is counted; the distribution of the error is shown.'))
  }
  const limits = y.results
    .filter((r) => (y.basis === 'output') === !r.key.endsWith('calibrated'))
    .map((r) => ({label: r.key, value: r.key.startsWith('input') ? r.limit * g : r.limit}))
  out.push(figure(ctx, yieldHistogramSpec({top: y.histogram.top, counts: y.histogram.counts, limits, worstCase: y.worstCase},
    y.basis === 'output' ? 'DC error at the output' : 'DC error at the output after calibration'),
  `Distribution of the ${y.basis === 'output' ? '' : 'calibrated '}DC error of stage ${ev.input.id} over ${y.trials.toLocaleString('en-US')} trials: ` +
    'limits as solid lines (input-referred limits times |G|), the worst-case sum dashed'))
  if (y.variance.length > 0 && y.varianceAt !== null) {
    const at = y.varianceAt
    const where = `input ${q(at.input, iu)}${at.inputCm === null ? '' : `, common mode ${q(at.inputCm, 'V')}`}, ${q(at.temperature, '°C')}`
    const top = y.variance[0]!
    out.push(paragraph(
      `What to tighten first: ${yieldVariableLabel(top.variable)} carries ${(top.share * 100).toFixed(1)} % of the error’s variance. ` +
      `Shares are each variable’s total-effect index (Jansen’s estimator over ${y.varianceRows.toLocaleString('en-US')} trials) at the input end and temperature ` +
      `where the error varies most (${where}), normalised to sum to 100 %.`),
    figure(ctx, varianceSharesSpec(y.variance.map((v) => ({label: yieldVariableLabel(v.variable), share: v.share}))),
      `Share of the error variance of stage ${ev.input.id} by random variable, largest first`))
  }
  out.push(paragraph(assumptions(ev, y)))
  return out
}
