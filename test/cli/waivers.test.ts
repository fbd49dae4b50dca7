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

describe('waivers on a chain', () => {
  // A stage with riso driving an inverting stage: chain-riso-divider cautions (issue 11's rule);
  // at 25 °C only, so that no stage rule fires (the datasheet's 25 °C bias currents hold).
  const chainNote = (accept = ''): string => note(
    '```stage a\ntopology: noninverting\nopamp: precision-bipolar\nrf: 9k\nrg: 1k\nriso: 100\ninput: -0.1 .. 0.1 V\nsupply: ±15 V\nband: 0.1 .. 10 Hz\ntemperature: 25 .. 25 °C\n```\n',
    '```stage b\ntopology: inverting\nopamp: precision-bipolar\nrf: 10k\nrg: 10k\nsupply: ±15 V\nband: 0.1 .. 10 Hz\ntemperature: 25 .. 25 °C\n```\n',
    `\`\`\`chain c\nstages: [a, b]\n${accept}\`\`\`\n`)
  const REASON = 'The 1 % divider is trimmed by the system gain calibration.'

  it('--strict fails on a chain rule’s caution; accepted, it is info and the reason is in the JSON', () => {
    const dir = tempNotes({'plain.md': chainNote(), 'ok.md': chainNote(`accept:\n  chain-riso-divider: "${REASON}"\n`)})
    const plain = runCli(['check', '--strict', join(dir, 'plain.md')])
    expect(plain.stderr).toMatch(/error: Chain `c`: Stage a drives stage b through riso .* \[chain-riso-divider\]/)
    expect(plain.status).toBe(2)
    const ok = runCli(['check', '--strict', join(dir, 'ok.md')])
    expect(ok.stderr).toContain(`info: Chain \`c\`: accepted by the author (${REASON}): Stage a drives stage b`)
    expect(ok.status).toBe(0)
    const json = JSON.parse(runCli(['check', '--json', join(dir, 'ok.md'), join(dir, 'plain.md')]).stdout) as {files: {chains: {notes: {rule: string; accepted: string | null}[]}[]}[]}
    expect(json.files[0]!.chains[0]!.notes.find((n) => n.rule === 'chain-riso-divider')!.accepted).toBe(REASON)
    expect(json.files[1]!.chains[0]!.notes.find((n) => n.rule === 'chain-riso-divider')!.accepted).toBeNull()
  })

  it('an id that is not a chain rule is an error at its key with the nearest chain rule id; a stage rule id is not one', () => {
    const dir = tempNotes({'typo.md': chainNote('accept:\n  chain-riso-divder: "typo"\n'), 'stage.md': chainNote('accept:\n  bandwidth-margin: "a stage rule"\n')})
    const typo = runCli(['check', join(dir, 'typo.md')])
    expect(typo.status).toBe(2)
    expect(typo.stderr).toMatch(/typo\.md:\d+:3: error: Unexpected rule `chain-riso-divder` in `accept`, expected a chain rule id; did you mean `chain-riso-divider`\?/)
    const stageRule = runCli(['check', join(dir, 'stage.md')])
    expect(stageRule.status).toBe(2)
    expect(stageRule.stderr).toContain('error: Unexpected rule `bandwidth-margin` in `accept`, expected a chain rule id')
  })

  it('an accepted chain rule that raised nothing is an info message at its key', () => {
    const dir = tempNotes({'n.md': chainNote('accept:\n  chain-aliasing: "no converter here"\n')})
    const r = runCli(['check', join(dir, 'n.md')])
    expect(r.stderr).toMatch(/n\.md:\d+:3: info: Rule `chain-aliasing` is accepted in chain `c` but raised no note there/)
  })
})
