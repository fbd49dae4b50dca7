/**
 * The source's shape as DEVELOPERS.md draws it, read from the import statements of src/:
 * no runtime import cycle between modules, data flowing one way between the folders, and a
 * pure engine (no Node built-ins: no file system, no process, no clock).
 */
import {describe, expect, it} from 'vitest'
import {readdirSync, readFileSync} from 'node:fs'
import {dirname, join, relative, resolve} from 'node:path'

const SRC = resolve(import.meta.dirname, '..', 'src')
const files = (readdirSync(SRC, {recursive: true}) as string[]).filter((f) => f.endsWith('.ts')).map((f) => join(SRC, f)).sort()

/** Runtime imports of a module (type-only imports and re-exports left out: they vanish when compiled). */
function importsOf(file: string): {relative: string[]; packages: string[]} {
  const text = readFileSync(file, 'utf8')
  const rel: string[] = []
  const pkg: string[] = []
  const re = /^\s*(?:import|export)\s+(type\s+)?(?:[^'"]*?\s+from\s+)?['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/gm
  for (const m of text.matchAll(re)) {
    if (m[1] !== undefined) continue
    const spec = m[2] ?? m[3]!
    // `import {type A, type B} from` is type-only as well.
    const clause = m[0]
    if (/^\s*(?:import|export)\s*\{([^}]*)\}/.test(clause) && /\{\s*(?:type\s+[^,}]+\s*,?\s*)+\}/.test(clause)) continue
    if (spec.startsWith('.')) rel.push(resolve(dirname(file), spec.replace(/\.js$/, '.ts')))
    else pkg.push(spec)
  }
  return {relative: rel, packages: pkg}
}

const graph = new Map(files.map((f) => [f, importsOf(f)] as const))
const folderOf = (f: string): string => relative(SRC, f).split('/')[0]!.replace(/\.ts$/, '')

describe('the import graph of src/', () => {
  it('has no runtime import cycle', () => {
    const state = new Map<string, 'open' | 'done'>()
    const cycles: string[] = []
    const visit = (f: string, path: string[]): void => {
      if (state.get(f) === 'done') return
      if (state.get(f) === 'open') {
        cycles.push([...path.slice(path.indexOf(f)), f].map((p) => relative(SRC, p)).join(' → '))
        return
      }
      state.set(f, 'open')
      for (const next of graph.get(f)?.relative ?? []) visit(next, [...path, f])
      state.set(f, 'done')
    }
    for (const f of files) visit(f, [])
    expect(cycles).toEqual([])
  })

  it('resolves every relative import to a file of src/', () => {
    const missing = [...graph].flatMap(([f, i]) => i.relative.filter((r) => !graph.has(r)).map((r) => `${relative(SRC, f)} → ${relative(SRC, r)}`))
    expect(missing).toEqual([])
  })

  // Which folder may import which at run time (DEVELOPERS.md, "Architecture as built").
  const ALLOWED: Record<string, readonly string[]> = {
    units: [],
    engine: ['units'],
    note: ['units', 'engine'],
    rules: ['units', 'engine'],
    evaluate: ['units', 'engine', 'rules', 'note'],
    results: ['units', 'engine', 'rules', 'note', 'evaluate'],
    report: ['units', 'engine', 'rules', 'note', 'evaluate', 'results'],
    render: ['units', 'report']
  }

  it.each(Object.entries(ALLOWED))('lets src/%s import only %j of our folders', (folder, allowed) => {
    const wrong = [...graph]
      .filter(([f]) => folderOf(f) === folder)
      .flatMap(([f, i]) => i.relative.filter((r) => folderOf(r) !== folder && !allowed.includes(folderOf(r))).map((r) => `${relative(SRC, f)} → ${relative(SRC, r)}`))
    expect(wrong).toEqual([])
  })

  it('keeps the engine pure: no Node built-in and no package at run time', () => {
    const used = [...graph].filter(([f]) => folderOf(f) === 'engine').flatMap(([f, i]) => i.packages.map((p) => `${relative(SRC, f)} → ${p}`))
    expect(used).toEqual([])
  })
})
