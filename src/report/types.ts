/**
 * The report tree that `src/report` builds and `src/render` draws: mdast for the prose and
 * the generated tables, plus three node types of our own (figure, callout, caption) and
 * the document furniture (cover verdicts, appendix, closing text).
 */
import type {BlockContent, Root} from 'mdast'
import type {DocumentMeta} from '../note/types.js'
import type {NoteRuleId} from '../rules/index.js'
import type {Severity} from '../rules/types.js'
import type {Drawing} from './schematic/types.js'
import type {TopLevelSpec} from 'vega-lite'

export type Verdict = 'met' | 'not-met' | 'not-evaluated'

/**
 * A figure: a chart as its vega-lite spec with the data inline (the renderers compile it,
 * src/render/chart), or a drawing given as SVG text.
 */
export interface FigureNode {
  type: 'figure'
  /** Figure number in the document, 1-based. */
  number: number
  caption: string
  /** The chart: a vega-lite spec with inline data only. */
  chart?: TopLevelSpec
  /** Or SVG text (fonts named as in `src/report/charts/fonts.ts`) … */
  svg?: string
  /** … and its natural size, pt. */
  width?: number
  height?: number
}

/** A stage's schematic as vector drawing data (DESIGN §8.9), numbered with the figures. */
export interface SchematicNode {
  type: 'schematic'
  /** Figure number in the document, 1-based. */
  number: number
  caption: string
  drawing: Drawing
}

/** A boxed note: a rule's practice/safety note, or a verdict line. Shown with a word and a shape. */
export interface CalloutNode {
  type: 'callout'
  severity: Severity | 'met' | 'not-met' | 'not-evaluated'
  /** The word printed in front, e.g. "CAUTION", "NOT MET". */
  label: string
  children: BlockContent[]
  /** A name the cover refers to (its page is looked up when drawn); optional. */
  anchor?: string
}

/** A caption kept with the table that follows it ("Table 3 — DC error budget"). */
export interface CaptionNode {
  type: 'caption'
  text: string
}

/** An explicit page break. */
export interface PageBreakNode {
  type: 'pageBreak'
}

declare module 'mdast' {
  interface RootContentMap {
    figure: FigureNode
    schematic: SchematicNode
    callout: CalloutNode
    caption: CaptionNode
    pageBreak: PageBreakNode
  }
  interface BlockContentMap {
    figure: FigureNode
    schematic: SchematicNode
    callout: CalloutNode
    caption: CaptionNode
    pageBreak: PageBreakNode
  }
}

/**
 * A note's own image (mdast `image` or `imageReference`) numbered with the charts and
 * schematics, in document order: its figure number in `data.figure`, captioned below with
 * its alt text ("Figure 1 — Block diagram …").
 */
export interface NoteImageData {
  figure?: number
}

/** The figure number the report gave a note's image, if any. */
export const noteImageFigure = (node: {data?: unknown}): number | undefined =>
  typeof node.data === 'object' && node.data !== null && typeof (node.data as NoteImageData).figure === 'number'
    ? (node.data as NoteImageData).figure
    : undefined

/** "Figure N — alt" (or "Figure N" without alt text), as the PDF and the Markdown print it. */
export const noteImageCaption = (figure: number, alt: string | null | undefined): string =>
  alt === null || alt === undefined || alt.trim() === '' ? `Figure ${figure}` : `Figure ${figure} — ${alt.trim()}`

/** One row of the cover's verdict table. */
export interface CoverVerdict {
  stage: string
  requirement: string
  value: string
  limit: string
  verdict: Verdict
  /** False for a `baseline` stage: shown, not counted in the overall verdict. */
  counted: boolean
}

/** A caution, warning or safety note the signer must see, listed on the cover. */
export interface CoverNote {
  /** Stage id, or null for a note shared by every stage. */
  stage: string | null
  rule: NoteRuleId
  severity: Exclude<Severity, 'info'>
  title: string
  /** The author's reason when the stage accepts the rule, else null. */
  accepted: string | null
  /** Anchor of the note's callout in the body (for its page). */
  anchor: string
}

/** The cover's summary: what the overall verdict counts, and what it leaves out. */
export interface CoverSummary {
  verdicts: CoverVerdict[]
  /** Verdict over the counted requirements only. */
  overall: Verdict
  /** Counted stages (role `design`) and their requirements. */
  counted: {stages: number; chains: number; requirements: number; notMet: number}
  /** Ids of the baseline stages (shown, not counted). */
  baseline: string[]
  /** Stages whose op-amp is an archetype: figures for the class, not a part. */
  archetypes: {stage: string; opamp: string}[]
  notes: CoverNote[]
}

export interface ReportDocument {
  meta: DocumentMeta
  cover: CoverSummary
  /** The note's prose in order, each block replaced by its section. */
  body: Root
  /** Method, assumptions, inputs. */
  appendix: Root
  /** Sign-off statement and closing statement (template fragments), ending the sign-off page. */
  closing: Root
  /** Hex SHA-256 of the note's bytes. */
  sourceSha256: string
  toolVersion: string
}
