/**
 * The commands that run on: `build --watch`, and a batch interrupted with Ctrl-C (SIGINT).
 * Every wait reads the child's output until a line appears, bounded, never a fixed sleep.
 */
import {afterAll, beforeAll, describe, expect, it} from 'vitest'
import {existsSync, readdirSync, readFileSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {CACHE_FILE} from '../../src/cli/cache.js'
import {tempNotes} from './helpers.js'
import {BAD_NOTE, CliChild, goodNote, tmpFiles} from './workflow-helpers.js'

describe('build --watch', () => {
  let dir = ''
  let child: CliChild
  const verdicts = (): string[] => child.linesOut(/^\S*n\.md: /)
  beforeAll(async () => {
    dir = tempNotes({'n.md': goodNote()})
    child = new CliChild(['build', '--watch', join(dir, 'n.md')])
    await child.until((c) => c.stderr.includes('watching 1 note(s)'), 'the first build and the watch to start')
  })
  afterAll(() => child.kill())

  it('builds the note once at the start and prints its verdicts', () => {
    expect(verdicts()).toEqual([expect.stringMatching(new RegExp(`^${join(dir, 'n.md')}: 3 met, 0 not met \\(\\d+\\.\\d\\d s\\) → ${join(dir, 'n.pdf')}$`))])
    expect(readFileSync(join(dir, 'n.pdf')).subarray(0, 5).toString()).toBe('%PDF-')
  })

  it('rebuilds the PDF when the note is saved', async () => {
    const before = readFileSync(join(dir, 'n.pdf'))
    writeFileSync(join(dir, 'n.md'), goodNote({rf: '19.1k', title: 'Saved again'}))
    await child.until(() => verdicts().length >= 2, 'the rebuild line')
    expect(verdicts()[1]).toMatch(/: 3 met, 0 not met .* → .*n\.pdf$/)
    expect(readFileSync(join(dir, 'n.pdf')).equals(before)).toBe(false)
  })

  it('keeps the last good PDF when a save breaks the note, and says so', async () => {
    const before = readFileSync(join(dir, 'n.pdf'))
    const seen = verdicts().length
    writeFileSync(join(dir, 'n.md'), BAD_NOTE)
    // Waits for the error line itself: a late event of the previous save may add a line first.
    await child.until(() => verdicts().slice(seen).some((l) => /: error, no output written /.test(l)), 'the line for the broken save')
    expect(child.stderr).toMatch(/n\.md:8:1: error: /)
    expect(readFileSync(join(dir, 'n.pdf')).equals(before)).toBe(true)
  })

  it('stops on SIGINT with exit code 0', async () => {
    child.kill('SIGINT')
    expect(await child.exited).toEqual({code: 0, signal: null})
  })
})

describe('SIGINT during a batch', () => {
  const NOTES = 6
  let dir = ''
  let result: {code: number | null; signal: NodeJS.Signals | null}
  let child: CliChild
  beforeAll(async () => {
    dir = tempNotes(Object.fromEntries(Array.from({length: NOTES}, (_v, i) => [`n${i}.md`, goodNote({rf: `${9 + i}.09k`})])))
    child = new CliChild(['build', dir, '--jobs', '2', '--out', join(dir, 'out')])
    await child.until((c) => /^\[1\/6\] /m.test(c.stderr), 'the first progress line')
    child.kill('SIGINT')
    result = await child.exited
  })
  afterAll(() => child.kill('SIGKILL'))

  it('exits with 130 after finishing the notes under way', () => {
    expect(result).toEqual({code: 130, signal: null})
    expect(child.stderr).toContain('interrupted')
  })

  it('starts no new note after the interrupt', () => {
    const pdfs = readdirSync(join(dir, 'out')).filter((f) => f.endsWith('.pdf'))
    expect(pdfs.length).toBeGreaterThanOrEqual(1)
    expect(pdfs.length).toBeLessThan(NOTES)
    expect(child.stderr).toMatch(/error: not processed: the batch was interrupted/)
  })

  it('leaves no temporary file behind', () => {
    expect(tmpFiles(dir)).toEqual([])
  })

  it('leaves a cache file that parses and lists only outputs that exist', () => {
    const cache = JSON.parse(readFileSync(join(dir, 'out', CACHE_FILE), 'utf8')) as {entries: Record<string, {outputs: {path: string}[]}>}
    const outputs = Object.values(cache.entries).flatMap((e) => e.outputs.map((o) => o.path))
    expect(outputs.length).toBeGreaterThanOrEqual(1)
    for (const o of outputs) expect(existsSync(o), o).toBe(true)
  })
})
