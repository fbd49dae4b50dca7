/**
 * Notes are untrusted input in CI: each case below is a hostile note or file, built here,
 * run through the compiled command. Bounds on time are bounds on a hang (the inputs ran for
 * minutes or until memory was gone), never speed checks; speed is measured in the bench.
 */
import {execFileSync} from 'node:child_process'
import {createHash} from 'node:crypto'
import {existsSync, mkdirSync, readFileSync, readdirSync, rmSync, statSync, symlinkSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {tempNotes} from '../cli/helpers.js'
import {CliChild, goodNote, png, tmpFiles, unmetNote} from '../cli/workflow-helpers.js'
import {CACHE_FILE} from '../../src/cli/cache.js'
import {deflateSync} from 'node:zlib'
import {filesUnder, jpegClaiming, noStackTrace, pngClaiming, runBounded} from './hostile-helpers.js'

const sha = (b: Uint8Array): string => createHash('sha256').update(b).digest('hex')
const withProse = (prose: string): string => `${goodNote()}\n${prose}\n`
/** A note without stages: no charts to draw, so the builds of the rendering cases stay quick. */
const proseOnly = (prose: string): string => `# Hostile input\n\nInvented text for a test.\n\n${prose}\n`

describe('1. the cache is never trusted for a verdict', () => {
  it('rebuilds when an edited cache claims a pass, points outside the folder and the output is gone (JSON builds: the cache is the same for every format)', async () => {
    const dir = tempNotes({'n.md': unmetNote()})
    const elsewhere = tempNotes({'system.txt': 'a file outside the project\n'})
    const outside = join(elsewhere, 'system.txt')
    const first = await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})
    expect(first.status).toBe(1)
    const cacheFile = join(dir, CACHE_FILE)
    const cache = JSON.parse(readFileSync(cacheFile, 'utf8')) as {entries: Record<string, Record<string, unknown>>}
    const record = {path: outside, size: statSync(outside).size, sha256: sha(readFileSync(outside))}
    for (const e of Object.values(cache.entries)) Object.assign(e, {exitCode: 0, notMet: 0, met: 1, outputs: [record], owned: [outside]})
    writeFileSync(cacheFile, JSON.stringify(cache))
    rmSync(join(dir, 'n.json'))
    const r = await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})
    expect(r.stdout).not.toContain('up to date')
    expect(r.stdout).not.toContain(outside)
    expect(r.status).toBe(1)
    expect(existsSync(join(dir, 'n.json'))).toBe(true)
    expect(readFileSync(outside, 'utf8')).toBe('a file outside the project\n')
  })

  it('takes the verdict from the hashed JSON result, not from fields anyone can edit', async () => {
    const dir = tempNotes({'n.md': unmetNote()})
    expect((await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})).status).toBe(1)
    const cacheFile = join(dir, CACHE_FILE)
    // Fields claiming a pass, added to an entry that is otherwise intact: the note stays up to
    // date, and its verdict is the evaluation's.
    const cache = JSON.parse(readFileSync(cacheFile, 'utf8')) as {entries: Record<string, Record<string, unknown>>}
    for (const e of Object.values(cache.entries)) Object.assign(e, {exitCode: 0, notMet: 0, met: 1, verdict: 'met'})
    writeFileSync(cacheFile, JSON.stringify(cache))
    const r = await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})
    expect(r.stdout).toContain('up to date')
    expect(r.status).toBe(1)
    expect(r.stdout).toMatch(/NOT MET/)
    // And a recorded result that is not what the note evaluates to: rebuilt.
    for (const e of Object.values(cache.entries)) e['result'] = '0'.repeat(64)
    writeFileSync(cacheFile, JSON.stringify(cache))
    const again = await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})
    expect(again.stdout).not.toContain('up to date')
    expect(again.status).toBe(1)
  })

  it('rebuilds when a recorded output was replaced by other bytes', async () => {
    const dir = tempNotes({'n.md': goodNote()})
    expect((await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})).status).toBe(0)
    writeFileSync(join(dir, 'n.json'), 'not the result')
    const r = await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})
    expect(r.stdout).not.toContain('up to date')
    expect(readFileSync(join(dir, 'n.json'), 'utf8')).toMatch(/^\{/)
  })
})

