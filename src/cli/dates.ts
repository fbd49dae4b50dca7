/**
 * The one date a report carries in its metadata: the note's `date` (ISO yyyy-mm-dd), else
 * SOURCE_DATE_EPOCH (seconds), else a fixed epoch — never the clock, so the same note gives
 * the same bytes.
 */
/** 2000-01-01T00:00Z, ms; each call gets a Date of its own (a shared Date could be changed by its user). */
const FIXED_EPOCH_MS = Date.UTC(2000, 0, 1)

export function reportDate(noteDate: string | null, sourceDateEpoch: string | undefined): Date {
  const m = noteDate === null ? null : /^(\d{4})-(\d{2})-(\d{2})/.exec(noteDate)
  if (m) {
    const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])))
    if (!Number.isNaN(d.getTime())) return d
  }
  if (sourceDateEpoch !== undefined && /^\d+$/.test(sourceDateEpoch.trim())) {
    const d = new Date(Number(sourceDateEpoch.trim()) * 1000)
    if (!Number.isNaN(d.getTime())) return d
  }
  return new Date(FIXED_EPOCH_MS)
}
