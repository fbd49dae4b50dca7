/**
 * Helpers for the axes of the charts: log-axis data hygiene, decade tick values, and vega
 * expressions that print a number with an SI prefix and its unit.
 *
 * A log axis must never see zero or a negative number (vega would only warn and draw an
 * empty axis), so builders pass their points through `positivePoints` and report what was
 * dropped; numbers are formatted by d3-format inside vega (µ is U+00B5, minus U+2212).
 */

/** One point of a curve. */
export interface Point {
  x: number
  y: number
}

/**
 * The points of `ys` on `xs` that a log-x chart can show: finite x > 0 and finite y, and
 * y > 0 as well when the y axis is logarithmic.
 */
export function plottablePoints(xs: readonly number[], ys: readonly number[], logY: boolean): Point[] {
  const points: Point[] = []
  const n = Math.min(xs.length, ys.length)
  for (let i = 0; i < n; i++) {
    const x = xs[i] as number
    const y = ys[i] as number
    if (!(Number.isFinite(x) && x > 0 && Number.isFinite(y))) continue
    if (logY && !(y > 0)) continue
    points.push({x, y})
  }
  return points
}

/** [min, max] of the values; throws on an empty list (a chart with no data is a bug upstream). */
export function extent(values: readonly number[], what: string): [number, number] {
  if (values.length === 0) throw new RangeError(`Unexpected empty ${what}, expected at least one plottable point`)
  let lo = Infinity
  let hi = -Infinity
  for (const v of values) {
    if (v < lo) lo = v
    if (v > hi) hi = v
  }
  return [lo, hi]
}

/** A log axis needs 0 < lo ≤ hi, both finite: anything else is a bug in a builder, not a chart. */
function assertLogRange(lo: number, hi: number): void {
  if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo > 0 && hi >= lo)) {
    throw new RangeError(`Unexpected log-axis range [${lo}, ${hi}], expected 0 < low ≤ high, both finite`)
  }
}

/** The decade-aligned range around [lo, hi] (both > 0), for a log axis that starts and ends on a decade. */
export function decadeDomain([lo, hi]: [number, number]): [number, number] {
  assertLogRange(lo, hi)
  const a = 10 ** Math.floor(Math.log10(lo) + 1e-9)
  let b = 10 ** Math.ceil(Math.log10(hi) - 1e-9)
  if (b <= a) b = a * 10
  return [a, b]
}

/**
 * Tick values for a log axis over [lo, hi]: the decades inside it, or 1-2-5 steps when
 * fewer than two decades fall inside. Values are rounded to 12 significant digits so that
 * labels print as "1k", not "999.9999999999999".
 */
export function logTicks([lo, hi]: [number, number]): number[] {
  assertLogRange(lo, hi)
  const ticks = (mantissas: number[]) => {
    const out: number[] = []
    for (let e = Math.floor(Math.log10(lo)) - 1; e <= Math.ceil(Math.log10(hi)) + 1; e++) {
      for (const m of mantissas) {
        const v = Number((m * 10 ** e).toPrecision(12))
        if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(v)
      }
    }
    return out
  }
  const decades = ticks([1])
  return decades.length >= 2 ? decades : ticks([1, 2, 5])
}

/** d3-format specifier of axis labels: SI prefix, trailing zeros trimmed ("1k", "100µ", "2.5n"). */
export const SI_AXIS_FORMAT = '~s'

/**
 * Axis `labelExpr` printing zero as "0": d3 gives every tick of a linear axis the same
 * prefix, so zero would otherwise print as "0µ".
 */
export const ZERO_AS_PLAIN_LABEL = "datum.value === 0 ? '0' : datum.label"

/** The SI prefix letters d3-format's `s` type can end a number with. */
const SI_PREFIXES = 'yzafpnµmkMGTPEZY'

/**
 * A vega expression printing `expr` (a number) with 3 significant digits, an SI prefix and
 * `unit`, a space before the prefix: 0.00000152 → "1.52 µV", 12300 → "12.3 kHz", 0 → "0 V".
 */
export function siTextExpr(expr: string, unit: string): string {
  const text = `format(${expr}, '.3~s')`
  const last = `slice(${text}, -1)`
  return `(indexof('${SI_PREFIXES}', ${last}) >= 0 ? slice(${text}, 0, -1) + ' ' + ${last} : ${text} + ' ') + ${JSON.stringify(unit)}`
}

/**
 * Axis `labelExpr` for frequency ticks as engineers write them, unit on every tick:
 * "0.1 Hz", "10 Hz", "1 kHz", "2.5 MHz" — never "100m". Below 1 Hz the plain decimal,
 * from 1 Hz on the SI prefix (k, M, G).
 */
export const FREQUENCY_LABEL_EXPR =
  `datum.value < 1 ? format(datum.value, '~r') + ' Hz' : ${siTextExpr('datum.value', 'Hz')}`

/** The axis object of a log frequency axis with engineering tick labels (`labels: false` hides them). */
export function frequencyAxis(domain: [number, number], title: string | null = 'Frequency', labels = true) {
  return {title, labels, labelExpr: FREQUENCY_LABEL_EXPR, values: logTicks(domain), grid: true}
}

/** The shared x encoding of the frequency charts: field `f`, log scale over `domain`, ticks at each decade with their unit. */
export function logFrequencyX(domain: [number, number]) {
  return {
    field: 'f',
    type: 'quantitative' as const,
    scale: {type: 'log' as const, domain, nice: false},
    axis: frequencyAxis(domain)
  }
}

const PREFIXES = [[-15, 'f'], [-12, 'p'], [-9, 'n'], [-6, 'µ'], [-3, 'm'], [0, ''], [3, 'k'], [6, 'M'], [9, 'G']] as const

/**
 * One SI prefix for a linear axis, chosen by its largest value (so the largest bar reads
 * "12 mV", not "0.012 V"): the prefix, and the factor tick values are divided by.
 */
export function axisPrefix(largest: number): {prefix: string; factor: number} {
  const exp = largest > 0 && Number.isFinite(largest) ? Math.floor(Math.log10(largest) / 3) * 3 : 0
  const hit = PREFIXES.find(([e]) => e === Math.max(-15, Math.min(9, exp))) ?? [0, '']
  return {prefix: hit[1], factor: 10 ** hit[0]}
}

/** A linear axis in one prefix: title "name (mV)", ticks as plain numbers in that unit. */
export function prefixedAxis(name: string, unit: string, largest: number) {
  const {prefix, factor} = axisPrefix(largest)
  return {title: `${name} (${prefix}${unit})`, labelExpr: `format(datum.value / ${factor}, '~g')`}
}
