/**
 * The stage's practice and safety notes as callouts, each with its rule id and severity
 * word, and the rule's table where it has one. A note that several stages share word for
 * word (the hazard-context cautions of the front matter) is printed once, at the top of the
 * body, and each stage points to it.
 */
import type {BlockContent} from 'mdast'
import type {RuleNote, Severity} from '../../rules/types.js'
import type {NoteRuleId} from '../../rules/index.js'
import {callout, code, paragraph, strong, table} from '../mdast.js'
import {RULE_TITLES} from '../rule-titles.js'
import type {CalloutNode, CoverNote} from '../types.js'

const LABEL: Record<Severity, string> = {info: 'INFO', caution: 'CAUTION', warning: 'WARNING', safety: 'SAFETY'}

const noteKey = (n: RuleNote): string => `${n.rule}\u0000${n.text}`

/** Anchor of a note's callout, for the cover's list. */
export const noteAnchor = (stage: string | null, rule: NoteRuleId, index: number): string => `note:${stage ?? '*'}:${rule}:${index}`

/** Notes the cover lists: cautions, warnings and safety notes (info notes are not open items). */
export const isOpen = (n: RuleNote): n is RuleNote & {severity: Exclude<Severity, 'info'>} => n.severity !== 'info'

/** The cover entry of a note drawn with `anchor`. */
export const coverNote = (stage: string | null, n: RuleNote & {severity: Exclude<Severity, 'info'>}, anchor: string): CoverNote =>
  ({stage, rule: n.rule, severity: n.severity, title: RULE_TITLES[n.rule], accepted: n.accepted ?? null, anchor})

const noteCallout = (n: RuleNote, anchor: string): CalloutNode => {
  const children: BlockContent[] = [paragraph(n.text, ' ', code(n.rule))]
  if (n.table) children.push(table(n.table.header, n.table.rows, n.table.header.map((_, i) => (i === 0 ? 'left' : 'right'))))
  if (n.accepted !== undefined) {
    children.push(paragraph(strong('Accepted by the author: '), n.accepted))
    return {...callout(n.severity, `${LABEL[n.severity]} — ACCEPTED`, children), anchor}
  }
  return {...callout(n.severity, LABEL[n.severity], children), anchor}
}

/** Notes that two or more stages share word for word, in first-seen order. */
export function sharedNotes(perStage: readonly RuleNote[][]): RuleNote[] {
  const count = new Map<string, {note: RuleNote; stages: number}>()
  for (const notes of perStage) {
    for (const key of new Set(notes.map(noteKey))) {
      const seen = count.get(key)
      if (seen) seen.stages++
      else count.set(key, {note: notes.find((n) => noteKey(n) === key)!, stages: 1})
    }
  }
  return [...count.values()].filter((c) => c.stages > 1).map((c) => c.note)
}

/** The document-level section holding the shared notes (empty when there are none). */
export function sharedNoteBlocks(shared: readonly RuleNote[], cover: CoverNote[] = []): BlockContent[] {
  if (shared.length === 0) return []
  return [
    {type: 'heading', depth: 1, children: [{type: 'text', value: 'Notes that apply to every stage'}]},
    paragraph('These notes were triggered by the document (its hazard context) or by every stage alike; each stage section refers to them.'),
    ...shared.map((n, i) => {
      const anchor = noteAnchor(null, n.rule, i)
      if (isOpen(n)) cover.push(coverNote(null, n, anchor))
      return noteCallout(n, anchor)
    })
  ]
}

/** A stage's notes; those in `shared` become one line pointing to the document-level section. */
export function noteBlocks(notes: RuleNote[], shared: readonly RuleNote[] = [], stage: string | null = null, cover: CoverNote[] = []): BlockContent[] {
  if (notes.length === 0) return [paragraph('No practice or safety notes were triggered by this stage.')]
  const sharedKeys = new Set(shared.map(noteKey))
  const own = notes.filter((n) => !sharedKeys.has(noteKey(n)))
  const pointed = notes.filter((n) => sharedKeys.has(noteKey(n)))
  const out: BlockContent[] = own.map((n, i) => {
    const anchor = noteAnchor(stage, n.rule, i)
    if (isOpen(n)) cover.push(coverNote(stage, n, anchor))
    return noteCallout(n, anchor)
  })
  if (pointed.length > 0) {
    const items = pointed.flatMap((n, i) => [...(i > 0 ? [', '] : []), `${LABEL[n.severity]} `, code(n.rule)])
    out.push(paragraph('Also applies to this stage: ', ...items, ' — see “Notes that apply to every stage”.'))
  }
  return out
}
