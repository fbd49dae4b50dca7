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

/** A variance share below this (0.05 %, printed 0.0 %) is not drawn in the ranked chart. */
const NEGLIGIBLE_SHARE = 5e-4

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

/** What the shared yield blocks need to know of the block they describe (a stage or a chain). */
export interface YieldSubject {
  /** `stage ID` or `chain ID`, as in the captions. */
  name: string
  /** The result's requirement rows. */
  results: readonly {key: string; limit: number; passed: number; yield: number; interval: [number, number]}[]
  /** The requirement's label and its limit as shown. */
  label: (key: string) => string
  limitText: (key: string, limit: number) => string
  /** The limit as an error at the point the errors are taken (V). */
  bound: (key: string, limit: number) => number
  /** The `yield` minimum, when the block requires one. */
  minimum: number | undefined
  /** The first paragraph's description of a trial, and where the error is taken ("at the output"). */
  method: string
  where: string
  /** The unit of the input (variance point). */
  inputUnit: string
  variableLabel: (name: string) => string
  assumptions: string
  /** Said when the block states no DC error requirement. */
  noRequirement: string
  /** How the histogram's limit lines were placed. */
  limitsNote: string
}

/** The yield table, histogram and variance chart of a Monte Carlo result (stage or chain). */
export function monteCarloBlocks(ctx: ReportContext, y: Omit<YieldResult, 'results'>, sub: YieldSubject): BlockContent[] {
  const out: BlockContent[] = [heading(3, 'Monte Carlo yield')]
  if (y.unavailable !== null) {
    out.push(paragraph(`No yield is given: ${y.unavailable}. The worst-case and RSS budgets above stand on their own (see the notes).`))
    return out
  }
  const calibratedBasis = y.basis !== 'output'
  out.push(paragraph(
    `${y.trials.toLocaleString('en-US')} trials, seed ${y.seed}; ${sub.method} ` +
    `Intervals are 95 % Wilson score intervals. The error ${calibratedBasis ? `${sub.where} after calibration` : sub.where} ` +
    `has median ${q(y.errorPercentiles!.p50, 'V')}, 99th percentile ${q(y.errorPercentiles!.p99, 'V')} and 99.9th percentile ` +
    `${q(y.errorPercentiles!.p999, 'V')}, against a worst-case sum of ${q(y.worstCase, 'V')}.`))
  if (sub.results.length > 0) {
    const minimum = sub.minimum
    out.push(caption(nextTable(ctx, `Monte Carlo yield of ${sub.name}`)), table(
      ['Requirement', 'Limit', 'Trials meeting it', 'Yield', '95 % interval', ...(minimum === undefined ? [] : ['Minimum'])],
      sub.results.map((r) => [
        [`${sub.label(r.key)} (`, code(r.key), ')'],
        sub.limitText(r.key, r.limit),
        r.passed.toLocaleString('en-US'),
        yieldPct(r.yield),
        `${yieldPct(r.interval[0])} … ${yieldPct(r.interval[1])}`,
        ...(minimum === undefined ? [] : [yieldPct(minimum)])
      ]),
      ['left', 'right', 'right', 'right', 'right', ...(minimum === undefined ? [] : ['right' as const])]))
  } else {
    out.push(paragraph(sub.noRequirement))
  }
  const limits = sub.results
    .filter((r) => calibratedBasis === r.key.endsWith('calibrated'))
    .map((r) => ({label: r.key, value: sub.bound(r.key, r.limit)}))
  const axis = `DC error ${sub.where}${calibratedBasis ? ' after calibration' : ''}`
  out.push(figure(ctx, yieldHistogramSpec({top: y.histogram.top, counts: y.histogram.counts, limits, worstCase: y.worstCase}, axis),
    `Distribution of the ${calibratedBasis ? 'calibrated ' : ''}DC error of ${sub.name} over ${y.trials.toLocaleString('en-US')} trials: ` +
    `limits as solid lines (${sub.limitsNote}), the worst-case sum dashed`))
  if (y.variance.length > 0 && y.varianceAt !== null) {
    const at = y.varianceAt
    const where = `input ${q(at.input, sub.inputUnit)}${at.inputCm === null ? '' : `, common mode ${q(at.inputCm, 'V')}`}, ${q(at.temperature, '°C')}`
    const top = y.variance[0]!
    out.push(paragraph(
      `What to tighten first: ${sub.variableLabel(top.variable)} carries ${(top.share * 100).toFixed(1)} % of the error’s variance. ` +
      `Shares are each variable’s total-effect index (Jansen’s estimator over ${y.varianceRows.toLocaleString('en-US')} trials) at the input end and temperature ` +
      `where the error varies most (${where}), normalised to sum to 100 %.`))
    // Variables whose share rounds to 0.0 % (a calibrated-out offset, a negligible bias current) are left out of
    // the chart, as absent contributors are elsewhere; the JSON keeps every one.
    const drawn = y.variance.filter((v) => v.share >= NEGLIGIBLE_SHARE)
    const left = y.variance.length - drawn.length
    out.push(figure(ctx, varianceSharesSpec(drawn.map((v) => ({label: sub.variableLabel(v.variable), share: v.share}))),
      `Share of the error variance of ${sub.name} by random variable, largest first` +
      (left === 0 ? '' : ` (${left} more ${left === 1 ? 'variable' : 'variables'} under 0.05 % each not drawn)`)))
  }
  out.push(paragraph(sub.assumptions))
  return out
}

export function yieldBlocks(ctx: ReportContext, ev: StageEvaluation): BlockContent[] {
  const y = ev.result.yield
  if (y === null) return []
  const g = Math.abs(ev.result.gain)
  const iu = inputUnit(ev.input.topology)
  return monteCarloBlocks(ctx, y, {
    name: `stage ${ev.input.id}`,
    results: y.results,
    label: (k) => KEY_LABELS[k as YieldKey],
    limitText: (k, limit) => q(limit, k.startsWith('input') ? iu : 'V'),
    bound: (k, limit) => (k.startsWith('input') ? limit * g : limit),
    minimum: ev.input.require.yield,
    method: 'every trial draws each part’s values at random within its limits ' +
      'and evaluates the DC budget’s signed terms from the drawn values (the resistors through the stage’s DC solution in closed form).',
    where: 'at the output',
    inputUnit: iu,
    variableLabel: yieldVariableLabel,
    assumptions: assumptions(ev, y),
    noRequirement: 'The stage states no DC error requirement, so no yield is counted; the distribution of the error is shown.',
    limitsNote: 'input-referred limits times |G|'
  })
}
