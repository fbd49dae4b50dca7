/**
 * The op-amps a note's stages may name: opamp blocks defined above the stage (first
 * definition per id), then the built-in archetypes. A name defined only below the stage,
 * or not at all, is an error with a hint.
 */
import type {Point} from 'unist'
import {ARCHETYPES, ARCHETYPE_NAMES, isArchetypeName} from '../engine/archetypes.js'
import type {OpampParams} from '../engine/types.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {noteMessages} from './messages.js'
import type {OpampBlockNode} from './types.js'

export interface OpampRegistry {
  /** Record an opamp block as read (its first definition counts). */
  define(node: OpampBlockNode): void
  /** A resolver for the stage `where`: the op-amp parameters of a name, or null (with a message). */
  resolver(where: string, report: Reporter): (name: string, at: Point) => OpampParams | null
}

/** A registry that knows every opamp id of the note (`all`, at its first definition) from the start. */
export function opampRegistry(all: ReadonlyMap<string, Point>): OpampRegistry {
  const before = new Map<string, OpampBlockNode>()
  return {
    define(node) {
      if (!before.has(node.id)) before.set(node.id, node)
    },
    resolver: (where, report) => (name, at) => {
      const defined = before.get(name)
      if (defined !== undefined) {
        if (defined.opamp === null) report.info(noteMessages.opampHasErrors(where, name), at, 'opamp-has-errors')
        return defined.opamp
      }
      const later = all.get(name)
      if (later !== undefined) {
        report.error(noteMessages.opampDefinedLater(name, later.line), at, 'opamp-defined-later', {
          cause: {reason: noteMessages.firstId('opamp', name), place: later}
        })
        return null
      }
      if (isArchetypeName(name)) return {...ARCHETYPES[name]}
      const suggestion = didYouMean(name, [...all.keys(), ...ARCHETYPE_NAMES])
      report.error(noteMessages.unknownOpamp(name, where, suggestion, ARCHETYPE_NAMES), at, 'unknown-opamp', {
        actual: name, expected: suggestion === null ? [...all.keys(), ...ARCHETYPE_NAMES] : [suggestion]
      })
      return null
    }
  }
}
