import {beforeAll, describe, expect, it} from 'vitest'
import {spawnSync} from 'node:child_process'
import {existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {CLI, runCli, tempNotes} from './helpers.js'
import {BAD_NOTE, goodNote, unmetNote} from './workflow-helpers.js'

const progressLines = (stderr: string): string[] => stderr.split('\n').filter((l) => /^\[\d+\/\d+\] /.test(l))
const ESC = '\u001b'

describe('build --format md,json', () => {
  let dir = ''
  beforeAll(() => {
    dir = tempNotes({'n.md': goodNote().replace('date: 2026-11-30', 'date: 2026-11-30\nreviewers:\n  - A. Example (Analog reviewer)')})
    for (const out of ['a', 'b']) expect(runCli(['build', join(dir, 'n.md'), '--format', 'md,json', '--out', join(dir, out)]).status).toBe(0)
  })

  it.each(['n.review.md', 'n.json'])('writes %s byte for byte the same in two builds', (name) => {
    const a = readFileSync(join(dir, 'a', name))
    expect(a.length).toBeGreaterThan(500)
    expect(a.equals(readFileSync(join(dir, 'b', name)))).toBe(true)
  })

  it('writes the same SVG figures in two builds', () => {
    const svgs = readdirSync(join(dir, 'a')).filter((f) => f.endsWith('.svg')).sort()
    expect(svgs.length).toBeGreaterThan(0)
    expect(readdirSync(join(dir, 'b')).filter((f) => f.endsWith('.svg')).sort()).toEqual(svgs)
    for (const f of svgs) expect(readFileSync(join(dir, 'a', f)).equals(readFileSync(join(dir, 'b', f))), f).toBe(true)
  })

  it('references only SVG files that exist beside the Markdown, and all of them', () => {
    const md = readFileSync(join(dir, 'a', 'n.review.md'), 'utf8')
    const refs = [...md.matchAll(/!\[[^\]]*\]\(<?([^)>]+)>?\)/g)].map((m) => m[1]!)
    expect(refs.length).toBeGreaterThan(0)
    for (const r of refs) {
      expect(r).toMatch(/\.svg$/)
      expect(readFileSync(join(dir, 'a', r), 'utf8')).toMatch(/<svg[\s>]/)
    }
    expect(new Set(refs)).toEqual(new Set(readdirSync(join(dir, 'a')).filter((f) => f.endsWith('.svg'))))
  })

  it('writes a sign-off row per reviewer and no encoded spaces', () => {
    const md = readFileSync(join(dir, 'a', 'n.review.md'), 'utf8')
    expect(md).toMatch(/^\| A\. Example +\| Analog reviewer +\| +\| +\|$/m)
    expect(md).not.toContain('&#x20;')
  })

  it('writes JSON in the check --json shape, with the note as given', () => {
    const j = JSON.parse(readFileSync(join(dir, 'a', 'n.json'), 'utf8')) as {files: {file: string; stages: {id: string}[]}[]}
    expect(j.files.map((f) => [f.file, f.stages.map((s) => s.id)])).toEqual([[join(dir, 'n.md'), ['amp']]])
  })
})

