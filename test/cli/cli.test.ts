import {describe, expect, it} from 'vitest'
import {existsSync, readFileSync, statSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {ROOT, runCli, runCliProcess, tempNotes} from './helpers.js'
import {goodNote, unmetNote} from './workflow-helpers.js'

const GOOD = goodNote()
const UNMET = unmetNote()

/** Three different mistakes: an unknown key (8:1), a current unit on the supply (10:20), a reversed range (12:14). */
const THREE_MISTAKES = `# Three mistakes

\`\`\`stage amp
topology: noninverting
opamp: precision-bipolar
rf: 9.09k
rg: 1k
rff: 10k
input: -0.1 .. 0.1 V
supply: 10 mV .. 5 mA
band: 0.1 .. 100 Hz
temperature: 85 .. -40 °C
\`\`\`
`

// Most runs below go in-process (see helpers.ts); these few start the real executable, so
// that its exit codes, streams and argument handling are proven as a user meets them.
describe('ampreview CLI', () => {
  it('prints its version', () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as {version: string}
    const r = runCliProcess(['--version'])
    expect(r.status).toBe(0)
    expect(r.stdout.trim()).toBe(`ampreview ${pkg.version}`)
  })

  it('exits 2 with usage on an unknown command', () => {
    const r = runCliProcess(['bild', 'x.md'])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('Unexpected command `bild`')
    expect(r.stderr).not.toMatch(/\n\s+at /)
  })

  it('check exits 0 when every requirement is met', () => {
    const dir = tempNotes({'good.md': GOOD})
    const r = runCliProcess(['check', join(dir, 'good.md')])
    expect(r.stderr).not.toMatch(/: (error|warning): /)
    expect(r.status).toBe(0)
  })

  it('check exits 1 when a requirement is not met, and says where', () => {
    const dir = tempNotes({'unmet.md': UNMET})
    const r = runCliProcess(['check', join(dir, 'unmet.md')])
    expect(r.status).toBe(1)
    expect(r.stderr).toContain(`${join(dir, 'unmet.md')}:18:3: warning: Requirement \`noise-rms\``)
  })

  it('check exits 1 from a physical limit alone (DESIGN §4.6): no requirement, the output clips', () => {
    // Gain 10.09 on ±1.5 V in: ±15.1 V out, against ±12 V rails at −5 % less the archetype's headroom.
    const clipping = GOOD.replace('input: -0.1 .. 0.1 V', 'input: ±1.5 V').replace(/require:\n {2}phase-margin: 45 deg\n/, '')
    expect(clipping).not.toContain('require:')
    const dir = tempNotes({'clips.md': clipping})
    const r = runCli(['check', '--json', join(dir, 'clips.md')])
    expect(r.status).toBe(1)
    const stage = (JSON.parse(r.stdout) as {files: {stages: {requirements: {key: string; kind: string; met: boolean | null}[]}[]}[]}).files[0]!.stages[0]!
    expect(stage.requirements.filter((q) => q.kind === 'require')).toEqual([])
    expect(stage.requirements.find((q) => q.key === 'output-swing')).toMatchObject({kind: 'limit', met: false})
    expect(r.stderr).toMatch(/warning: Limit `output-swing` of stage `amp` not met/)
  })

  it('check reports three different mistakes at their lines, in one run, and exits 2', () => {
    const dir = tempNotes({'bad.md': THREE_MISTAKES})
    const r = runCli(['check', join(dir, 'bad.md')])
    expect(r.status).toBe(2)
    const lines = r.stderr.trim().split('\n').filter((l) => l.includes(': error: '))
    const places = lines.map((l) => l.split(': error: ')[0]!.slice(join(dir, 'bad.md').length + 1))
    expect(places).toEqual(expect.arrayContaining(['8:1', '10:20', '12:14']))
    expect(r.stderr).not.toMatch(/\n\s+at /)
  })

  it('check --json prints one JSON object with the contract fields', () => {
    const dir = tempNotes({'good.md': GOOD})
    const r = runCli(['check', '--json', join(dir, 'good.md')])
    expect(r.status).toBe(0)
    const out = JSON.parse(r.stdout) as {files: {file: string; sourceSha256: string; stages: Record<string, unknown>[]}[]}
    expect(out.files).toHaveLength(1)
    expect(out.files[0]!.sourceSha256).toMatch(/^[0-9a-f]{64}$/)
    expect(Object.keys(out.files[0]!.stages[0]!)).toEqual(
      ['id', 'topology', 'opamp', 'gain', 'noiseGain', 'dc', 'noise', 'stability', 'filter', 'requirements', 'notes', 'role', 'alternatives', 'yield'])
    expect(out.files[0]!.stages[0]!['alternatives']).toBeNull()
  })

  it.each([
    ['a file that does not exist', null, 'File not found'],
    ['an empty file', '', 'The note is empty'],
    ['a binary file', new Uint8Array([0x89, 0x50, 0x00, 0x01, 0x02]), 'This is a binary file']
  ])('check exits 2 on %s', (_name, content, message) => {
    const dir = content === null ? tempNotes({}) : tempNotes({'n.md': content})
    const r = runCli(['check', join(dir, 'n.md')])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain(`${join(dir, 'n.md')}:1:1: error: ${message}`)
  })

  it('build writes a PDF next to the note and prints its path', () => {
    const dir = tempNotes({'good.md': GOOD})
    const r = runCli(['build', join(dir, 'good.md')], {cwd: dir})
    expect(r.status).toBe(0)
    expect(r.stdout).toMatch(/good\.pdf/)
    expect(readFileSync(join(dir, 'good.pdf')).subarray(0, 5).toString()).toBe('%PDF-')
  })

  it('a note with errors writes no PDF and leaves an earlier good one untouched', () => {
    const dir = tempNotes({'n.md': GOOD})
    expect(runCli(['build', join(dir, 'n.md')]).status).toBe(0)
    const before = readFileSync(join(dir, 'n.pdf'))
    const mtime = statSync(join(dir, 'n.pdf')).mtimeMs
    writeFileSync(join(dir, 'n.md'), THREE_MISTAKES)
    const r = runCli(['build', join(dir, 'n.md')])
    expect(r.status).toBe(2)
    expect(r.stdout).toMatch(/error/)
    expect(readFileSync(join(dir, 'n.pdf')).equals(before)).toBe(true)
    expect(statSync(join(dir, 'n.pdf')).mtimeMs).toBe(mtime)
  })

  it('build --out writes into the given folder', () => {
    const dir = tempNotes({'good.md': GOOD})
    const r = runCli(['build', join(dir, 'good.md'), '--out', join(dir, 'reports')])
    expect(r.status).toBe(0)
    expect(existsSync(join(dir, 'reports', 'good.pdf'))).toBe(true)
  })

  it('builds the same bytes under another time zone, locale and working directory', () => {
    const dir = tempNotes({'good.md': GOOD})
    runCli(['build', join(dir, 'good.md'), '--out', join(dir, 'a')], {env: {TZ: 'UTC', LANG: 'C'}})
    runCli(['build', join(dir, 'good.md'), '--out', join(dir, 'b')],
      {cwd: dir, env: {TZ: 'Pacific/Kiritimati', LANG: 'de_DE.UTF-8', LC_ALL: 'de_DE.UTF-8', SOURCE_DATE_EPOCH: '1700000000'}})
    const a = readFileSync(join(dir, 'a', 'good.pdf'))
    const b = readFileSync(join(dir, 'b', 'good.pdf'))
    expect(a.length).toBeGreaterThan(1000)
    expect(a.equals(b)).toBe(true)
  })
})
