/**
 * Everything the pipeline reads besides the note: the tool's version, the DejaVu fonts
 * (from the dejavu-fonts-ttf package, embedded in every PDF), and a template's theme and
 * text fragments. Read once per run and passed down as values.
 */
import {createHash} from 'node:crypto'
import {readdir, readFile} from 'node:fs/promises'
import {createRequire} from 'node:module'
import {dirname, join} from 'node:path'
import {fileURLToPath} from 'node:url'
import type {Root} from 'mdast'
import {unified} from 'unified'
import remarkParse from 'remark-parse'
import remarkGfm from 'remark-gfm'
import type {FontSet, LoadedFonts, Theme} from '../render/pdf/index.js'
import {parseTheme} from '../render/pdf/theme.js'

/** The package root: two levels above this file, in src/ and in dist/ alike. */
export const PACKAGE_ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..')

export async function toolVersion(): Promise<string> {
  const pkg = JSON.parse(await readFile(join(PACKAGE_ROOT, 'package.json'), 'utf8')) as {version: string}
  return pkg.version
}

/**
 * The identity of the code that runs: `npm run build` writes the SHA-256 of the bundle to
 * dist/bin/build-id.txt. The build cache keys on it beside the version, so a changed build
 * of the same version never calls an earlier PDF up to date. Empty when not bundled.
 */
export async function buildId(): Promise<string> {
  return readFile(join(PACKAGE_ROOT, 'dist', 'bin', 'build-id.txt'), 'utf8').then((s) => s.trim(), () => '')
}

const FONT_FILES: Record<keyof FontSet, string> = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  italic: 'DejaVuSans-Oblique.ttf',
  boldItalic: 'DejaVuSans-BoldOblique.ttf',
  mono: 'DejaVuSansMono.ttf',
  monoBold: 'DejaVuSansMono-Bold.ttf'
}

/** A loader that reads the fonts on its first call and returns the same set afterwards. */
export function lazyFonts(): () => Promise<FontSet> {
  let fonts: Promise<FontSet> | null = null
  return () => (fonts ??= loadFonts())
}

/**
 * The fonts of `fonts` parsed for the PDF renderer, on the first call (fontkit loads only
 * then, so `check` never does), the same parsed faces afterwards: one run's documents share
 * the parsing and the shaping of each distinct string.
 */
export function lazyFaces(fonts: () => Promise<FontSet>): () => Promise<LoadedFonts> {
  let faces: Promise<LoadedFonts> | null = null
  return () => (faces ??= Promise.all([fonts(), import('../render/pdf/fonts.js')]).then(([set, m]) => m.loadFonts(set)))
}

export async function loadFonts(): Promise<FontSet> {
  const require = createRequire(import.meta.url)
  const dir = join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf')
  const entries = await Promise.all(
    Object.entries(FONT_FILES).map(async ([k, f]) => {
      try {
        return [k, new Uint8Array(await readFile(join(dir, f)))] as const
      } catch (error) {
        throw new Error(`Cannot read font ${join(dir, f)}: ${error instanceof Error ? error.message : String(error)}; reinstall with \`npm ci\``)
      }
    })
  )
  return Object.fromEntries(entries) as unknown as FontSet
}

/** Template options (`options.json` of a template, or `"options"` in a `template.json`). */
export interface TemplateOptions {
  /** `full`: the whole method (method.md); `short`: one page of it (method-short.md) with the sources of method.md. */
  appendix: 'full' | 'short'
}

export const DEFAULT_TEMPLATE_OPTIONS: TemplateOptions = {appendix: 'full'}

const OPTION_VALUES: {[K in keyof TemplateOptions]: readonly TemplateOptions[K][]} = {appendix: ['full', 'short']}

export interface Template {
  name: string
  theme: Theme
  options: TemplateOptions
  /** The method appendix as the `appendix` option asks, parsed (on first read). */
  readonly method: Root
  /** The sign-off and closing text, parsed (on first read). */
  readonly closing: Root
}

const parseMarkdown = (md: string): Root => unified().use(remarkParse).use(remarkGfm).runSync(unified().use(remarkParse).use(remarkGfm).parse(md)) as Root

/** Template names are folder names under templates/: letters, digits and dashes only. */
export const isTemplateName = (name: string): boolean => /^[a-z0-9][a-z0-9-]*$/.test(name)

export type Json = null | boolean | number | string | Json[] | {[k: string]: Json}
const isMap = (v: Json | undefined): v is {[k: string]: Json} => typeof v === 'object' && v !== null && !Array.isArray(v)

/** `over` laid onto `base`, maps merged key by key, anything else replaced. */
function overlay(base: Json, over: Json): Json {
  if (!isMap(base) || !isMap(over)) return over
  const out: {[k: string]: Json} = {...base}
  for (const [k, v] of Object.entries(over)) out[k] = k in base ? overlay(base[k]!, v) : v
  return out
}

type TextName = 'method' | 'signoff' | 'closing'

/** A template's raw sources: its theme JSON (overlays applied), its text files and its options. */
interface TemplateSources {
  themeJson: Json
  texts: Record<TextName, string> & {'method-short'?: string}
  options: TemplateOptions
}

