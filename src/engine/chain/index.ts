/**
 * Measurement chains (DESIGN §8.5, §8.6): re-exports only.
 */
export * from './types.js'
export * from './archetypes.js'
export {evaluateChain, effectiveBitsOf, noiseFreeBitsOf} from './cascade.js'
export {chainDc, converterTerms, laterGains, temperatureSpanOf} from './dc.js'
export {cascadeDensityInto, cascadeNoise, cascadeRms, type CascadedNoise} from './noise.js'
export {aliasRejection, chainBandwidth, chainMagnitude} from './response.js'
export {checkChainRequirements, converterRangeLimit} from './requirements.js'
export {instrumentationSpectrum, stageSpectrum} from './spectrum.js'
