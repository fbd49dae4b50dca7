/**
 * The state one report build carries through its sections: the running figure and table
 * numbers, and the build warnings collected on the way.
 */
import type {CoverNote} from './types.js'

export interface ReportContext {
  /** Last figure number used. */
  figure: number
  /** Last table number used. */
  table: number
  /** Warnings for the CLI to report. */
  warnings: string[]
  /** The open notes, in document order, as the sections place them (for the cover). */
  coverNotes: CoverNote[]
}

/** Take the next table number and return its caption text. */
export const nextTable = (ctx: ReportContext, title: string): string => `Table ${++ctx.table} — ${title}`
