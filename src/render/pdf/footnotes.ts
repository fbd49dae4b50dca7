/**
 * Footnotes and link definitions. Before a tree is drawn its footnote definitions and link
 * reference definitions are collected; references get numbers in the order they are first
 * drawn (superscript, see `inline.ts`); after the body the definitions are printed under
 * "Notes" in that order, followed by any that were never referenced.
 */
import type {Definition, FootnoteDefinition, Heading, Root} from 'mdast'
import {drawText, indented, keepSpace, type RenderContext} from './context.js'
import {footnoteNumber} from './inline.js'

interface Walkable {
  type: string
  children?: Walkable[]
}

/** Collects footnote and link definitions from `tree` into the context. */
export function collectDefinitions(ctx: RenderContext, tree: Root): void {
  const walk = (node: Walkable): void => {
    if (node.type === 'footnoteDefinition') {
      const def = node as unknown as FootnoteDefinition
      if (!ctx.footnotes.definitions.has(def.identifier)) ctx.footnotes.definitions.set(def.identifier, def)
    } else if (node.type === 'definition') {
      const def = node as unknown as Definition
      const id = def.identifier.toLowerCase()
      if (!ctx.definitions.has(id)) ctx.definitions.set(id, def)
    }
    if (Array.isArray(node.children)) node.children.forEach(walk)
  }
  walk(tree as unknown as Walkable)
}

/** Prints every footnote definition under a "Notes" heading; nothing when there are none. */
export function drawFootnotes(ctx: RenderContext): void {
  const {definitions, numbers} = ctx.footnotes
  if (definitions.size === 0) return
  for (const id of definitions.keys()) footnoteNumber(ctx, id)
  const heading: Heading = {type: 'heading', depth: 2, children: [{type: 'text', value: 'Notes'}]}
  ctx.blocks.heading(ctx, heading, [])
  const {doc, theme} = ctx
  const style = {font: 'regular' as const, size: theme.fontSizes.body, color: theme.colours.text}
  const printed = new Set<string>()
  // Printing a note may number a reference inside it, so loop until every number is printed.
  for (let pass = true; pass;) {
    pass = false
    const order = [...numbers.entries()].sort((a, b) => a[1] - b[1])
    for (const [id, n] of order) {
      if (printed.has(id)) continue
      printed.add(id)
      pass = true
      const def = definitions.get(id)
      if (def === undefined) continue
      keepSpace(ctx, style.size * 1.4)
      const y = doc.y
      drawText(ctx, `${n}.`, style, ctx.frame.x, y, theme.spacing.listIndent + 2, {align: 'left'})
      doc.y = y
      indented(ctx, theme.spacing.listIndent + 6, () => ctx.blocks.render(ctx, def.children))
    }
  }
}
