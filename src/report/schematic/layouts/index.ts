/**
 * The layout of each topology's schematic. The record is total: a topology added to the
 * engine without a drawing fails the type-check here. To add one: write
 * `layouts/<topology>.ts` with its placed parts and wires, naming parts by their netlist
 * labels, and list it here.
 */
import type {Topology} from '../../../engine/types.js'
import type {Layout} from '../types.js'
import {differenceLayout} from './difference.js'
import {instrumentationLayout} from './instrumentation.js'
import {invertingLayout} from './inverting.js'
import {lowpassMfbLayout} from './lowpass-mfb.js'
import {lowpassSallenKeyLayout} from './lowpass-sallen-key.js'
import {noninvertingLayout} from './noninverting.js'
import {transimpedanceLayout} from './transimpedance.js'

export const LAYOUTS: Record<Topology, Layout> = {
  noninverting: noninvertingLayout,
  inverting: invertingLayout,
  follower: noninvertingLayout,
  transimpedance: transimpedanceLayout,
  difference: differenceLayout,
  'lowpass-sallen-key': lowpassSallenKeyLayout,
  'lowpass-mfb': lowpassMfbLayout,
  instrumentation: instrumentationLayout
}
