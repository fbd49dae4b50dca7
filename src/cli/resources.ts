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
import type {FontSet, Theme} from '../render/index.js'
import {parseTheme} from '../render/theme.js'

/** The package root: two levels above this file, in src/ and in dist/ alike. */
export const PACKAGE_ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..')

export async function toolVersion(): Promise<string> {
  const pkg = JSON.parse(await readFile(join(PACKAGE_ROOT, 'package.json'), 'utf8')) as {version: string}
  return pkg.version
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

export interface Template {
  name: string
  theme: Theme
  method: Root
  closing: Root
}

const parseMarkdown = (md: string): Root => unified().use(remarkParse).use(remarkGfm).runSync(unified().use(remarkParse).use(remarkGfm).parse(md)) as Root

/** Template names are folder names under templates/: letters, digits and dashes only. */
export const isTemplateName = (name: string): boolean => /^[a-z0-9][a-z0-9-]*$/.test(name)

export async function loadTemplate(name: string): Promise<Template> {
  if (!isTemplateName(name)) throw new Error(`Unexpected template name \`${name}\`, expected a folder name of templates/ such as \`standard\``)
  const dir = join(PACKAGE_ROOT, 'templates', name)
  const read = async (f: string): Promise<string> => {
    try {
      return await readFile(join(dir, f), 'utf8')
    } catch {
      throw new Error(`Template \`${name}\` is missing ${f} (looked in ${dir})`)
    }
  }
  const theme = parseTheme(JSON.parse(await read('theme.json')))
  const method = parseMarkdown(await read('method.md'))
  const closing = parseMarkdown(`${await read('signoff.md')}\n\n${await read('closing.md')}`)
  return {name, theme, method, closing}
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
