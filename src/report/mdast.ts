/**
 * Small builders for the mdast nodes the report generates. Generated nodes carry no
 * position (STYLE §5): nothing downstream may assume `node.position`.
 */
import type {
  AlignType, BlockContent, Heading, List, ListItem, Paragraph, PhrasingContent, Table, TableCell, TableRow, Text
} from 'mdast'
import type {CalloutNode, CaptionNode} from './types.js'

export const text = (value: string): Text => ({type: 'text', value})

/** A phrasing argument: a plain string becomes a text node. */
export type Phrase = string | PhrasingContent

const phrasing = (parts: Phrase[]): PhrasingContent[] => parts.map((p) => (typeof p === 'string' ? text(p) : p))

export const paragraph = (...parts: Phrase[]): Paragraph => ({type: 'paragraph', children: phrasing(parts)})

export const strong = (value: string): PhrasingContent => ({type: 'strong', children: [text(value)]})

export const emphasis = (value: string): PhrasingContent => ({type: 'emphasis', children: [text(value)]})

export const code = (value: string): PhrasingContent => ({type: 'inlineCode', value})

export const heading = (depth: 1 | 2 | 3 | 4, ...parts: Phrase[]): Heading => ({type: 'heading', depth, children: phrasing(parts)})

export const caption = (value: string): CaptionNode => ({type: 'caption', text: value})

/** A bullet list of paragraphs. */
export const bulletList = (items: Phrase[][]): List => ({
  type: 'list',
  ordered: false,
  spread: false,
  children: items.map((parts): ListItem => ({type: 'listItem', spread: false, children: [paragraph(...parts)]}))
})

const cell = (content: Phrase | Phrase[]): TableCell => ({
  type: 'tableCell',
  children: phrasing(Array.isArray(content) ? content : [content])
})

/**
 * A GFM table. `align` gives one entry per column ('left' default); numbers read best
 * right-aligned.
 */
export const table = (header: Phrase[], rows: (Phrase | Phrase[])[][], align?: AlignType[]): Table => ({
  type: 'table',
  align: align ?? header.map(() => 'left'),
  children: [header, ...rows].map((r): TableRow => ({type: 'tableRow', children: r.map(cell)}))
})

export const callout = (severity: CalloutNode['severity'], label: string, children: BlockContent[]): CalloutNode => ({
  type: 'callout',
  severity,
  label,
  children
})