describe('build output guards', () => {
  it('writes the Markdown report beside the note as <name>.review.md, leaving the note untouched', () => {
    const dir = tempNotes({'n.md': goodNote()})
    const r = runCli(['build', join(dir, 'n.md'), '--format', 'md'])
    expect(r.status).toBe(0)
    expect(readFileSync(join(dir, 'n.md'), 'utf8')).toBe(goodNote())
    expect(readFileSync(join(dir, 'n.review.md'), 'utf8')).toMatch(/^# /)
  })

  it('never replaces another note of the batch with a Markdown report', () => {
    const dir = tempNotes({'n.md': goodNote(), 'n.review.md': goodNote({id: 'other'})})
    const r = runCli(['build', join(dir, 'n.md'), join(dir, 'n.review.md'), '--format', 'md'])
    expect(readFileSync(join(dir, 'n.review.md'), 'utf8')).toBe(goodNote({id: 'other'}))
    expect(r.status).toBe(2)
    expect(r.stderr).toContain(`${join(dir, 'n.md')}:1:1: error: Not built: its output would replace the note ${join(dir, 'n.review.md')}`)
  })

  it('refuses to build two notes of the same name into one output folder', () => {
    const dir = tempNotes({})
    for (const sub of ['x', 'y']) { mkdirSync(join(dir, sub)); writeFileSync(join(dir, sub, 'n.md'), goodNote({id: sub})) }
    const r = runCli(['build', join(dir, 'x', 'n.md'), join(dir, 'y', 'n.md'), '--format', 'json', '--out', join(dir, 'out')])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain(`${join(dir, 'y', 'n.md')}:1:1: error: Not built: its output files would be the same as those of ${join(dir, 'x', 'n.md')}`)
    const j = JSON.parse(readFileSync(join(dir, 'out', 'n.json'), 'utf8')) as {files: {stages: {id: string}[]}[]}
    expect(j.files[0]!.stages[0]!.id).toBe('x')
  })

  it('exits 2 on a folder without notes', () => {
    const dir = tempNotes({'readme.txt': 'no notes here'})
    const r = runCli(['check', dir])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain(`No notes (*.md files) in the folder ${dir}`)
  })
})

describe('batch', () => {
  let dir = ''
  let r: ReturnType<typeof runCli>
  beforeAll(() => {
    dir = tempNotes({'a.md': goodNote(), 'b.md': goodNote({rf: '4.99k'}), 'c-bad.md': BAD_NOTE, 'd.md': unmetNote()})
    r = runCli(['build', dir, '--format', 'json', '--jobs', '2', '--out', join(dir, 'out')], {cwd: dir})
  })

  it('exits 2 when one note of the batch cannot be evaluated', () => {
    expect(r.status).toBe(2)
  })

  it('still builds the good notes', () => {
    expect(['a', 'b', 'd'].map((n) => existsSync(join(dir, 'out', `${n}.json`)))).toEqual([true, true, true])
  })

  it('writes nothing for the bad note and reports its errors at their lines', () => {
    expect(existsSync(join(dir, 'out', 'c-bad.json'))).toBe(false)
    expect(r.stderr).toMatch(new RegExp(`^${join(dir, 'c-bad.md')}:8:1: error: `, 'm'))
  })

  it('prints one summary row per note with its result', () => {
    const rows = r.stdout.trim().split('\n')
    expect(rows[0]).toMatch(/^note\s+stages\s+met \/ not met\s+result\s+output\s+time$/)
    expect(rows.slice(1).map((row) => row.split(/\s{2,}/).slice(0, 4))).toEqual([
      // One requirement and the two limits the archetype has data for (output-swing, slew).
      [join(dir, 'a.md'), '1', '3 / 0', 'met'],
      [join(dir, 'b.md'), '1', '3 / 0', 'met'],
      [join(dir, 'c-bad.md'), '—', '—', 'error'],
      [join(dir, 'd.md'), '1', '2 / 1', 'NOT MET']
    ])
  })

  it('off a terminal, prints one plain progress line per note on stderr', () => {
    const lines = progressLines(r.stderr)
    expect(lines).toHaveLength(4)
    expect(lines.map((l) => l.replace(/ \(\d+\.\d\d s\)$/, '').replace(/^\[\d\/4\] /, '')).sort()).toEqual([
      `error: ${join(dir, 'c-bad.md')}`, `not met: ${join(dir, 'd.md')}`, `ok: ${join(dir, 'a.md')}`, `ok: ${join(dir, 'b.md')}`
    ])
    expect(lines.map((l) => l.slice(0, 6))).toEqual(['[1/4] ', '[2/4] ', '[3/4] ', '[4/4] '])
    expect(r.stderr).not.toContain('\r')
    expect(r.stderr).not.toContain(ESC)
  })
})

describe('--quiet', () => {
  it('prints only diagnostics: no progress, no summary', () => {
    const dir = tempNotes({'u.md': unmetNote(), 'g.md': goodNote()})
    const r = runCli(['check', '--quiet', join(dir, 'u.md'), join(dir, 'g.md')])
    expect(r.status).toBe(1)
    expect(r.stdout).toBe('')
    const lines = r.stderr.trim().split('\n')
    expect(lines).toHaveLength(1)
    expect(lines[0]).toMatch(new RegExp(`^${join(dir, 'u.md')}:\\d+:\\d+: warning: Requirement \`noise-rms\``))
  })
})

describe('colour', () => {
  // `script` runs the command on a pseudo-terminal, where colour is on unless NO_COLOR is set.
  const onTerminal = (dir: string, env: Record<string, string>): string => {
    const r = spawnSync('script', ['-qec', `"${process.execPath}" "${CLI}" check "${join(dir, 'g.md')}" "${join(dir, 'u.md')}"`, '/dev/null'], {
      env: {...process.env, NO_COLOR: '', ...env}, encoding: 'utf8'
    })
    expect(r.stdout).toContain('NOT MET')
    return r.stdout
  }
  let dir = ''
  beforeAll(() => { dir = tempNotes({'g.md': goodNote(), 'u.md': unmetNote()}) })

  it('is used on a terminal (control)', () => {
    expect(onTerminal(dir, {})).toContain(`${ESC}[`)
  })

  it('is never used under NO_COLOR, and no other escape code is printed either', () => {
    expect(onTerminal(dir, {NO_COLOR: '1'})).not.toContain(ESC)
  })
})
