/**
 * Number formatting for the report: SI-prefixed quantities from src/units, plus the few
 * report-only forms (shares, dB, degrees, verdict words).
 */
import {formatQuantity} from '../units/format.js'
import type {Verdict} from './types.js'

/** SI-prefixed value with unit, or an em dash for a value that does not exist. */
export const q = (value: number | null, unit: string, digits = 3): string =>
  value === null || !Number.isFinite(value) ? '—' : formatQuantity(value, unit, {digits})

/** A fraction as a percentage with one decimal, e.g. 0.1234 → "12.3 %". */
export const pct = (fraction: number): string => `${(fraction * 100).toFixed(1)} %`

/** Degrees with one decimal, or an em dash. */
export const deg = (value: number | null): string => (value === null ? '—' : `${value.toFixed(1)}°`)

/** Decibels with one decimal. */
export const db = (value: number): string => `${value.toFixed(1)} dB`

/** The verdict word with its mark, so that it never depends on colour. */
export const verdictText = (v: Verdict): string =>
  v === 'met' ? '✓ met' : v === 'not-met' ? '✗ NOT MET' : '– not evaluated'
