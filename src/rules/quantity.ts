/**
 * Number formatting for note texts: SI-prefixed quantities, percentages, degrees, ratios.
 *
 * `formatQuantity` is a small local stand-in with the signature of `src/units/format.ts`
 * (`formatQuantity(value, unit)`), which was not written yet when the rules were; to do:
 * when it lands, re-export it from here and drop the local one.
 */

const PREFIXES: readonly [number, string][] = [
  [1e12, 'T'], [1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''],
  [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'], [1e-15, 'f']
]

/** Three significant figures, trailing zeros dropped: 4.70 → "4.7", 100 → "100". */
function threeFigures(x: number): string {
  return String(Number(x.toPrecision(3)))
}

/**
 * A value with an SI prefix and its unit, three significant figures: (4.99e4, 'Ω') → "49.9 kΩ",
 * (1.2e-6, 'V') → "1.2 µV", (0, 'V') → "0 V". Non-finite values print as "—".
 */
export function formatQuantity(value: number, unit: string): string {
  if (!Number.isFinite(value)) return '—'
  if (value === 0) return `0 ${unit}`
  const magnitude = Math.abs(value)
  for (const [scale, prefix] of PREFIXES) {
    // Compare after rounding, so 999.96 reads "1 k…" rather than "1e+3 …".
    if (Number(magnitude.toPrecision(3)) >= scale) return `${threeFigures(value / scale)} ${prefix}${unit}`
  }
  const [scale, prefix] = PREFIXES[PREFIXES.length - 1]!
  return `${threeFigures(value / scale)} ${prefix}${unit}`
}

/** A fraction as a percentage: 0.634 → "63 %"; small values keep two figures: 0.0042 → "0.42 %". */
export function formatPercent(fraction: number): string {
  const pct = fraction * 100
  return `${Math.abs(pct) >= 10 ? pct.toFixed(0) : threeFigures(Number(pct.toPrecision(2)))} %`
}

/** Degrees with one decimal: 38.24 → "38.2°". */
export function formatDegrees(deg: number): string {
  return `${deg.toFixed(1)}°`
}

/** A plain ratio, two decimals: 0.8 → "0.80". */
export function formatRatio(x: number): string {
  return x.toFixed(2)
}

/** A temperature in °C as written in notes: 85 → "85 °C". */
export function formatCelsius(t: number): string {
  return `${threeFigures(t)} °C`
}
