/**
 * Chains through the command: `check --json` carries `chains` beside `stages`, a chain
 * requirement not met exits 1 at its key, `compare` exits 1 on a flipped chain verdict, and
 * the Markdown report holds the chain section.
 */
import {readFileSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {runCli, tempNotes} from './helpers.js'

const NOTE = (nfb: number): string => `# Chain

\`\`\`stage amp
topology: noninverting
opamp: zero-drift
rf: 100k
rg: 1k
input: -20m .. 20m V
supply: ±5 V
band: 0.1 .. 10 Hz
\`\`\`

\`\`\`stage buf
topology: follower
opamp: zero-drift
supply: ±5 V
band: 0.1 .. 10 Hz
\`\`\`

\`\`\`chain meas
stages: [amp, buf]
adc: delta-sigma-24
require:
  noise-free-bits: ${nfb}
\`\`\`
`

interface Chain {id: string; stages: string[]; noise: {noiseFreeBits: number}; requirements: {key: string; met: boolean | null}[]}
interface Run {files: {chains: Chain[]}[]}

describe('chains on the command line', () => {
  it('check --json carries the chain beside the stages, and exits 0 when it meets its requirements', () => {
    const dir = tempNotes({'c.md': NOTE(10)})
    const r = runCli(['check', '--json', join(dir, 'c.md')])
    expect(r.status).toBe(0)
    const run = JSON.parse(r.stdout) as Run
    const c = run.files[0]!.chains[0]!
    expect(c.id).toBe('meas')
    expect(c.stages).toEqual(['amp', 'buf'])
    expect(c.requirements.map((x) => [x.key, x.met])).toEqual([['noise-free-bits', true], ['converter-range', true]])
  })

  it('exits 1 when a chain requirement is not met, naming it at its key', () => {
    const dir = tempNotes({'c.md': NOTE(23)})
    const r = runCli(['check', join(dir, 'c.md')])
    expect(r.status).toBe(1)
    expect(r.stderr).toContain(`${join(dir, 'c.md')}:24:3: warning: Requirement \`noise-free-bits\` of chain \`meas\` not met`)
  })

  it('compare exits 1 when a chain verdict goes from met to not met', () => {
    const dir = tempNotes({'old.md': NOTE(10), 'new.md': NOTE(23)})
    const r = runCli(['compare', join(dir, 'old.md'), join(dir, 'new.md')])
    expect(r.status).toBe(1)
    expect(r.stdout).toContain('verdict chain meas noise-free-bits: met → NOT MET')
  })

  it('compare exits 0 on the same chain result twice', () => {
    const dir = tempNotes({'c.md': NOTE(10)})
    const json = runCli(['check', '--json', join(dir, 'c.md')]).stdout
    writeFileSync(join(dir, 'a.json'), json)
    const r = runCli(['compare', join(dir, 'a.json'), join(dir, 'a.json')])
    expect(r.status).toBe(0)
  })

  it('writes the chain section into the Markdown report', () => {
    const dir = tempNotes({'c.md': NOTE(10)})
    const r = runCli(['build', '--format', 'md', join(dir, 'c.md')])
    expect(r.status).toBe(0)
    const md = readFileSync(join(dir, 'c.review.md'), 'utf8')
    expect(md).toContain('## Chain meas')
    expect(md).toContain('Noise-free bits, log2(span / (6.6σ))')
    expect(md).toContain('Signal range at every node')
  })
})
