/**
 * What the real command loads (a module-load trace, test/bench/load-trace.mjs, mapped to
 * packages through esbuild's metafile of dist/bin): `check` loads no PDF writer, no chart
 * library and reads no font; `build` does (the control, so the trace can tell).
 */
import {spawnSync} from 'node:child_process'
import {mkdtempSync, readFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join} from 'node:path'
import {pathToFileURL} from 'node:url'
import {describe, expect, it} from 'vitest'
import {CLI, ROOT} from './helpers.js'

const HEAVY = ['pdfkit', 'fontkit', 'vega', 'vega-lite', 'vega-scenegraph', 'svg-to-pdfkit']

function trace(args: string[]): {packages: Set<string>; fonts: string[]} {
  const dir = mkdtempSync(join(tmpdir(), 'ampreview-trace-'))
  const file = join(dir, 'trace.txt')
  const r = spawnSync(process.execPath, ['--import', pathToFileURL(join(ROOT, 'test/bench/load-trace.mjs')).href, CLI, ...args, '--quiet'], {
    cwd: ROOT, env: {...process.env, AMPREVIEW_LOAD_TRACE: file}, encoding: 'utf8'
  })
  expect([0, 1], r.stderr).toContain(r.status)
  const lines = readFileSync(file, 'utf8').split('\n')
  const meta = JSON.parse(readFileSync(join(ROOT, 'dist/bin/meta.json'), 'utf8')) as {outputs: Record<string, {inputs: Record<string, unknown>}>}
  const prefix = pathToFileURL(ROOT).href + '/'
  const packages = new Set<string>()
  for (const l of lines) {
    if (!l.startsWith('module ')) continue
    const url = l.slice('module '.length)
    const out = meta.outputs[url.startsWith(prefix) ? url.slice(prefix.length) : '']
    const direct = /node_modules\/((?:@[^/]+\/)?[^/]+)\//.exec(url)?.[1]
    if (direct) packages.add(direct)
    for (const input of Object.keys(out?.inputs ?? {})) {
      const p = /node_modules\/((?:@[^/]+\/)?[^/]+)\//.exec(input)?.[1]
      if (p) packages.add(p)
    }
  }
  return {packages, fonts: lines.filter((l) => l.startsWith('font ')).map((l) => l.slice(5))}
}

describe('module-load trace of the command', () => {
  it('check loads neither pdfkit, fontkit nor vega, and reads no font', () => {
    const t = trace(['check', 'sample-designs'])
    expect(t.packages.has('unified')).toBe(true)
    expect(HEAVY.filter((p) => t.packages.has(p))).toEqual([])
    expect(t.fonts).toEqual([])
  })

  it('build (the control) loads them and reads the fonts', () => {
    const out = mkdtempSync(join(tmpdir(), 'ampreview-trace-out-'))
    const t = trace(['build', 'sample-designs/photodiode-receiver.md', '--out', out, '--force'])
    expect(HEAVY.filter((p) => t.packages.has(p))).toEqual(HEAVY)
    expect(t.fonts.length).toBeGreaterThan(0)
  })
})
