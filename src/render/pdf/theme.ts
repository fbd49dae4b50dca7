/**
 * The template's theme: page size, margins, font sizes, spacing and colours. Layout values
 * live in `templates/<name>/theme.json`, never in the drawing code; `parseTheme` checks
 * every field and names the first bad one. Colour is never the only carrier of meaning:
 * callouts and verdicts also get a word and a drawn shape (see `shapes.ts`).
 */

export const CALLOUT_KINDS = ['info', 'caution', 'warning', 'safety', 'met', 'not-met', 'not-evaluated'] as const
export type CalloutKind = (typeof CALLOUT_KINDS)[number]

const FONT_SIZE_KEYS = ['title', 'body', 'h1', 'h2', 'h3', 'h4', 'table', 'code', 'small'] as const
const MARGIN_KEYS = ['top', 'bottom', 'left', 'right'] as const
const SPACING_KEYS = [
  'paragraph', 'headingBefore', 'headingAfter', 'listIndent', 'quoteIndent', 'cellPadding',
  'codePadding', 'calloutPadding', 'signatureRowHeight', 'furnitureGap',
] as const
const COLOUR_KEYS = [
  'text', 'muted', 'rule', 'link', 'tableHeaderFill', 'tableStripeFill', 'codeFill', 'quoteBar', 'placeholder',
] as const

export type PageName = 'a4' | 'letter'

export interface Theme {
  /** Paper size (default in the standard template: `a4`). */
  page: PageName
  /** Page margins, pt. Header and footer sit inside the top and bottom margins. */
  margins: Record<(typeof MARGIN_KEYS)[number], number>
  /** Font sizes, pt. */
  fontSizes: Record<(typeof FONT_SIZE_KEYS)[number], number>
  /** Extra space between lines, pt. */
  lineGap: number
  /** Vertical gaps and indents, pt. */
  spacing: Record<(typeof SPACING_KEYS)[number], number>
  /** `#rrggbb` colours. */
  colours: Record<(typeof COLOUR_KEYS)[number], string>
  /** Box fill and accent (bar and shape) per callout kind. */
  callouts: Record<CalloutKind, {fill: string; accent: string}>
}

type Obj = Record<string, unknown>

function fail(path: string, expected: string, got: unknown): never {
  const shown = got === undefined ? 'nothing' : JSON.stringify(got)
  throw new Error(`Invalid theme: \`${path}\` must be ${expected}, got ${shown}`)
}

function object(value: unknown, path: string, keys: readonly string[]): Obj {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) fail(path, 'an object', value)
  const obj = value as Obj
  for (const key of Object.keys(obj)) {
    if (!keys.includes(key)) {
      throw new Error(`Invalid theme: unexpected key \`${path}.${key}\`, expected one of ${keys.join(', ')}`)
    }
  }
  return obj
}

function numbers<K extends string>(value: unknown, path: string, keys: readonly K[], min: number): Record<K, number> {
  const obj = object(value, path, keys)
  const out = {} as Record<K, number>
  for (const key of keys) {
    const v = obj[key]
    if (typeof v !== 'number' || !Number.isFinite(v) || v < min) {
      fail(`${path}.${key}`, min > 0 ? `a number ≥ ${min}` : 'a number ≥ 0', v)
    }
    out[key] = v
  }
  return out
}

function colour(value: unknown, path: string): string {
  if (typeof value !== 'string' || !/^#[0-9a-fA-F]{6}$/.test(value)) fail(path, 'a colour as #rrggbb', value)
  return value.toLowerCase()
}

function colours<K extends string>(value: unknown, path: string, keys: readonly K[]): Record<K, string> {
  const obj = object(value, path, keys)
  const out = {} as Record<K, string>
  for (const key of keys) out[key] = colour(obj[key], `${path}.${key}`)
  return out
}

/** Checks a parsed `theme.json` and returns it typed; throws naming the first bad field. */
export function parseTheme(json: unknown): Theme {
  const root = object(json, 'theme', ['page', 'margins', 'fontSizes', 'lineGap', 'spacing', 'colours', 'callouts'])
  const page = root['page']
  if (page !== 'a4' && page !== 'letter') fail('theme.page', '"a4" or "letter"', page)
  const lineGap = root['lineGap']
  if (typeof lineGap !== 'number' || !Number.isFinite(lineGap) || lineGap < 0) fail('theme.lineGap', 'a number ≥ 0', lineGap)
  const calloutsIn = object(root['callouts'], 'theme.callouts', CALLOUT_KINDS)
  const callouts = {} as Theme['callouts']
  for (const kind of CALLOUT_KINDS) {
    const c = colours(calloutsIn[kind], `theme.callouts.${kind}`, ['fill', 'accent'] as const)
    callouts[kind] = c
  }
  const theme: Theme = {
    page,
    margins: numbers(root['margins'], 'theme.margins', MARGIN_KEYS, 0),
    fontSizes: numbers(root['fontSizes'], 'theme.fontSizes', FONT_SIZE_KEYS, 1),
    lineGap,
    spacing: numbers(root['spacing'], 'theme.spacing', SPACING_KEYS, 0),
    colours: colours(root['colours'], 'theme.colours', COLOUR_KEYS),
    callouts,
  }
  if (theme.margins.top < theme.spacing.furnitureGap * 2 || theme.margins.bottom < theme.spacing.furnitureGap * 2) {
    throw new Error('Invalid theme: `theme.margins.top` and `theme.margins.bottom` must each be at least twice `theme.spacing.furnitureGap` (room for header and footer)')
  }
  return theme
}
