/**
 * Chart spec builders of the report: each turns engine results into a vega-lite spec;
 * `src/report/vega.ts` renders a spec to SVG. This file only re-exports.
 */
export {dcBarsSpec, type DcBarsOptions} from './dc-bars.js'
export {noiseDensitySpec, TOTAL_LABEL, type NoiseDensityChart, type NoiseDensityOptions} from './noise-density.js'
export {cumulativeRmsSpec} from './cumulative-rms.js'
export {loopGainSpec, NO_CROSSOVER_TEXT} from './loop-gain.js'
export {CHART_FONT_FAMILY, faceOfWeight, hasGlyphs, measureText, type ChartFace, type ChartFonts} from './fonts.js'
export {CHART_CONFIG, CHART_WIDTH, NOISE_STYLES, TOTAL_STYLE, type LineStyle} from './theme.js'
export {responseSpec} from './response.js'
export {chainNoiseDensitySpec, stagesUnderTotal, stageStyle} from './chain-noise-density.js'
export {chainDiagramSpec, type ChainDiagramInput, type DiagramBox} from './chain-diagram.js'
export {yieldHistogramSpec, type YieldHistogramInput} from './yield-histogram.js'
export {varianceSharesSpec} from './variance-shares.js'
