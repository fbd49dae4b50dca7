/**
 * The stage's practice and safety notes as callouts, each with its rule id and severity
 * word, and the rule's table where it has one.
 */
import type {BlockContent} from 'mdast'
import type {RuleNote, Severity} from '../../rules/types.js'
import {callout, code, paragraph, table} from '../mdast.js'

const LABEL: Record<Severity, string> = {info: 'INFO', caution: 'CAUTION', warning: 'WARNING', safety: 'SAFETY'}

export function noteBlocks(notes: RuleNote[]): BlockContent[] {
  if (notes.length === 0) return [paragraph('No practice or safety notes were triggered by this stage.')]
  return notes.map((n) => {
    const children: BlockContent[] = [paragraph(n.text, ' ', code(n.rule))]
    if (n.table) children.push(table(n.table.header, n.table.rows, n.table.header.map((_, i) => (i === 0 ? 'left' : 'right'))))
    return callout(n.severity, LABEL[n.severity], children)
  })
}