describe('2. every image read is contained and bounded, the cache key included', () => {
  it('does not read an image that is a symlink to the endless zero device', async () => {
    const dir = tempNotes({'n.md': proseOnly('![z](fig.png)')})
    symlinkSync('/dev/zero', join(dir, 'fig.png'))
    const r = await runBounded(['build', 'n.md'], {cwd: dir, limitMs: 40_000})
    expect(r.hung).toBe(false)
    expect(r.status).toBe(0)
    expect(r.stderr).toMatch(/n\.md:\d+:\d+: warning: Image `fig\.png` not included: it is not a regular file/)
    expect(noStackTrace(r.stderr)).toBe(true)
  })

  it('does not read the standard input through a relative path', async () => {
    const ups = '../'.repeat(30)
    const dir = tempNotes({'n.md': proseOnly(`![s](${ups}dev/stdin)`)})
    const r = await runBounded(['build', 'n.md'], {cwd: dir, limitMs: 40_000})
    expect(r.hung).toBe(false)
    expect(r.status).toBe(0)
    expect(r.stderr).toMatch(/warning: Image `.*dev\/stdin` not included: it lies outside the note’s folder/)
  })

  it('refuses an image over the size cap with a positioned warning', async () => {
    const big = Buffer.alloc(21 * 2 ** 20)
    Buffer.from(png(2, 2, 10)).copy(big)
    const dir = tempNotes({'n.md': proseOnly('![b](big.png)'), 'big.png': big})
    const r = await runBounded(['build', 'n.md'], {cwd: dir})
    expect(r.status).toBe(0)
    expect(r.stderr).toMatch(/n\.md:\d+:\d+: warning: Image `big\.png` not included: it is 21\.0 MiB, larger than the 20 MiB an image may be/)
  })

  it('rebuilds when any image is changed, however its name is written (escapes, references, parentheses, nested alt brackets)', async () => {
    const refs = [['![a](img\\_1.png)', 'img_1.png'], ['![a](img&#46;png)', 'img.png'], ['![a](x(1).png)', 'x(1).png'], ['![a [b [c]] d](deep.png)', 'deep.png']]
    const dir = tempNotes({'n.md': proseOnly(refs.map(([ref]) => ref).join('\n\n')), ...Object.fromEntries(refs.map(([, name]) => [name, png(3, 3, 20)]))})
    const first = await runBounded(['build', 'n.md'], {cwd: dir})
    expect(first.status).toBe(0)
    expect(first.stderr).not.toMatch(/warning/)
    for (const [i, [, name]] of refs.entries()) {
      writeFileSync(join(dir, name!), png(3, 3, 100 + i))
      const r = await runBounded(['build', 'n.md'], {cwd: dir})
      expect(r.status).toBe(0)
      expect(r.stdout, name).not.toContain('up to date')
    }
  })
})

describe('3. image headers are checked against the data before the PDF library sees them', () => {
  const bad: [string, Buffer, RegExp][] = [
    ['a 68-byte PNG claiming 50000 × 50000 RGBA', pngClaiming(50_000, 50_000, deflateSync(Buffer.alloc(1))), /more than the .* pixels an image may have/],
    ['an empty PNG file', Buffer.alloc(0), /only PNG and JPEG images are supported/],
    ['a PNG whose header claims more pixels than its data holds', pngClaiming(400, 400, deflateSync(Buffer.alloc(401 * 3))), /its data is shorter than its header says/],
    ['a PNG with an impossible bit depth', pngClaiming(4, 4, deflateSync(Buffer.alloc(80)), 2, 3), /bit depth 3 .* not valid/],
    ['a JPEG whose frame claims 0 × 0', jpegClaiming(0, 0), /JPEG/],
    ['a JPEG claiming 60000 × 60000 with no data', jpegClaiming(60_000, 60_000), /pixels an image may have|JPEG/]
  ]
  it('prints a positioned warning and a placeholder for each, never a crash, and builds the rest of the batch', async () => {
    const files: Record<string, string | Buffer> = {}
    bad.forEach(([, bytes], i) => { files[`img${i}.${i >= 4 ? 'jpg' : 'png'}`] = bytes })
    const prose = bad.map((_b, i) => `![bad ${i}](img${i}.${i >= 4 ? 'jpg' : 'png'})`).join('\n\n')
    const dir = tempNotes({...files, 'a.md': proseOnly(prose), 'b.md': goodNote()})
    const r = await runBounded(['build', 'a.md', 'b.md', '--jobs', '1'], {cwd: dir})
    expect(noStackTrace(r.stderr)).toBe(true)
    expect(r.stderr).not.toContain('internal error')
    expect(r.status).toBe(0)
    const lines = r.stderr.split('\n')
    bad.forEach(([, , why], i) => {
      const line = lines.find((l) => l.includes(`\`img${i}.`))
      expect(line, `warning for image ${i}`).toMatch(/^a\.md:\d+:1: warning: Image/)
      expect(line).toMatch(why)
    })
    expect(existsSync(join(dir, 'a.pdf')) && existsSync(join(dir, 'b.pdf'))).toBe(true)
  })
})

