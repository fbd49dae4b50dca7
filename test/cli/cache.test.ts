import {beforeAll, describe, expect, it} from 'vitest'
import {existsSync, readFileSync, rmSync, statSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {unified} from 'unified'
import remarkParse from 'remark-parse'
import {VFile} from 'vfile'
import {buildKey, CACHE_FILE, type KeyParts} from '../../src/cli/cache.js'
import {imagesUnchanged, readImages} from '../../src/cli/images.js'
import {runCli, tempNotes} from './helpers.js'
import {goodNote, png, tmpFiles} from './workflow-helpers.js'

const PARTS: KeyParts = {
  source: new TextEncoder().encode(goodNote()), template: 'a'.repeat(64), version: '0.1.0',
  options: JSON.stringify({formats: ['pdf'], strict: false, epoch: null, file: 'n.md'})
}

describe('buildKey()', () => {
  it('gives the same key for the same parts', () => {
    expect(buildKey({...PARTS, source: new TextEncoder().encode(goodNote())})).toBe(buildKey(PARTS))
  })

  it.each<[string, Partial<KeyParts>]>([
    ['the note source', {source: new TextEncoder().encode(goodNote({rf: '10k'}))}],
    ['the template folder hash', {template: 'b'.repeat(64)}],
    ['the tool version', {version: '0.1.1'}],
    ['the options (another --format)', {options: JSON.stringify({formats: ['pdf', 'json'], strict: false, epoch: null, file: 'n.md'})}]
  ])('changes when %s changes', (_name, change) => {
    expect(buildKey({...PARTS, ...change})).not.toBe(buildKey(PARTS))
  })

  it('does not confuse text moved from one part to the next', () => {
    expect(buildKey({...PARTS, version: '0.1', options: `0${PARTS.options}`}))
      .not.toBe(buildKey({...PARTS, version: '0.10', options: PARTS.options}))
  })
})

describe('the images a cache entry records', () => {
  const recorded = async (md: string, dir: string) =>
    (await readImages(unified().use(remarkParse).parse(md), join(dir, 'n.md'), new VFile())).inputs

  it('are read from the parsed tree, and a replaced image no longer matches', async () => {
    const dir = tempNotes({'fig.png': png(4, 4, 10)})
    const inputs = await recorded('# N\n\n![A board, [top] side](fig.png)\n', dir)
    expect(inputs.map((i) => i.url)).toEqual(['fig.png'])
    expect(await imagesUnchanged(join(dir, 'n.md'), inputs)).toBe(true)
    writeFileSync(join(dir, 'fig.png'), png(4, 4, 200))
    expect(await imagesUnchanged(join(dir, 'n.md'), inputs)).toBe(false)
    expect(await recorded('# No images\n', dir)).toEqual([])
  })

  it('follow reference-style images', async () => {
    const dir = tempNotes({'fig.png': png(4, 4, 10)})
    const inputs = await recorded('# N\n\n![Board][b]\n\n[b]: <fig.png>\n', dir)
    expect(inputs.map((i) => i.url)).toEqual(['fig.png'])
    writeFileSync(join(dir, 'fig.png'), png(4, 4, 90))
    expect(await imagesUnchanged(join(dir, 'n.md'), inputs)).toBe(false)
  })
})

const progressOf = (stderr: string): string[] => stderr.split('\n').filter((l) => /^\[\d+\/\d+\] /.test(l))

describe('build cache', () => {
  it('leaves an unchanged note up to date: no rebuild, the PDF untouched', () => {
    const dir = tempNotes({'n.md': goodNote()})
    expect(runCli(['build', join(dir, 'n.md')]).status).toBe(0)
    const mtime = statSync(join(dir, 'n.pdf')).mtimeMs
    const r = runCli(['build', join(dir, 'n.md')])
    expect(r.status).toBe(0)
    expect(progressOf(r.stderr)).toEqual([expect.stringContaining(`[1/1] up to date: ${join(dir, 'n.md')} (`)])
    expect(r.stdout).toContain('up to date')
    expect(statSync(join(dir, 'n.pdf')).mtimeMs).toBe(mtime)
  })

  describe('rebuilds a note when', () => {
    // One batch builds a note for each case; each case then changes its own note or options.
    const CASES: [string, (dir: string, note: string) => string[]][] = [
      ['its source changed', (dir, note) => { writeFileSync(join(dir, note), goodNote({rf: '4.99k'})); return [] }],
      ['--force is given', () => ['--force']],
      ['another --format is asked for', () => ['--format', 'json,md']],
      ['an output was deleted', (dir, note) => { rmSync(join(dir, 'out', note.replace('.md', '.json'))); return [] }],
      ['--strict is given', () => ['--strict']]
    ]
    let dir = ''
    beforeAll(() => {
      dir = tempNotes(Object.fromEntries(CASES.map((_c, i) => [`r${i}.md`, goodNote()])))
      expect(runCli(['build', dir, '--format', 'json', '--out', join(dir, 'out')]).status).toBe(0)
    })

    it.each(CASES.map(([name, change], i) => [name, change, `r${i}.md`] as const))('%s', (_name, change, note) => {
      const extra = change(dir, note)
      const r = runCli(['build', join(dir, note), '--out', join(dir, 'out'), ...(extra.includes('--format') ? extra : ['--format', 'json', ...extra])])
      expect(r.status).toBe(0)
      expect(progressOf(r.stderr)).toEqual([expect.stringMatching(/^\[1\/1\] ok: /)])
    })

    it('none of that holds (control: the same run again is up to date)', () => {
      const r = runCli(['build', join(dir, 'r1.md'), '--out', join(dir, 'out'), '--format', 'json'])
      expect(progressOf(r.stderr)).toEqual([expect.stringMatching(/^\[1\/1\] up to date: /)])
    })
  })

  it('rebuilds the PDF when an image the note embeds is replaced', () => {
    const dir = tempNotes({'n.md': `${goodNote()}\n![Board photo](board.png)\n`, 'board.png': png(8, 8, 40)})
    expect(runCli(['build', join(dir, 'n.md')]).status).toBe(0)
    writeFileSync(join(dir, 'board.png'), png(8, 8, 220))
    const r = runCli(['build', join(dir, 'n.md')])
    expect(progressOf(r.stderr)).toEqual([expect.stringMatching(/^\[1\/1\] ok: /)])
  })

  it('does not cache a note that could not be evaluated', () => {
    const dir = tempNotes({'n.md': '# Only prose\n\n```stage x\ntopology: sideways\n```\n'})
    expect(runCli(['build', join(dir, 'n.md'), '--format', 'json']).status).toBe(2)
    const r = runCli(['build', join(dir, 'n.md'), '--format', 'json'])
    expect(r.status).toBe(2)
    expect(progressOf(r.stderr)).toEqual([expect.stringMatching(/^\[1\/1\] error: /)])
  })

  it.each([
    ['text that is not JSON', '{"version": 1, "entries": {'],
    ['entries of the wrong shape', JSON.stringify({version: 1, entries: {x: 5, y: {key: 1, outputs: 'n.json'}}})],
    ['a file of another version', JSON.stringify({version: 99, entries: {}})]
  ])('builds past a corrupt cache file (%s) and replaces it', (_name, corrupt) => {
    const dir = tempNotes({'n.md': goodNote(), [CACHE_FILE]: corrupt})
    const r = runCli(['build', join(dir, 'n.md'), '--format', 'json'])
    expect(r.status).toBe(0)
    expect(existsSync(join(dir, 'n.json'))).toBe(true)
    const cache = JSON.parse(readFileSync(join(dir, CACHE_FILE), 'utf8')) as {version: number; entries: Record<string, {outputs: {path: string}[]}>}
    expect(cache.version).toBe(2)
    expect(cache.entries[join(dir, 'n.md')]!.outputs.map((o) => o.path)).toEqual([join(dir, 'n.json')])
    expect(tmpFiles(dir)).toEqual([])
  })
})
