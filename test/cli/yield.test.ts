/**
 * `--yield` on the command line (DESIGN §8.7): the Monte Carlo on every stage, 100k trials,
 * in the JSON of `check --json`; off without the flag.
 */
import {describe, expect, it} from 'vitest'
import {join} from 'node:path'
import {ampNote, runCli, tempNotes} from './helpers.js'

const NOTE = ampNote()

describe('--yield', () => {
  it('switches the Monte Carlo on for every stage (100k trials, seed 1); without it the JSON yield is null', () => {
    const dir = tempNotes({'amp.md': NOTE})
    const on = runCli(['check', join(dir, 'amp.md'), '--json', '--yield'])
    const y = JSON.parse(on.stdout).files[0].stages[0].yield
    expect(y).toMatchObject({trials: 100_000, seed: 1, distribution: 'uniform', unavailable: null})
    expect(y.results.map((r: {key: string}) => r.key)).toEqual(['output-error'])
    const off = runCli(['check', join(dir, 'amp.md'), '--json'])
    expect(JSON.parse(off.stdout).files[0].stages[0].yield).toBeNull()
  })
})
