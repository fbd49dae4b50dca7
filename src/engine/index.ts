/**
 * The engine's public API (`ampreview/engine`): re-exports only.
 */
export * from './types.js'
export * from './archetypes.js'
export * from './constants.js'
export * from './complex.js'
export {evaluateStage, assertEvaluable, type EvaluateContext} from './evaluate.js'
export {dcAnalysis, dcBudget, type DcAnalysis} from './dc/budget.js'
export {biasCurrentAt, biasOverTemperature, darkCurrentAt, darkCurrentMax, doublingInterval} from './dc/bias.js'
export {idealOutput, solveDc, solveStageDc, stageDcCircuit, type DcExcitation, type DcResistors, type DcSolution} from './dc/solve.js'
export {checkLimits, operatingPoints, railsAtLowTolerance, swingOf} from './limits.js'
export {maxOverCorners, type Spreads} from './dc/corners.js'
export {noiseAnalysis, noiseBudget, type NoiseAnalysis, type NoiseCurves} from './noise/budget.js'
export {currentNoiseScale, noiseKelvin, noiseSources, thermalCurrentPsd, type NoiseSource} from './noise/sources.js'
export {compileSources, noiseTransfers, outputPsdInto, type CompiledSources} from './noise/transfer.js'
export {integrateBand, type BandIntegral, type DensityFunction, type IntegrateOptions} from './noise/integrate.js'
export {stabilityAnalysis, type LoopCurves, type StabilityAnalysis} from './stability.js'
export {findCrossover, phaseMarginOf, refineCrossover, spanStart, type Crossover} from './crossover.js'
export {suggestCf} from './suggested-cf.js'
export {closedLoopGain, loopGain} from './response.js'
export {swingCheck} from './swing.js'
export {checkRequirements} from './requirements.js'
export {opampPoles, openLoopGainInto, type OpampPoles} from './opamp-model.js'
export {buildNetlist, NODE_NAMES, type ElementLabel, type NetElement, type Netlist, type NetlistSpec, type NodeName, type SpecElement} from './netlist.js'
export {createWorkspace, setCapacitance, solveClosed, solveLoop, type NodalWorkspace} from './nodal.js'
export {solveInPlace, transposeInPlace} from './complex-solve.js'
export {illinois, goldenMax} from './roots.js'
export {
  TOPOLOGY_MODELS,
  RESISTOR_KEYS,
  nominalResistors,
  parallel,
  stageNetlist,
  topologyModel,
  topologyTerms,
  follower,
  inverting,
  noninverting,
  transimpedance,
  difference,
  lowpassSallenKey,
  lowpassMfb,
  differencePlusPin,
  loadElements,
  type ResistorKey,
  type ResistorValues,
  type TopologyModel,
  type TopologyTerms
} from './topology/index.js'
export {capacitiveLoadAdvice, marginOverRiso, RISO_RANGE, type CapacitiveLoadAdvice} from './suggested-riso.js'
export {filterFigures, FILTER_TOPOLOGIES, isFilterTopology} from './filter.js'
export {setResistance} from './nodal.js'
export {INA_ARCHETYPES, INA_ARCHETYPE_NAMES, INA_ARCHETYPE_DISCLAIMER, inaAsOpamp, isInaArchetypeName} from './ina-archetypes.js'
export {evaluateInstrumentation, inaGain, INA_DC_KEYS, INA_NOISE_KEYS} from './instrumentation.js'
export * from './chain/index.js'
export {
  runYield, yieldOptionsOf, withoutMonteCarlo, trialBlock, yieldModel, closedFormOf, wilsonInterval, inverseNormal, truncatedNormal, uniformAt,
  runChainYield, chainYieldModel, chainTrialBlock, chainTrialErrors, drawChainTrial, STAGE_STRIDE, CONVERTER_KEYS,
  runTrialJob, type TrialJob, type TrialSpread,
  type YieldModel, type ClosedForm, type ChainYieldModel, type ChainYieldStage
} from './yield/index.js'
