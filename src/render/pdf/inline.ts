/**
 * Phrasing content (text, emphasis, strong, delete, inline code, links, breaks, footnote
 * references) becomes styled runs, drawn as one wrapped paragraph with pdfkit's continued
 * text. Images inside a paragraph are split off by `blocks.ts`; here they only show their
 * alt text. HTML is printed as written, never interpreted.
 */
import type {PhrasingContent} from 'mdast'
import {applyStyle, layoutText, type RenderContext} from './context.js'
import type {FontKey} from './fonts.js'
import type {TextOptions} from './pdfkit.js'
import {webLink} from '../links.js'
import {textContent} from './text-content.js'

export interface Run {
  text: string
  font: FontKey
  size: number
  color: string
  link: string | null
  underline: boolean
  strike: boolean
}

interface InlineState {
  bold: boolean
  italic: boolean
  strike: boolean
  link: string | null
}

const SUPERSCRIPT_DIGITS = ['⁰', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹']

/** A footnote number as superscript digits (DejaVu has them, so no baseline shift is needed). */
export function superscript(n: number): string {
  return String(n).split('').map((d) => SUPERSCRIPT_DIGITS[Number(d)] ?? d).join('')
}

function pickFont(bold: boolean, italic: boolean, mono: boolean): FontKey {
  if (mono) return bold ? 'monoBold' : 'mono'
  if (bold && italic) return 'boldItalic'
  if (bold) return 'bold'
  if (italic) return 'italic'
  return 'regular'
}

/** Footnote number for an identifier, assigned at first reference. */
export function footnoteNumber(ctx: RenderContext, identifier: string): number {
  const known = ctx.footnotes.numbers.get(identifier)
  if (known !== undefined) return known
  const n = ctx.footnotes.numbers.size + 1
  ctx.footnotes.numbers.set(identifier, n)
  if (!ctx.footnotes.definitions.has(identifier)) ctx.warnings.add(`Footnote [^${identifier}] has no definition`)
  return n
}

export interface RunBase {
  size: number
  color: string
  bold?: boolean
}

/** Turns phrasing nodes into runs at the given base size and colour. */
export function runsOf(ctx: RenderContext, nodes: PhrasingContent[], base: RunBase): Run[] {
  const runs: Run[] = []
  const push = (text: string, state: InlineState, mono = false): void => {
    if (text === '') return
    const link = state.link
    runs.push({
      text,
      font: pickFont(state.bold, state.italic, mono),
      size: base.size,
      color: link === null ? base.color : ctx.theme.colours.link,
      link,
      underline: link !== null,
      strike: state.strike,
    })
  }
  const walk = (list: PhrasingContent[], state: InlineState): void => {
    for (const node of list) {
      switch (node.type) {
        case 'text': push(node.value.replace(/\s*\n\s*/g, ' '), state); break
        case 'emphasis': walk(node.children, {...state, italic: true}); break
        case 'strong': walk(node.children, {...state, bold: true}); break
        case 'delete': walk(node.children, {...state, strike: true}); break
        case 'inlineCode': push(node.value, state, true); break
        case 'break': push('\n', state); break
        case 'link': walk(node.children, {...state, link: webLink(node.url)}); break
        case 'linkReference': {
          const def = ctx.definitions.get(node.identifier.toLowerCase())
          walk(node.children, def === undefined ? state : {...state, link: webLink(def.url)})
          break
        }
        case 'image':
        case 'imageReference': push(`[${node.alt ?? 'image'}]`, state); break
        case 'footnoteReference': push(superscript(footnoteNumber(ctx, node.identifier)), state); break
        case 'html': push(node.value, state); break
        default: {
          const unknown = node as {type: string}
          ctx.warnings.add(`Unknown inline node \`${unknown.type}\`: printed as text`)
          push(textContent(unknown), state)
        }
      }
    }
  }
  walk(nodes, {bold: base.bold ?? false, italic: false, strike: false, link: null})
  return merge(runs)
}

function sameStyle(a: Run, b: Run): boolean {
  return a.font === b.font && a.size === b.size && a.color === b.color && a.link === b.link &&
    a.underline === b.underline && a.strike === b.strike
}

function merge(runs: Run[]): Run[] {
  const out: Run[] = []
  for (const run of runs) {
    const last = out[out.length - 1]
    if (last !== undefined && sameStyle(last, run)) last.text += run.text
    else out.push({...run})
  }
  return out
}

/** Plain text of the runs, for measuring. */
export function runsText(runs: Run[]): string {
  return runs.map((r) => r.text).join('')
}

/**
 * Draws runs as one paragraph at (x, y), `width` wide; pdfkit wraps across style changes
 * and continues on a new page when needed. Leaves `doc.y` below the paragraph.
 */
export function drawRuns(ctx: RenderContext, runs: Run[], x: number, y: number, width: number, align: TextOptions['align'] = 'left'): void {
  const {doc} = ctx
  runs.forEach((run, i) => {
    applyStyle(ctx, run)
    const options: TextOptions = {
      width,
      align,
      lineGap: ctx.theme.lineGap,
      continued: i < runs.length - 1,
      link: run.link,
      underline: run.underline,
      strike: run.strike,
    }
    const text = layoutText(ctx, run.text, run.font, run.size, width)
    if (i === 0) doc.text(text, x, y, options)
    else doc.text(text, options)
  })
}
