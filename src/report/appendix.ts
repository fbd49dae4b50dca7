/**
 * The appendix: the method (a template fragment), the assumptions and defaults of every
 * stage, and the inputs that identify this report (note SHA-256, tool version, archetypes).
 */
import type {Root, RootContent} from 'mdast'
import {ARCHETYPE_DISCLAIMER} from '../engine/archetypes.js'
import type {StageEvaluation} from '../evaluate/index.js'
import {bulletList, code, heading, paragraph, table} from './mdast.js'

export interface AppendixInput {
  evaluations: StageEvaluation[]
  /** The method fragment (templates/…/method.md), parsed. */
  method: Root
  sourceSha256: string
  toolVersion: string
  /** The note's file name as given. */
  fileName: string
}

export function buildAppendix(a: AppendixInput): Root {
  const children: RootContent[] = [heading(1, 'Appendix A — Method'), ...a.method.children]
  children.push(heading(1, 'Appendix B — Assumptions and defaults'))
  if (a.evaluations.length === 0) children.push(paragraph('The note has no stage blocks.'))
  for (const ev of a.evaluations) {
    children.push(heading(2, `Stage ${ev.input.id}`))
    const items = ev.block.defaulted.map((d) => [code(d.key), ` = ${d.value} (not given in the note)`])
    if (ev.input.opamp.archetype) items.push([`Op-amp ${ev.input.opamp.name} is an archetype: ${ARCHETYPE_DISCLAIMER}`])
    if (ev.result.bias.overTemperatureMissing) {
      items.push(['No over-temperature bias current was entered (ib-max): the 25 °C value was used across the range.'])
    }
    children.push(items.length > 0 ? bulletList(items) : paragraph('Every value was given in the note; no default applied.'))
  }
  const archetypes = [...new Set(a.evaluations.filter((e) => e.input.opamp.archetype).map((e) => e.input.opamp.name))]
  children.push(heading(1, 'Appendix C — Inputs'), table(['Item', 'Value'], [
    ['Note', [code(a.fileName)]],
    ['SHA-256 of the note', [code(a.sourceSha256)]],
    ['Tool', [code(`ampreview ${a.toolVersion}`)]],
    ['Stages evaluated', String(a.evaluations.length)],
    ['Archetypes used', archetypes.length > 0 ? archetypes.join(', ') : 'none']
  ]))
  return {type: 'root', children}
}
