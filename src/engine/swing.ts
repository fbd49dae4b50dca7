/**
 * The output operating point against the swing window (DESIGN §4.1, §4.6): Vout,ideal at both
 * ends of the input range from the DC solve (the NG·vref term included), against the rails
 * at the low end of `supply-tolerance` less the swing headroom of each rail that has one.
 */
import {checkLimits, swingOf} from './limits.js'
import type {StageInput, SwingCheck} from './types.js'

/** Output span over the input range and how far it leaves the allowed range. */
export const swingCheck = (input: StageInput): SwingCheck => swingOf(input, checkLimits(input))
