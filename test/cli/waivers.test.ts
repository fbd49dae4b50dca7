/**
 * Rule ids all the way, waivers and baseline stages, through the real command: `--strict`
 * fails on a rule's warning by its kind, an accepted rule is no failure, an unknown rule id
 * is an error with a hint at its key, and a baseline stage's unmet requirement leaves the
 * exit code at 0 while its verdict is still reported.
 */
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {runCli, tempNotes} from './helpers.js'

/**
 * A transimpedance stage whose closed-loop bandwidth is only about 5 × the band's top
 * (bandwidth-margin warns); its temperature range is entered so that no other caution fires.
 */
const stage = (id: string, extra = ''): string => `\`\`\`stage ${id}
topology: transimpedance
opamp: precision-jfet
rf: 1M
cf: 2.2p
csource: 50p
input: 0 .. 2u A
supply: ±5 V
band: 10 .. 20k Hz
temperature: 20 .. 30 °C
require:
  phase-margin: 45 deg
${extra}\`\`\`
`

const note = (...blocks: string[]): string => `---\ntitle: Waivers\ndate: 2026-01-01\n---\n\n# Stages\n\n${blocks.join('\n')}`

const ACCEPT = 'accept:\n  bandwidth-margin: "The band top is the noise edge; the signal is at 2 kHz."\n'

interface JsonOut {
  files: {diagnostics: {severity: string; message: string; rule: string | null; kind: string; line: number}[];
    stages: {id: string; role: string; requirements: {met: boolean}[]; notes: {rule: string; accepted: string | null}[]}[]}[]
}

describe('rule ids and waivers', () => {
  it('--strict fails on a rule’s warning, chosen by its kind', () => {
    const dir = tempNotes({'n.md': note(stage('rx'))})
    const r = runCli(['check', '--strict', join(dir, 'n.md')])
    expect(r.status).toBe(2)
    expect(r.stderr).toMatch(/n\.md:\d+:1: error: Stage `rx`: The closed-loop bandwidth, .* \[bandwidth-margin\]/)
  })

  it('does not count an accepted rule as a --strict failure, and shows the reason', () => {
    const dir = tempNotes({'n.md': note(stage('rx', ACCEPT))})
    const r = runCli(['check', '--strict', join(dir, 'n.md')])
    expect(r.status).toBe(0)
    expect(r.stderr).toContain('info: Stage `rx`: accepted by the author (The band top is the noise edge; the signal is at 2 kHz.)')
    expect(r.stderr).toContain('[bandwidth-margin]')
  })

  it('carries the rule id and kind in JSON diagnostics, and the reason in the note', () => {
    const dir = tempNotes({'n.md': note(stage('rx', ACCEPT)), 'm.md': note(stage('rx'))})
    const out = JSON.parse(runCli(['check', '--json', join(dir, 'm.md'), join(dir, 'n.md')]).stdout) as JsonOut
    const [plain, accepted] = out.files
    const d = plain!.diagnostics.find((x) => x.rule === 'bandwidth-margin')
    expect(d).toMatchObject({severity: 'warning', kind: 'note'})
    expect(d!.message).not.toContain('[bandwidth-margin]')
    expect(accepted!.stages[0]!.notes.find((n) => n.rule === 'bandwidth-margin')!.accepted).toBe('The band top is the noise edge; the signal is at 2 kHz.')
    expect(plain!.stages[0]!.notes.find((n) => n.rule === 'bandwidth-margin')!.accepted).toBeNull()
  })

  it('reports an unknown rule id at its key with the nearest id as a hint', () => {
    const dir = tempNotes({'n.md': note(stage('rx', 'accept:\n  bandwith-margin: "typo"\n'))})
    const r = runCli(['check', join(dir, 'n.md')])
    expect(r.status).toBe(2)
    // The accept entry sits on line 21 of the note, indented by two spaces.
    expect(r.stderr).toContain(`${join(dir, 'n.md')}:21:3: error: Unexpected rule \`bandwith-margin\` in \`accept\`, expected a rule id; did you mean \`bandwidth-margin\`?`)
  })

  it('refuses an accepted rule without a reason', () => {
    const dir = tempNotes({'n.md': note(stage('rx', 'accept:\n  bandwidth-margin:\n'))})
    const r = runCli(['check', join(dir, 'n.md')])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('error: Expected a reason after `bandwidth-margin` in `accept`')
  })

  it('says when an accepted rule raised nothing on the stage', () => {
    const dir = tempNotes({'n.md': note(stage('rx', 'accept:\n  output-swing: "old waiver"\n'))})
    const r = runCli(['check', join(dir, 'n.md')])
    expect(r.stderr).toContain('info: Rule `output-swing` is accepted in stage `rx` but raised no note there')
  })
})

describe('role: baseline', () => {
  // 90° is out of reach for this stage: its phase-margin requirement is not met.
  const failing = (id: string, role: string): string => stage(id, role).replace('phase-margin: 45 deg', 'phase-margin: 89 deg')

  it('leaves the exit code at 0 when only a baseline stage misses a requirement', () => {
    const dir = tempNotes({'n.md': note(failing('as-drawn', 'role: baseline\n'), stage('proposed', ACCEPT))})
    const r = runCli(['check', '--json', join(dir, 'n.md')])
    expect(r.status).toBe(0)
    const out = JSON.parse(r.stdout) as JsonOut
    const [base, proposed] = out.files[0]!.stages
    expect(base).toMatchObject({id: 'as-drawn', role: 'baseline'})
    expect(base!.requirements.some((q) => !q.met)).toBe(true)
    expect(proposed).toMatchObject({id: 'proposed', role: 'design'})
    expect(r.stderr).toContain('info: Requirement `phase-margin` of baseline stage `as-drawn` not met')
  })

  it('still gives exit code 1 when a design stage misses a requirement', () => {
    const dir = tempNotes({'n.md': note(failing('design', ''))})
    expect(runCli(['check', join(dir, 'n.md')]).status).toBe(1)
  })

  it('refuses a role that is neither design nor baseline, with a hint', () => {
    const dir = tempNotes({'n.md': note(stage('rx', 'role: baselin\n'))})
    const r = runCli(['check', join(dir, 'n.md')])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain("error: Unexpected role `baselin`, expected `design` or `baseline`; did you mean `baseline`?")
  })
})
