/**
 * A chain's Monte Carlo yield (DESIGN §8.6, §8.7): the same yield table, error histogram and
 * variance-share chart as a stage's (`monteCarloBlocks` of ./yield.ts), the errors taken at
 * the converter's input, the variables named by stage (or converter) and variable.
 */
import type {BlockContent} from 'mdast'
import {lsbOf, type ChainRequirementKey} from '../../engine/chain/types.js'
import type {ChainEvaluation} from '../../evaluate/chains.js'
import {yieldVariableLabel} from '../../results/labels.js'
import {CHAIN_REQUIREMENT_LABELS, chainQuantity, chainUnit} from '../chain-verdicts.js'
import type {ReportContext} from '../context.js'
import {monteCarloBlocks} from './yield.js'

/** `s0/rf:tolerance` → "s0: rf tolerance"; `adc/offset` → "adc: offset". */
export const chainVariableLabel = (name: string): string => {
  const cut = name.indexOf('/')
  return cut < 0 ? yieldVariableLabel(name) : `${name.slice(0, cut)}: ${yieldVariableLabel(name.slice(cut + 1))}`
}

function assumptions(ev: ChainEvaluation): string {
  const y = ev.result.yield!
  const resistors = y.distribution === 'normal'
    ? 'resistor values and tempcos normal with σ = a third of their limit, truncated at the limit'
    : 'resistor values and tempcos uniform within their limits'
  const t = ev.input.temperature
  return 'Every stage’s variables and the converter’s are drawn independently of each other, each stage with the distributions of its own yield model: ' +
    resistors + '; op-amp offset, drift and offset current (an instrumentation amplifier’s input and output offsets, their drifts, gain error, gain drift and nonlinearity), and the converter’s offset, offset drift, gain error, gain drift and INL, normal with σ = a third ' +
    'of the datasheet maximum, truncated there (common practice: a datasheet maximum sits near 3σ); the bias current uniform from zero to its maximum, ' +
    'used at all three temperatures (conservative for FET inputs below the hot end); 1/CMRR, 1/PSRR and the supply uniform within their limits; the open-loop ' +
    'gain at its minimum. Each trial’s error at the converter is the largest signed sum, over both ends of the chain’s input range and ' +
    `${t[0] === t[1] && t[0] === 25 ? '25 °C' : 'the chain’s temperature ends and 25 °C'} (every stage at the same end and temperature, within its own range), ` +
    'of each stage’s signed error carried through the later stages’ gains and the converter’s terms' +
    `${ev.input.calibration === 'none' ? '' : ` (the residuals after the chain’s ${ev.input.calibration} calibration for the calibrated rows)`}, ` +
    'so the chain’s worst-case sum bounds every trial. A yield is an estimate from these assumed distributions, not a guarantee: ' +
    'the parts’ real spreads, their correlations and lot-to-lot shifts decide the production figure.'
}

export function chainYieldBlocks(ctx: ReportContext, ev: ChainEvaluation): BlockContent[] {
  const y = ev.result.yield
  if (y === null) return []
  const g = Math.abs(ev.result.gain)
  const lsb = ev.input.adc === null ? null : lsbOf(ev.input.adc)
  const unitIn = ev.topologies[0] === 'transimpedance' ? 'A' : 'V'
  return monteCarloBlocks(ctx, y, {
    name: `chain ${ev.input.id}`,
    results: y.results,
    label: (k) => CHAIN_REQUIREMENT_LABELS[k as ChainRequirementKey],
    limitText: (k, limit) => chainQuantity(limit, chainUnit(ev, k as ChainRequirementKey)),
    bound: (k, limit) => (k.startsWith('input') ? limit * g : k.startsWith('error-lsb') ? limit * (lsb ?? 0) : limit),
    minimum: ev.input.require.yield,
    method: 'every trial draws each stage’s and the converter’s values at random within their limits and cascades the signed DC terms of the chain’s ' +
      'budget from the drawn values (each stage’s own Monte Carlo model, carried through the later stages’ gains).',
    where: 'at the converter input',
    inputUnit: unitIn,
    variableLabel: chainVariableLabel,
    assumptions: assumptions(ev),
    noRequirement: 'The chain states no DC error requirement, so no yield is counted; the distribution of the error is shown.',
    limitsNote: 'input-referred limits times |ΠG|, LSB limits times the LSB'
  })
}
