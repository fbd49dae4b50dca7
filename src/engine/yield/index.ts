/**
 * Monte Carlo yield over the DC budget (DESIGN §8.7): `runYield` for a stage; the pieces
 * (generator, truncated normal, closed forms, model, statistics) for tests and the bench.
 */
export {runYield, yieldOptionsOf, withoutMonteCarlo, trialBlock, trialErrors, drawTrial, VARIANCE_ROWS, HISTOGRAM_BINS} from './run.js'
export {yieldModel, SLOT, SLOT_COUNT, DrawKind, type YieldModel, type YieldVariable, type YieldPoint} from './model.js'
export {closedFormOf, R_INDEX, type ClosedForm} from './closed-form.js'
export {mix32, seedKey, trialKey, uniformOf, uniformAt} from './counter-rng.js'
export {inverseNormal, truncatedNormal, PHI_MINUS_3} from './normal.js'
export {wilsonInterval, percentileSorted, histogram, jansenTotalEffects, Z95} from './stats.js'
export {runChainYield, chainYieldModel, chainTrialBlock, chainTrialErrors, drawChainTrial, STAGE_STRIDE, CONVERTER_KEYS, type ChainYieldModel, type ChainYieldStage} from './chain.js'
export {runTrialJob, type TrialJob, type TrialSpread} from './spread.js'
