/**
 * The text of any node, for nodes printed as plain text (unknown types, table cells,
 * outline titles, alt text). Mirrors mdast-util-to-string without the dependency.
 */

interface AnyNode {
  type: string
  value?: unknown
  alt?: unknown
  children?: unknown
}

export function textContent(node: {type: string}): string {
  const n = node as AnyNode
  if (typeof n.value === 'string') return n.value
  if (Array.isArray(n.children)) return (n.children as AnyNode[]).map(textContent).join('')
  if (typeof n.alt === 'string') return n.alt
  return ''
}
