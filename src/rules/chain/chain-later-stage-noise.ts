/**
 * chain-later-stage-noise: a later stage's noise dominates the chain's output after gain.
 *
 * What it checks: each stage's part of the chain's output noise power over the band.
 *
 * When it fires: a stage after the first carries more than half of the chain's output
 * noise power (caution).
 *
 * What it recommends: more gain in the first stage — every stage's noise is divided by the
 * gain ahead of it when referred to the input, so gain early buries the later stages.
 */
import {formatQuantity} from '../../units/format.js'
import type {RuleFinding} from '../rule.js'
import type {ChainRule, ChainRuleContext} from './rule.js'

const SHARE = 0.5

function check({result}: ChainRuleContext): RuleFinding[] {
  const total = result.noise.outputRms ** 2
  if (!(total > 0) || result.stageNoise.length < 2) return []
  const out: RuleFinding[] = []
  for (const [k, s] of result.stageNoise.entries()) {
    const share = s.outputRms ** 2 / total
    if (k === 0 || share <= SHARE) continue
    out.push({
      severity: 'caution',
      text:
        `Stage ${s.stage} (position ${k + 1} of ${result.stageNoise.length}) carries ${(share * 100).toFixed(0)} % of the chain's output noise power ` +
        `(${formatQuantity(s.outputRms, 'V')} of ${formatQuantity(result.noise.outputRms, 'V')} rms over the band): the gain ahead of it ` +
        `(${result.stages[0]} first) is too small to bury it. Consider putting more gain in the first stage, or a quieter stage ${s.stage}.`
    })
  }
  return out
}

const rule: ChainRule<'chain-later-stage-noise'> = {id: 'chain-later-stage-noise', check}
export default rule
