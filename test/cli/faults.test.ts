/**
 * Faults around a build: an output folder that cannot be written, a multi-file write that
 * fails half-way, a missing template. Each gives a clear message and exit 2, and leaves no
 * partial or temporary file behind. (Root ignores permission bits, so an unwritable folder
 * is made here as a path below a regular file, which no user can create a folder in.)
 */
import {describe, expect, it} from 'vitest'
import {mkdirSync, readdirSync, readFileSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {writeAllAtomic} from '../../src/cli/write.js'
import {runCli, tempNotes} from './helpers.js'
import {goodNote} from './workflow-helpers.js'

const NOTE = goodNote({title: 'Faults'})

describe('build faults', () => {
  it('reports an output folder that cannot be created, exits 2, and writes nothing', () => {
    const dir = tempNotes({'n.md': NOTE, 'blocker': 'a regular file'})
    const r = runCli(['build', join(dir, 'n.md'), '--out', join(dir, 'blocker', 'out'), '--format', 'pdf,json'])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('error: Cannot write the outputs of this note')
    expect(r.stderr).not.toMatch(/\n\s+at /)
    expect(readdirSync(dir).sort()).toEqual(['blocker', 'n.md'])
  })

  it('names a missing template and builds nothing', () => {
    const dir = tempNotes({'n.md': NOTE.replace('title: Faults', 'title: Faults\ntemplate: no-such-template')})
    const r = runCli(['build', join(dir, 'n.md')])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('error: Template `no-such-template` is missing theme.json')
    expect(readdirSync(dir)).toEqual(['n.md'])
  })

  it('keeps the cache file valid JSON after a failed build next to a good one', () => {
    const dir = tempNotes({'n.md': NOTE})
    expect(runCli(['build', join(dir, 'n.md')]).status).toBe(0)
    writeFileSync(join(dir, 'n.md'), goodNote({title: 'Faults', rf: '9.09 mV'}))
    expect(runCli(['build', join(dir, 'n.md')]).status).toBe(2)
    // The failed note's entry stays, with no key (never up to date), to record which files are ours.
    const cache = JSON.parse(readFileSync(join(dir, '.ampreview-cache.json'), 'utf8')) as {entries: Record<string, {key: string; owned: string[]}>}
    expect(Object.values(cache.entries).map((e) => e.key)).toEqual([''])
    expect(Object.values(cache.entries)[0]!.owned).toEqual([join(dir, 'n.pdf')])
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([])
  })
})

describe('writeAllAtomic()', () => {
  it('replaces nothing when the second of two writes fails, and leaves no temporary file', async () => {
    const dir = tempNotes({'a.pdf': 'old A', 'blocker': 'a regular file'})
    await expect(writeAllAtomic([[join(dir, 'a.pdf'), 'new A'], [join(dir, 'blocker', 'b.json'), 'new B']])).rejects.toThrow()
    expect(readFileSync(join(dir, 'a.pdf'), 'utf8')).toBe('old A')
    expect(readdirSync(dir).sort()).toEqual(['a.pdf', 'blocker'])
  })

  it('writes every file when all can be written (control)', async () => {
    const dir = tempNotes({})
    mkdirSync(join(dir, 'sub'))
    await writeAllAtomic([[join(dir, 'a.txt'), 'A'], [join(dir, 'sub', 'b.txt'), 'B']])
    expect(readFileSync(join(dir, 'a.txt'), 'utf8')).toBe('A')
    expect(readFileSync(join(dir, 'sub', 'b.txt'), 'utf8')).toBe('B')
  })
})
