/**
 * The state one report build carries through its sections: the running figure and table
 * numbers, and the build warnings collected on the way.
 */

export interface ReportContext {
  /** Last figure number used. */
  figure: number
  /** Last table number used. */
  table: number
  /** Warnings for the CLI to report. */
  warnings: string[]
}

/** Take the next table number and return its caption text. */
export const nextTable = (ctx: ReportContext, title: string): string => `Table ${++ctx.table} — ${title}`
