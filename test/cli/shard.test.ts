/**
 * `--shard i/n` and `merge` (DESIGN §8.10): the shards of a batch are disjoint and together
 * the whole batch, and merging the shards' `--json` results gives the unsharded result
 * byte for byte, with the same exit code.
 */
import {copyFileSync, mkdtempSync, readdirSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {inShard, parseShard, shardOf} from '../../src/cli/shard.js'
import {mergeRuns, MergeError} from '../../src/results/merge.js'
import {ROOT, runCli} from './helpers.js'

const paths = Array.from({length: 300}, (_v, i) => `designs/group-${i % 7}/note-${String(i).padStart(3, '0')}.md`)

describe('shards', () => {
  it('parses I/N with 1 ≤ I ≤ N only', () => {
    expect(parseShard('2/8')).toEqual({index: 2, count: 8})
    for (const bad of ['0/3', '4/3', '1/0', '1', 'a/b', '1/2/3', '-1/2']) expect(parseShard(bad), bad).toBeNull()
  })

  it.each([1, 2, 3, 8])('of %i: disjoint, each in the order listed, and together the whole batch', (n) => {
    const shards = Array.from({length: n}, (_v, i) => inShard(paths, {index: i + 1, count: n}))
    const union = shards.flat()
    expect(new Set(union).size).toBe(union.length)
    expect([...union].sort()).toEqual([...paths].sort())
    for (const s of shards) expect(s).toEqual(paths.filter((p) => s.includes(p)))
  })

  it('puts a note in the same shard whatever else the batch holds, and spreads notes over all shards', () => {
    const alone = paths.map((p) => inShard([p], {index: shardOf(p, 8), count: 8}))
    expect(alone.every((s, i) => s[0] === paths[i])).toBe(true)
    const sizes = Array.from({length: 8}, (_v, i) => inShard(paths, {index: i + 1, count: 8}).length)
    // 300 notes over 8 shards: each gets some (a hash that sent all to one shard would fail).
    expect(Math.min(...sizes)).toBeGreaterThan(10)
  })
})

describe('merge', () => {
  it('refuses a note that is in two results', () => {
    const run = {files: [{file: 'a.md', sourceSha256: '', diagnostics: [], stages: []}]}
    expect(() => mergeRuns([{name: 'x.json', run}, {name: 'y.json', run}])).toThrow(MergeError)
  })

  it('of the shards of a batch equals the unsharded --json result, exit code included', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ampreview-shard-'))
    const notes = join(dir, 'notes')
    const copies: [string, string][] = [
      ...readdirSync(join(ROOT, 'sample-designs')).filter((f) => f.endsWith('.md')).map((f): [string, string] => [join(ROOT, 'sample-designs', f), f]),
      ...readdirSync(join(ROOT, 'test/fixtures/topologies')).map((f): [string, string] => [join(ROOT, 'test/fixtures/topologies', f), `topology-${f}`])
    ]
    runCli(['new', join(notes, 'scaffolded.md')])
    for (const [from, to] of copies) copyFileSync(from, join(notes, to))
    // A note that cannot be evaluated: the merged exit code must still be 2.
    writeFileSync(join(notes, 'broken.md'), '```stage broken\ntopology: sideways\n```\n')
    const whole = runCli(['check', 'notes', '--json'], {cwd: dir})
    expect(whole.status).toBe(2)
    const all = (JSON.parse(whole.stdout) as {files: {file: string}[]}).files.map((f) => f.file)
    expect(all.length).toBe(copies.length + 2)

    const parts: string[] = []
    const listed: string[] = []
    for (let i = 1; i <= 3; i++) {
      const r = runCli(['check', 'notes', '--json', '--shard', `${i}/3`], {cwd: dir})
      expect([0, 1, 2]).toContain(r.status)
      listed.push(...(JSON.parse(r.stdout) as {files: {file: string}[]}).files.map((f) => f.file))
      const part = join(dir, `shard-${i}.json`)
      writeFileSync(part, r.stdout)
      parts.push(part)
    }
    expect([...listed].sort()).toEqual([...all].sort())
    expect(new Set(listed).size).toBe(listed.length)

    const merged = runCli(['merge', ...parts], {cwd: dir})
    expect(merged.stderr).toBe('')
    expect(merged.stdout).toBe(whole.stdout)
    expect(merged.status).toBe(whole.status)
  })

  it('exits 2 with a reason on a file that is not a result', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ampreview-shard-'))
    writeFileSync(join(dir, 'bad.json'), '{"files": [{"file": "a.md"}]}')
    const r = runCli(['merge', 'bad.json'], {cwd: dir})
    expect(r.status).toBe(2)
    expect(r.stderr).toMatch(/bad\.json is not an ampreview result/)
  })
})
