/**
 * The report as GFM Markdown, for code review: the note's prose with every stage block
 * replaced by its tables, verdicts and notes; charts become references to SVG files that
 * the caller writes beside the Markdown. Deterministic, byte for byte.
 */
import type {BlockContent, Root, RootContent} from 'mdast'
import {gfmToMarkdown} from 'mdast-util-gfm'
import {toMarkdown} from 'mdast-util-to-markdown'
import {verdictText} from '../../report/format.js'
import {heading, paragraph, strong, table, text} from '../../report/mdast.js'
import {overallSentence, SEVERITY_WORDS} from '../../report/cover-text.js'
import {webLink} from '../links.js'
import {noteImageCaption, noteImageFigure, type FigureNode, type ReportDocument} from '../../report/types.js'
import type {CompiledFigures} from '../chart/compile.js'
import {drawingToSvg} from './schematic-svg.js'

export interface MarkdownReport {
  markdown: string
  /** SVG files the Markdown references, by file name. */
  figures: {name: string; svg: string}[]
}

interface Figures {
  compiled: ReadonlyMap<FigureNode, {svg: string}>
  name: (n: number) => string
  out: MarkdownReport['figures']
}

/** Our own node types mapped onto plain mdast. */
/** Nodes whose children are phrasing content. */
const PHRASING_PARENTS = new Set(['paragraph', 'heading', 'emphasis', 'strong', 'delete', 'link', 'linkReference', 'tableCell'])

function plain(nodes: RootContent[], figures: Figures, phrasing = false): RootContent[] {
  const out: RootContent[] = []
  for (const node of nodes) {
    switch (node.type) {
      case 'figure': {
        const name = figures.name(node.number)
        const compiled = figures.compiled.get(node)
        if (compiled === undefined) throw new Error(`Figure ${node.number} was not compiled before writing the Markdown`)
        figures.out.push({name, svg: compiled.svg})
        out.push({type: 'paragraph', children: [{type: 'image', url: name, alt: `Figure ${node.number}`}]},
          paragraph({type: 'emphasis', children: [text(`Figure ${node.number} — ${node.caption}`)]}))
        break
      }
      case 'schematic': {
        const name = figures.name(node.number)
        figures.out.push({name, svg: drawingToSvg(node.drawing)})
        out.push({type: 'paragraph', children: [{type: 'image', url: name, alt: `Figure ${node.number}`}]},
          paragraph({type: 'emphasis', children: [text(`Figure ${node.number} — ${node.caption}`)]}))
        break
      }
      case 'callout':
        out.push({type: 'blockquote', children: [paragraph(strong(`${node.label}.`)),
          ...(plain(node.children, figures) as BlockContent[])]})
        break
      case 'caption':
        out.push(paragraph({type: 'emphasis', children: [text(node.text)]}))
        break
      case 'pageBreak':
        break
      // Raw HTML of the note is text in the report, as in the PDF: never passed through.
      case 'html':
        out.push(phrasing ? text(node.value) : paragraph(node.value))
        break
      // A link to anything but the web or mail keeps its text only, as in the PDF.
      case 'link':
        if (webLink(node.url) === null) out.push(...plain(node.children, figures, true))
        else out.push({...node, children: plain(node.children, figures, true)} as RootContent)
        break
      case 'paragraph': {
        out.push({...node, children: plain(node.children, figures, true)} as RootContent)
        // A note's image the report numbered gets its caption below, as in the PDF.
        for (const c of node.children) {
          const n = c.type === 'image' || c.type === 'imageReference' ? noteImageFigure(c) : undefined
          if (n !== undefined) out.push(paragraph({type: 'emphasis', children: [text(noteImageCaption(n, c.type === 'image' || c.type === 'imageReference' ? c.alt : null))]}))
        }
        break
      }
      case 'stageBlock':
      case 'opampBlock':
        out.push(paragraph(`(block ${node.id} not evaluated)`))
        break
      default:
        if ('children' in node && Array.isArray(node.children)) {
          out.push({...node, children: plain(node.children as RootContent[], figures, phrasing || PHRASING_PARENTS.has(node.type))} as RootContent)
        } else {
          out.push(node)
        }
    }
  }
  return out
}

/**
 * The Markdown report of `doc`; `compiled` holds its figures compiled
 * (`compileFigures` of src/render/chart), `figureName` names the SVG file of figure N.
 */
export function reportToMarkdown(doc: ReportDocument, compiled: CompiledFigures, figureName: (n: number) => string): MarkdownReport {
  const figures: Figures = {compiled: compiled.byNode, name: figureName, out: []}
  const m = doc.meta
  const meta: [string, string | null][] = [['Project', m.project], ['Document', m.document], ['Revision', m.revision],
    ['Date', m.date], ['Author', m.author], ['Status', m.status]]
  const metaRows = meta.flatMap(([k, v]) => (v === null ? [] : [[k, v]]))
  const cover: RootContent[] = [heading(1, m.title ?? 'Design review'), table(['Item', 'Value'], metaRows)]
  const c = doc.cover
  cover.push(heading(2, 'Requirement verdicts'),
    c.verdicts.length === 0
      ? paragraph('No requirements stated.')
      : table(['Stage', 'Requirement', 'Value', 'Limit', 'Verdict'],
        c.verdicts.map((v) => [v.counted ? v.stage : `${v.stage} (baseline)`, v.requirement, v.value, v.limit,
          v.counted ? verdictText(v.verdict) : `${verdictText(v.verdict)} (not counted)`])),
    // The space stays outside the strong span: inside, it would be written as `&#x20;`.
    paragraph(strong('Overall:'), ` ${overallSentence(c).replace(/^Overall: /, '')}`))
  for (const a of c.archetypes) {
    cover.push(paragraph(`Stage ${a.stage} uses the archetype ${a.opamp}: its figures are for the class, not a part.`))
  }
  cover.push(heading(2, 'Open notes'), c.notes.length === 0
    ? paragraph('No caution, warning or safety note was raised.')
    : table(['Severity', 'Where', 'Note', 'Rule', 'Accepted'], c.notes.map((n) => [
      SEVERITY_WORDS[n.severity], n.stage === null ? 'every stage' : n.stage, n.title, n.rule, n.accepted ?? '—'])))
  // The closing statement refers to signatures "above": one row to sign per reviewer.
  const signOff: RootContent[] = m.reviewers.length === 0 ? [] : [heading(2, 'Sign-off'),
    table(['Reviewer', 'Role', 'Signature', 'Date'], m.reviewers.map((r) => [r.name, r.role, '', '']))]
  const tree: Root = {type: 'root', children: [
    ...cover,
    ...plain(doc.body.children, figures),
    ...plain(doc.appendix.children, figures),
    ...signOff,
    ...doc.closing.children
  ]}
  const markdown = toMarkdown(tree, {extensions: [gfmToMarkdown()], bullet: '-', rule: '-', fences: true})
  return {markdown, figures: figures.out}
}
