/**
 * The nodes `src/note` makes of ` ```adc ID ` and ` ```chain ID ` blocks (DESIGN §8.5, §8.6):
 * entries as written, the SI values (null after an error) and the defaults applied.
 */
import type {Position} from 'unist'
import type {AdcParams, ChainInput} from '../engine/chain/types.js'
import type {BlockEntry, DefaultedValue} from './types.js'

export interface AdcBlockNode {
  type: 'adcBlock'
  id: string
  entries: BlockEntry[]
  /** Null when the block had errors. */
  adc: AdcParams | null
  defaulted: DefaultedValue[]
  position?: Position
}

export interface ChainBlockNode {
  type: 'chainBlock'
  id: string
  entries: BlockEntry[]
  /** Null when the block (or a stage or converter it names) had errors. */
  input: ChainInput | null
  defaulted: DefaultedValue[]
  position?: Position
}

declare module 'mdast' {
  interface RootContentMap {
    adcBlock: AdcBlockNode
    chainBlock: ChainBlockNode
  }
  interface BlockContentMap {
    adcBlock: AdcBlockNode
    chainBlock: ChainBlockNode
  }
}
