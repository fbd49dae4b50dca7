/**
 * The quantity grammar (DESIGN §3.1) and number formatting: re-exports only.
 */
export * from './dimensions.js'
export * from './parse.js'
export * from './range.js'
export * from './resistor.js'
export * from './format.js'
export {unitsMessages} from './messages.js'
