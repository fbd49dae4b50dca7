/**
 * Resistor corners (DESIGN §4.2): every resistor that carries a spread moves independently by
 * ± its own spread, and a term takes its extreme over all 2^k combinations. The DC terms are
 * monotonic in each resistor, so the extremes lie on these corners.
 */
import {RESISTOR_KEYS, type ResistorKey, type ResistorValues} from '../topology/index.js'

/** Fractional spread per resistor (0 = fixed). */
export type Spreads = Partial<Record<ResistorKey, number>>

/**
 * Largest value of `measure` over all corners; the nominal point counts as well.
 * @param spreads
 *   Fractions, e.g. 0.001 for ±0.1 %.
 */
export function maxOverCorners(nominal: ResistorValues, spreads: Spreads, measure: (r: ResistorValues) => number): number {
  const moving = RESISTOR_KEYS.filter((k) => (spreads[k] ?? 0) > 0 && Number.isFinite(nominal[k]) && nominal[k] > 0)
  let best = measure(nominal)
  const count = 1 << moving.length
  for (let c = 0; c < count; c++) {
    const r: ResistorValues = {...nominal}
    moving.forEach((k, bit) => {
      const s = spreads[k] ?? 0
      r[k] = nominal[k] * ((c >> bit) & 1 ? 1 + s : 1 - s)
    })
    best = Math.max(best, measure(r))
  }
  return best
}
