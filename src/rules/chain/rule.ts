/**
 * The shape of a chain rule (DESIGN §8.6): a pure function of one evaluated chain and its
 * stages' own inputs and results, returning plain findings that `./index.ts` stamps.
 */
import type {ChainInput, ChainResult} from '../../engine/chain/types.js'
import type {StageInput, StageResult} from '../../engine/types.js'
import type {RuleFinding} from '../rule.js'

export interface ChainRuleContext {
  input: ChainInput
  result: ChainResult
  /** The chain's stages as evaluated, in signal order. */
  stages: readonly {input: StageInput; result: StageResult}[]
}

export interface ChainRule<Id extends string = string> {
  id: Id
  check(ctx: ChainRuleContext): RuleFinding[]
}

/** Stage topologies that filter (DESIGN §8.4): their names start with `lowpass`. */
export const isFilterTopology = (topology: string): boolean => topology.startsWith('lowpass')
