/**
 * The output operating point against the supply less swing headroom (DESIGN §4.1):
 * Vout = Vcm,in·NG + G·input for inverting and transimpedance stages (Vcm,in = vref),
 * G·input otherwise.
 */
import {topologyTerms} from './topology/index.js'
import type {StageInput, SwingCheck} from './types.js'

/** Output span over the input range and how far it leaves the allowed range (DESIGN §4.1). */
export function swingCheck(input: StageInput): SwingCheck {
  const t = topologyTerms(input)
  const offset = input.topology === 'inverting' || input.topology === 'transimpedance' ? input.vref * t.noiseGain : 0
  const ends = input.input.map((v) => offset + t.gain * v)
  const outputSpan: [number, number] = [Math.min(...ends), Math.max(...ends)]
  const h = input.opamp.swingHeadroom
  const allowed: [number, number] = [input.supply[0] + h, input.supply[1] - h]
  const excess: [number, number] = [Math.max(0, allowed[0] - outputSpan[0]), Math.max(0, outputSpan[1] - allowed[1])]
  return {outputSpan, allowed, excess, fits: excess[0] === 0 && excess[1] === 0}
}
