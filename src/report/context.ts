/**
 * The state one report build carries through its sections: the chart fonts, the running
 * figure and table numbers, and the build warnings collected on the way.
 */
import type {CoverNote} from './types.js'
import type {ChartFonts} from './vega.js'

export interface ReportContext {
  fonts: ChartFonts
  /** Last figure number used. */
  figure: number
  /** Last table number used. */
  table: number
  /** Warnings (e.g. from chart rendering) for the CLI to report. */
  warnings: string[]
  /** The open notes, in document order, as the sections place them (for the cover). */
  coverNotes: CoverNote[]
}

/** Take the next table number and return its caption text. */
export const nextTable = (ctx: ReportContext, title: string): string => `Table ${++ctx.table} — ${title}`