describe('4. text layout is linear in word length', () => {
  const word = (c: string, n: number): string => c.repeat(n)
  it.each([
    ['one 100,000-character word in prose', proseOnly(word('x', 100_000))],
    ['one 100,000-character word in a code fence', proseOnly(`\`\`\`\n${word('y', 100_000)}\n\`\`\``)],
    ['one 100,000-character word in a table cell', proseOnly(`| a | b |\n| - | - |\n| ${word('z', 100_000)} | b |`)],
    ['600 KB of ordinary words in one table cell', proseOnly(`| a | b |\n| - | - |\n| ${'word '.repeat(120_000)} | b |`)]
  ])('builds %s', async (_what, note) => {
    const dir = tempNotes({'n.md': note})
    const r = await runBounded(['build', 'n.md'], {cwd: dir, limitMs: 120_000})
    expect(r.hung).toBe(false)
    expect(noStackTrace(r.stderr)).toBe(true)
    expect(r.status).toBe(0)
    expect(statSync(join(dir, 'n.pdf')).size).toBeGreaterThan(1000)
  })
})

describe('5. parser bombs are refused before the Markdown parser runs', () => {
  it.each([
    ['40,000 nested `[`', `${'['.repeat(40_000)}x${']'.repeat(40_000)}`, 8],
    ['100,000 `>`', `${'>'.repeat(100_000)} x`, 8],
    ['a 1,000-level list', Array.from({length: 1000}, (_, i) => `${'  '.repeat(i)}- item ${i}`).join('\n'), 8 + 64]
  ])('refuses %s with the positioned "nested too deep" error', async (_what, bomb, line) => {
    const dir = tempNotes({'n.md': `# Bomb\n\nSome prose.\n\n${'\n'.repeat(3)}${bomb}\n`})
    const r = await runBounded(['check', 'n.md'], {cwd: dir, limitMs: 30_000})
    expect(r.hung).toBe(false)
    expect(r.status).toBe(2)
    expect(r.stderr).toMatch(new RegExp(`^n\\.md:${line}:\\d+: error: Unexpected nesting .* more than 64 levels deep`, 'm'))
    expect(noStackTrace(r.stderr)).toBe(true)
  })

  it('still reads legitimate brackets, quotes and lists', async () => {
    const prose = '> quoted [link [with] brackets](https://example.org) and\n> > a nested quote\n\n- a\n  - b\n    - c\n'
    const dir = tempNotes({'n.md': withProse(prose)})
    expect((await runBounded(['check', 'n.md'], {cwd: dir})).status).toBe(0)
  })
})

describe('6. compare REV:PATH never passes an option to git', () => {
  const repo = (): string => {
    const dir = tempNotes({})
    mkdirSync(join(dir, 'designs'))
    writeFileSync(join(dir, 'designs', 'a.md'), goodNote())
    const git = (...args: string[]): void => { execFileSync('git', args, {cwd: dir, stdio: 'ignore'}) }
    git('init', '-q')
    git('-c', 'user.name=T', '-c', 'user.email=t@example.invalid', 'add', '.')
    git('-c', 'user.name=T', '-c', 'user.email=t@example.invalid', 'commit', '-q', '-m', 'one')
    return dir
  }

  it('refuses a REV that starts with `-` and writes nothing', async () => {
    const dir = repo()
    const before = filesUnder(dir)
    const r = await runBounded(['compare', '--', '--output=x:designs/a.md', 'designs/a.md'], {cwd: dir})
    expect(r.status).toBe(2)
    expect(r.stderr).toMatch(/revision `--output=x` .*starts with `-`/)
    expect(filesUnder(dir)).toEqual(before)
  })

  it('refuses a REV that is not a commit, and still compares a real one', async () => {
    const dir = repo()
    const r = await runBounded(['compare', 'no-such-rev:designs/a.md', 'designs/a.md'], {cwd: dir})
    expect(r.status).toBe(2)
    expect(r.stderr).toMatch(/no-such-rev.* is not a commit/)
    const ok = await runBounded(['compare', 'HEAD:designs/a.md', 'designs/a.md'], {cwd: dir})
    expect(ok.status).toBe(0)
  })
})

