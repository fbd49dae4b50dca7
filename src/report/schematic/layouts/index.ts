/**
 * The layout of each topology's schematic. A topology without an entry (one added to the
 * engine before its drawing) gets no schematic and the section says so; nothing fails.
 * To add one: write `layouts/<topology>.ts` with its placed parts and wires, naming parts by
 * their netlist labels, and list it here.
 */
import type {Topology} from '../../../engine/types.js'
import type {Layout} from '../types.js'
import {invertingLayout} from './inverting.js'
import {noninvertingLayout} from './noninverting.js'
import {transimpedanceLayout} from './transimpedance.js'

export const LAYOUTS: Partial<Record<Topology, Layout>> = {
  noninverting: noninvertingLayout,
  inverting: invertingLayout,
  follower: noninvertingLayout,
  transimpedance: transimpedanceLayout
}