/** The options a template's JSON gives, checked: unknown keys and values are errors. */
export function templateOptionsOf(name: string, file: string, json: Json | undefined, base: TemplateOptions): TemplateOptions {
  if (json === undefined) return base
  if (!isMap(json)) throw new Error(`Template \`${name}\`: the options in ${file} must be a map such as {"appendix": "short"}`)
  const out: TemplateOptions = {...base}
  for (const [k, v] of Object.entries(json)) {
    if (k !== 'appendix') throw new Error(`Template \`${name}\`: unknown option \`${k}\` in ${file}, expected \`appendix\``)
    if (typeof v !== 'string' || !(OPTION_VALUES.appendix as readonly string[]).includes(v)) {
      throw new Error(`Template \`${name}\`: option appendix is ${JSON.stringify(v)} in ${file}, expected "full" or "short"`)
    }
    out.appendix = v as TemplateOptions['appendix']
  }
  return out
}

/** The "Sources" section of the full method (its heading to the end), for the short appendix. */
function sourcesOf(method: Root): Root['children'] {
  const at = method.children.findIndex((n) => n.type === 'heading' && n.children.some((c) => c.type === 'text' && c.value.trim() === 'Sources'))
  return at < 0 ? [] : method.children.slice(at)
}

/**
 * A template is a folder of templates/ holding `theme.json`, `method.md`, `signoff.md` and
 * `closing.md` — or a `template.json` `{"extends": "standard", "theme": {…}}` that takes
 * another template and changes some of its theme values (e.g. `templates/letter/`), any of
 * the three text files it holds replacing the base's.
 */
export async function loadTemplate(name: string): Promise<Template> {
  const {themeJson, texts, options} = await readTemplateSources(name, [])
  // The fragments are parsed on first use: `check` reads the template (a missing or broken
  // one is an error there too) but never the parsed fragments, which only a report needs.
  let method: Root | null = null
  let closing: Root | null = null
  const methodTree = (): Root => {
    const full = parseMarkdown(texts.method)
    if (options.appendix === 'full') return full
    // One page of method, then the full method's sources, said once in method.md.
    const brief = parseMarkdown(texts['method-short'] ?? '')
    return {...brief, children: [...brief.children, ...sourcesOf(full)]}
  }
  return {
    name, theme: parseTheme(themeJson), options,
    get method(): Root { return (method ??= methodTree()) },
    get closing(): Root { return (closing ??= parseMarkdown(`${texts.signoff}\n\n${texts.closing}`)) }
  }
}

/**
 * The sources of template `name`, its bases read first (`seen`: the templates extending it,
 * to refuse a loop). Nothing is kept between calls: the caller (the run's `Resources`) keeps
 * the templates it has loaded.
 */
async function readTemplateSources(name: string, seen: readonly string[]): Promise<TemplateSources> {
  if (!isTemplateName(name)) throw new Error(`Unexpected template name \`${name}\`, expected a folder name of templates/ such as \`standard\``)
  if (seen.includes(name)) throw new Error(`Template \`${name}\` extends itself (${[...seen, name].join(' → ')})`)
  const dir = join(PACKAGE_ROOT, 'templates', name)
  const tryRead = (f: string): Promise<string | null> => readFile(join(dir, f), 'utf8').catch(() => null)
  const parseJson = (f: string, text: string): Json => {
    try {
      return JSON.parse(text) as Json
    } catch (error) {
      throw new Error(`Template \`${name}\`: ${f} is not valid JSON (${error instanceof Error ? error.message : String(error)})`)
    }
  }
  const derived = await tryRead('template.json')
  let base: TemplateSources | null = null
  let themeJson: Json
  let options: TemplateOptions
  if (derived !== null) {
    const spec = parseJson('template.json', derived)
    const parent = isMap(spec) && typeof spec['extends'] === 'string' ? spec['extends'] : null
    if (parent === null) throw new Error(`Template \`${name}\`: template.json needs "extends": the name of another template`)
    base = await readTemplateSources(parent, [...seen, name])
    themeJson = overlay(base.themeJson, isMap(spec) && spec['theme'] !== undefined ? spec['theme'] : {})
    options = templateOptionsOf(name, 'template.json', isMap(spec) ? spec['options'] : undefined, base.options)
  } else {
    const text = await tryRead('theme.json')
    if (text === null) throw new Error(`Template \`${name}\` is missing theme.json (looked in ${dir})`)
    themeJson = parseJson('theme.json', text)
    const own = await tryRead('options.json')
    options = templateOptionsOf(name, 'options.json', own === null ? undefined : parseJson('options.json', own), DEFAULT_TEMPLATE_OPTIONS)
  }
  const texts = {} as TemplateSources['texts']
  for (const k of ['method', 'signoff', 'closing'] as const) {
    const own = await tryRead(`${k}.md`)
    const text = own ?? base?.texts[k] ?? null
    if (text === null) throw new Error(`Template \`${name}\` is missing ${k}.md (looked in ${dir})`)
    texts[k] = text
  }
  // The short method is needed only when the option asks for it.
  const short = (await tryRead('method-short.md')) ?? base?.texts['method-short'] ?? null
  if (short !== null) texts['method-short'] = short
  else if (options.appendix === 'short') throw new Error(`Template \`${name}\` asks for appendix: short but has no method-short.md (looked in ${dir})`)
  return {themeJson, texts, options}
}

/** Hash of every file under templates/ (names and bytes, sorted): part of each build's cache key. */
export async function templatesHash(): Promise<string> {
  const root = join(PACKAGE_ROOT, 'templates')
  const files = (await readdir(root, {recursive: true, withFileTypes: true}))
    .filter((d) => d.isFile())
    .map((d) => join(d.parentPath, d.name))
    .sort()
  const h = createHash('sha256')
  for (const f of files) h.update(f.slice(root.length)).update('\0').update(await readFile(f)).update('\0')
  return h.digest('hex')
}