describe('7. outputs never overwrite files that are not ours', () => {
  it('refuses to replace a hand-written `design.review.md`', async () => {
    const dir = tempNotes({'design.review.md': 'hand-written\n'})
    mkdirSync(join(dir, 'sub'))
    writeFileSync(join(dir, 'sub', 'design.md'), goodNote())
    const r = await runBounded(['build', 'sub/design.md', '--out', '.', '--format', 'md'], {cwd: dir})
    expect(r.status).toBe(2)
    expect(r.stderr).toMatch(/design\.review\.md.* was not written by ampreview/)
    expect(readFileSync(join(dir, 'design.review.md'), 'utf8')).toBe('hand-written\n')
  })

  it('refuses a note whose output would be the cache file', async () => {
    const dir = tempNotes({'.ampreview-cache.md': goodNote()})
    const r = await runBounded(['build', '.ampreview-cache.md', '--format', 'json'], {cwd: dir})
    expect(r.status).toBe(2)
    expect(r.stderr).toMatch(/\.ampreview-cache\.json/)
  })

  it('does not report another note’s outputs as up to date (same base name, separate runs, one --out)', async () => {
    const dir = tempNotes({})
    for (const d of ['a', 'b']) { mkdirSync(join(dir, d)); writeFileSync(join(dir, d, 'design.md'), goodNote({title: `Note ${d}`})) }
    const build = (note: string) => runBounded(['build', note, '--out', 'out', '--format', 'json'], {cwd: dir})
    expect((await build('a/design.md')).status).toBe(0)
    const outA = readFileSync(join(dir, 'out', 'design.json'))
    const b = await build('b/design.md')
    expect(b.status).toBe(2)
    expect(b.stderr).toMatch(/out\/design\.json is the output of .*\/a\/design\.md/)
    expect(readFileSync(join(dir, 'out', 'design.json')).equals(outA)).toBe(true)
    const again = await build('a/design.md')
    expect(again.status).toBe(0)
    expect(again.stdout).toContain('up to date')
  })
})

describe('8. names and links', () => {
  it('escapes control characters in every printed path', async () => {
    const name = 'evil\n\u001b[31mred:1:1: error: forged.md'
    const dir = tempNotes({[name]: `# N\n\n${'['.repeat(70)}\n`})
    const r = await runBounded(['check', name], {cwd: dir})
    expect(r.status).toBe(2)
    expect(r.stderr + r.stdout).not.toContain('\u001b')
    expect(r.stderr.split('\n').filter((l) => l.startsWith('red:1:1'))).toEqual([])
    expect(r.stderr).toContain('evil\\n\\x1b[31mred')
  })

  it('prints `javascript:` and other non-web link targets as plain text in the PDF', async () => {
    const dir = tempNotes({'n.md': proseOnly('[click](javascript:alert(1)) [file](file:///etc/passwd) [ok](https://example.org/) [m](mailto:a@example.org)')})
    const r = await runBounded(['build', 'n.md'], {cwd: dir})
    expect(r.status).toBe(0)
    const pdf = readFileSync(join(dir, 'n.pdf')).toString('latin1')
    expect(pdf).not.toMatch(/javascript/i)
    expect(pdf).not.toContain('file:///etc')
    expect(pdf).toContain('https://example.org/')
    expect(pdf).toContain('mailto:a@example.org')
  })

  it('escapes raw HTML of the prose in the Markdown report', async () => {
    const dir = tempNotes({'n.md': proseOnly('Text <script>alert(1)</script> and\n\n<img src=x onerror=alert(1)>\n')})
    const r = await runBounded(['build', 'n.md', '--format', 'md'], {cwd: dir})
    expect(r.status).toBe(0)
    const md = readFileSync(join(dir, 'n.review.md'), 'utf8')
    // Escaped as CommonMark escapes it (`\<`): text when rendered, never a tag.
    expect(md).not.toMatch(/(^|[^\\])<(script|img|\/script)/m)
    expect(md).toContain('\\<script>')
    expect(md).toContain('alert(1)')
  })
})

