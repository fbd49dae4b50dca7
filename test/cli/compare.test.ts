import {beforeAll, describe, expect, it} from 'vitest'
import {execFileSync} from 'node:child_process'
import {mkdirSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {runCli, tempNotes} from './helpers.js'
import {goodNote} from './workflow-helpers.js'

interface Stage {
  id: string
  gain: number
  noise: {inputRms: number}
  requirements: {key: string; limit: number; value: number | null; met: boolean}[]
}
interface Run {files: {file: string; stages: Stage[]}[]}

const TIA_NOTE = `# Receiver

\`\`\`stage rx
topology: transimpedance
opamp: precision-jfet
rf: 1M 0.5%
cf: 2.2p
csource: 20p
input: 0 .. 1u A
supply: ±5 V
band: 1 .. 10k Hz
require:
  phase-margin: 30 deg
\`\`\`
`

/** A note whose phase-margin requirement cannot be met. */
const tooStrict = (): string => goodNote().replace('phase-margin: 45 deg', 'phase-margin: 89 deg')

describe('compare', () => {
  let dir = ''
  let base: Run
  let tia: Run
  const write = (name: string, run: Run): string => {
    const p = join(dir, name)
    writeFileSync(p, JSON.stringify(run))
    return p
  }
  const edit = (run: Run, f: (s: Stage) => void): Run => {
    const copy = structuredClone(run)
    f(copy.files[0]!.stages[0]!)
    return copy
  }
  beforeAll(() => {
    dir = tempNotes({'good.md': goodNote(), 'tia.md': TIA_NOTE})
    const r = runCli(['check', '--json', join(dir, 'good.md'), join(dir, 'tia.md')])
    expect(r.status).toBe(0)
    const both = JSON.parse(r.stdout) as Run
    base = {files: [both.files[0]!]}
    tia = {files: [both.files[1]!]}
    expect(base.files[0]!.stages[0]!.requirements[0]!.met).toBe(true)
  })

  it('reports no change and exits 0 for the same result twice', () => {
    const a = write('same.json', base)
    const r = runCli(['compare', a, a])
    expect(r.status).toBe(0)
    expect(r.stdout).toBe('No value or verdict changed.\n')
  })

  it('exits 1 when a verdict goes from met to not met, and names it', () => {
    const r = runCli(['compare', write('old.json', base), write('new.json', edit(base, (s) => { s.requirements[0]!.met = false }))])
    expect(r.status).toBe(1)
    expect(r.stdout).toContain('verdict amp phase-margin: met → NOT MET')
    expect(r.stdout).toContain('A requirement went from met to not met.')
  })

  it('exits 0 when a verdict goes from not met to met', () => {
    const r = runCli(['compare', write('old.json', edit(base, (s) => { s.requirements[0]!.met = false })), write('new.json', base)])
    expect(r.status).toBe(0)
    expect(r.stdout).toContain('verdict amp phase-margin: NOT MET → met')
  })

  it('exits 0 and lists old → new when only a value changed', () => {
    const r = runCli(['compare', write('old.json', base), write('new.json', edit(base, (s) => { s.gain = 12.5 }))])
    expect(r.status).toBe(0)
    expect(r.stdout.trim().split('\n')).toEqual([`amp gain: ${base.files[0]!.stages[0]!.gain.toPrecision(4)} V/V → 12.5 V/V +2.41 V/V (+23.89 %)`])
  })

  it('leaves out changes under the default 0.1 %, and under --threshold 1%', () => {
    const g = base.files[0]!.stages[0]!.gain
    const tiny = write('tiny.json', edit(base, (s) => { s.gain = g * 1.0005 }))
    const small = write('small.json', edit(base, (s) => { s.gain = g * 1.005 }))
    expect(runCli(['compare', write('o1.json', base), tiny]).stdout.trim()).toBe('No value or verdict changed.')
    expect(runCli(['compare', write('o2.json', base), small]).stdout).toContain('amp gain:')
    expect(runCli(['compare', '--threshold', '1%', write('o3.json', base), small]).stdout.trim()).toBe('No value or verdict changed.')
  })

  it('still lists a verdict flip whatever the threshold', () => {
    const r = runCli(['compare', '--threshold', '50%', write('o4.json', base), write('n4.json', edit(base, (s) => { s.requirements[0]!.met = false }))])
    expect(r.status).toBe(1)
  })

  it('refuses a threshold that is not a percentage', () => {
    const r = runCli(['compare', '--threshold', '0.01', write('o5.json', base), write('n5.json', base)])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('expected a percentage such as `1%`')
  })

  it('exits 1 when a stage with a met requirement disappears', () => {
    const r = runCli(['compare', write('old.json', base), write('new.json', {files: [{...base.files[0]!, stages: []}]})])
    expect(r.status).toBe(1)
    expect(r.stdout).toContain('stage amp: removed')
  })

  it('prints the verdict table and the value table as Markdown with --markdown', () => {
    const changed = edit(base, (s) => { s.requirements[0]!.met = false; s.gain = 12.5 })
    const r = runCli(['compare', '--markdown', write('old.json', base), write('new.json', changed)])
    expect(r.status).toBe(1)
    const lines = r.stdout.split('\n')
    expect(lines[0]).toBe('## ampreview comparison')
    expect(lines).toEqual(expect.arrayContaining([
      '| Stage | Requirement | Old | New |', '| amp | `phase-margin` | met | NOT MET |',
      '| Stage | Value | Old | New | Change |', '**A requirement went from met to not met.**'
    ]))
    expect(lines.some((l) => l.startsWith('| amp | `gain` | '))).toBe(true)
  })

  it('gives a transimpedance stage’s input-referred values in amperes and its gain in ohms', () => {
    const changed = edit(tia, (s) => { s.noise.inputRms *= 2; s.gain *= 2 })
    const r = runCli(['compare', write('old.json', tia), write('new.json', changed)])
    expect(r.stdout).toMatch(/^rx noise\.inputRms: .* [fpnµ]?A → .*A /m)
    expect(r.stdout).toMatch(/^rx gain: .*Ω → .*Ω /m)
  })

  it.each([
    ['text that is not JSON', '{"files": ['],
    ['a stage without its budgets', JSON.stringify({files: [{file: 'x.md', stages: [{id: 'amp', requirements: []}]}]})]
  ])('exits 2 on a result file that is %s', (_name, text) => {
    writeFileSync(join(dir, 'broken.json'), text)
    const r = runCli(['compare', join(dir, 'broken.json'), write('ok.json', base)])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain(`${join(dir, 'broken.json')} is not an ampreview result`)
    expect(r.stderr).not.toMatch(/\n\s+at /)
  })

  it('compares two notes, evaluating each', () => {
    const d = tempNotes({'old.md': goodNote(), 'new.md': goodNote({rf: '19.1k'})})
    const r = runCli(['compare', join(d, 'old.md'), join(d, 'new.md')])
    expect(r.status).toBe(0)
    expect(r.stdout).toMatch(/^amp gain: 10\.09 V\/V → 20\.1 V\/V /m)
  })

  it('exits 1 comparing two notes when the new one fails a requirement the old one met', () => {
    const d = tempNotes({'old.md': goodNote(), 'new.md': tooStrict()})
    const r = runCli(['compare', join(d, 'old.md'), join(d, 'new.md')])
    expect(r.status).toBe(1)
    expect(r.stdout).toContain('verdict amp phase-margin: met → NOT MET')
  })

  it('reads REV:PATH at a git revision, PATH relative to the working folder', () => {
    const repo = tempNotes({})
    mkdirSync(join(repo, 'designs'))
    writeFileSync(join(repo, 'designs', 'n.md'), goodNote())
    const git = (...args: string[]): void => {
      execFileSync('git', ['-c', 'user.name=Test', '-c', 'user.email=test@example.invalid', '-c', 'commit.gpgsign=false', ...args], {cwd: repo, stdio: 'ignore'})
    }
    git('init', '-q')
    git('add', '.')
    git('commit', '-qm', 'first')
    writeFileSync(join(repo, 'designs', 'n.md'), tooStrict())
    const r = runCli(['compare', 'HEAD:n.md', 'n.md'], {cwd: join(repo, 'designs')})
    expect(r.stderr).toBe('')
    expect(r.status).toBe(1)
    expect(r.stdout).toContain('verdict amp phase-margin: met → NOT MET')
  })

  it('exits 2 saying so when the REV of REV:PATH is not a commit', () => {
    const r = runCli(['compare', 'no-such-revision-here:x.md', 'x.md'], {cwd: tempNotes({'x.md': goodNote()})})
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('ampreview: The revision `no-such-revision-here` is not a commit of the git repository here')
  })
})
