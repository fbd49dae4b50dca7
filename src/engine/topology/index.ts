/**
 * The topology registry: one model per `Topology` (STYLE §1, "register variants in a typed
 * table"), and the stage-level entry points built on it.
 */
import {buildNetlist, type Netlist} from '../netlist.js'
import type {StageInput, Topology} from '../types.js'
import {difference} from './difference.js'
import {follower} from './follower.js'
import {lowpassMfb} from './lowpass-mfb.js'
import {lowpassSallenKey} from './lowpass-sallen-key.js'
import {instrumentation} from './instrumentation.js'
import {inverting} from './inverting.js'
import {nominalResistors, type TopologyModel, type TopologyTerms} from './model.js'
import {noninverting} from './noninverting.js'
import {transimpedance} from './transimpedance.js'

export {RESISTOR_KEYS, nominalResistors, parallel, loadElements} from './model.js'
export type {ResistorKey, ResistorValues, TopologyModel, TopologyTerms} from './model.js'
export {difference, follower, inverting, lowpassMfb, lowpassSallenKey, noninverting, transimpedance}
export {differencePlusPin} from './difference.js'

/** Every topology's model. */
export const TOPOLOGY_MODELS: Record<Topology, TopologyModel> = {
  noninverting, inverting, follower, transimpedance, difference, 'lowpass-sallen-key': lowpassSallenKey, 'lowpass-mfb': lowpassMfb, instrumentation
}

/** The model of a stage's topology. */
export const topologyModel = (input: StageInput): TopologyModel => TOPOLOGY_MODELS[input.topology]

/** DESIGN §4.1 terms (G, NG, Rg,eff, Rn, Rp) at the nominal resistor values. */
export const topologyTerms = (input: StageInput): TopologyTerms => topologyModel(input).terms(nominalResistors(input))

/** The stage's compiled small-signal netlist (DESIGN §4.3). */
export const stageNetlist = (input: StageInput): Netlist => buildNetlist(topologyModel(input).netlist(input))