describe('9. interrupted and cancelled runs', () => {
  it('handles SIGTERM like SIGINT: finishes the note under way, starts no more, leaves no partial file', async () => {
    const notes = Object.fromEntries(Array.from({length: 6}, (_, i) => [`n${i}.md`, goodNote({id: `amp-${i}`})]))
    const dir = tempNotes(notes)
    const run = new CliChild(['build', '.', '--jobs', '1'], {cwd: dir})
    await run.until((c) => /\[1\/6\]/.test(c.stderr), 'the first note done')
    run.kill('SIGTERM')
    const {code, signal} = await run.exited
    expect(signal).toBeNull()
    expect(code).toBe(130)
    expect(run.stderr).toMatch(/interrupted/)
    expect(tmpFiles(dir)).toEqual([])
    const pdfs = readdirSync(dir).filter((f) => f.endsWith('.pdf'))
    expect(pdfs.length).toBeLessThan(6)
    for (const p of pdfs) expect(readFileSync(join(dir, p)).subarray(-6).toString()).toMatch(/%%EOF/)
  })

  it('removes leftover temporary files of a killed run in its folder, and no others', async () => {
    const dir = tempNotes({'n.md': goodNote(), '.n.pdf.999999999.0badf00d.tmp': 'partial', 'keep.tmp': 'not ours'})
    const r = await runBounded(['build', 'n.md', '--format', 'json'], {cwd: dir})
    expect(r.status).toBe(0)
    expect(existsSync(join(dir, '.n.pdf.999999999.0badf00d.tmp'))).toBe(false)
    expect(existsSync(join(dir, 'keep.tmp'))).toBe(true)
  })

  it('is only up to date when every output of the set is from the same build', async () => {
    const dir = tempNotes({'n.md': proseOnly('First version.')})
    expect((await runBounded(['build', 'n.md', '--format', 'pdf,json'], {cwd: dir})).status).toBe(0)
    const oldJson = readFileSync(join(dir, 'n.json'))
    writeFileSync(join(dir, 'n.md'), proseOnly('Second version.'))
    expect((await runBounded(['build', 'n.md', '--format', 'pdf,json'], {cwd: dir})).status).toBe(0)
    // Put the old build's JSON back beside the new PDF.
    writeFileSync(join(dir, 'n.json'), oldJson)
    const r = await runBounded(['build', 'n.md', '--format', 'pdf,json'], {cwd: dir})
    expect(r.stdout).not.toContain('up to date')
    expect(sha(readFileSync(join(dir, 'n.json')))).not.toBe(sha(oldJson))
  })
})

describe('10. extreme but finite values', () => {
  const stage = (lines: Record<string, string>): string => {
    const body = {topology: 'noninverting', opamp: 'precision-bipolar', rf: '10k', rg: '1k', input: '-0.1 .. 0.1 V', supply: '±12 V', ...lines}
    return `# Extreme\n\n\`\`\`stage x\n${Object.entries(body).map(([k, v]) => `${k}: ${v}`).join('\n')}\n\`\`\`\n`
  }

  it('builds a stage that check accepts: rg 1e-24 with rf 1e18', async () => {
    const dir = tempNotes({'n.md': stage({rf: '1e18', rg: '1e-24'})})
    const check = await runBounded(['check', 'n.md'], {cwd: dir})
    expect(check.status).not.toBe(2)
    const r = await runBounded(['build', 'n.md', '--format', 'pdf,md'], {cwd: dir})
    expect(noStackTrace(r.stderr)).toBe(true)
    expect(r.status).toBe(check.status)
    expect(existsSync(join(dir, 'n.pdf'))).toBe(true)
    const md = readFileSync(join(dir, 'n.review.md'), 'utf8')
    // Out-of-range magnitudes print in plain scientific form with the SI unit, never `1.01e+28 TV`.
    expect(md).not.toMatch(/\de[+-]?\d+\s*[fpnµmkMGT]/)
    expect(md).not.toMatch(/\de[+-]?\d+ %/)
  })

  it.each([
    ['tempco above 10,000 ppm/K', {rf: '10k 0.1% 20000ppm/K'}, 'rf', /tempco/i],
    ['a supply above 1 kV', {supply: '±2k V'}, 'supply', /supply/i]
  ])('warns at the key for %s', async (_what, lines, key, re) => {
    const note = stage(lines)
    const line = note.split('\n').findIndex((l) => l.startsWith(`${key}:`)) + 1
    const dir = tempNotes({'n.md': note})
    const r = await runBounded(['check', 'n.md'], {cwd: dir})
    expect(r.status).not.toBe(2)
    const w = r.stderr.split('\n').find((l) => l.startsWith(`n.md:${line}:`) && l.includes('warning') && re.test(l))
    expect(w, r.stderr).toBeDefined()
  })
})

