/**
 * `--alternatives` (DESIGN §8.8) through the command: on for every stage of every note, only
 * with `build` and `check`, and part of the build cache's key.
 */
import {describe, expect, it} from 'vitest'
import {readFileSync} from 'node:fs'
import {join} from 'node:path'
import {runCli, tempNotes} from './helpers.js'
import {goodNote} from './workflow-helpers.js'

type Out = {files: {stages: {id: string; alternatives: {candidate: string}[] | null}[]}[]}
const progressOf = (stderr: string): string[] => stderr.split('\n').filter((l) => /^\[\d+\/\d+\] /.test(l))

describe('--alternatives', () => {
  it('gives every stage its alternatives in check --json', () => {
    const r = runCli(['check', '--json', '--alternatives', join('sample-designs', 'reference-buffer.md')])
    expect(r.status).toBe(0)
    const stages = (JSON.parse(r.stdout) as Out).files[0]!.stages
    expect(stages.map((s) => s.alternatives?.length ?? null)).toEqual([6, 6])
  })

  it('leaves them null without the option', () => {
    const r = runCli(['check', '--json', join('sample-designs', 'reference-buffer.md')])
    expect((JSON.parse(r.stdout) as Out).files[0]!.stages.map((s) => s.alternatives)).toEqual([null, null])
  })

  it('goes with build and check only', () => {
    const r = runCli(['compare', '--alternatives', 'a.json', 'b.json'])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('`--alternatives` goes with `build` or `check`, not `compare`')
  })

  it('rebuilds a note built without it, and is up to date when given again', () => {
    const dir = tempNotes({'n.md': goodNote()})
    const note = join(dir, 'n.md')
    expect(runCli(['build', '--format', 'json', note]).status).toBe(0)
    const on = runCli(['build', '--format', 'json', '--alternatives', note])
    expect(progressOf(on.stderr)).toEqual([expect.stringMatching(/^\[1\/1\] ok: /)])
    const written = JSON.parse(readFileSync(join(dir, 'n.json'), 'utf8')) as Out
    expect(written.files[0]!.stages[0]!.alternatives).not.toBeNull()
    const again = runCli(['build', '--format', 'json', '--alternatives', note])
    expect(progressOf(again.stderr)).toEqual([expect.stringMatching(/^\[1\/1\] up to date: /)])
  })
})
