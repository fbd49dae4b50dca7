/**
 * Fuzzing the note reader: the quantity grammar, the stage language and whole notes never
 * throw, never hang, and keep their contracts for any input (a parse either gives finite
 * SI values or a message pointing inside the text; every diagnostic has a place; a stage
 * the reader accepts is one the engine can evaluate, with finite numbers in its result).
 *
 * Each input runs in a worker thread (sandbox.ts), so that fast-check's per-run `timeout`
 * can fail an input that hangs; `interruptAfterTimeLimit` bounds a whole property, and an
 * interrupted run counts as a failure. Nothing here measures time.
 *
 * `npm test` runs a few hundred cases per property; `npm run fuzz` sets `FUZZ_RUNS=10000`
 * runs the long campaign, and `FUZZ_SEED` replays one.
 */
import {readFileSync} from 'node:fs'
import {join} from 'node:path'
import fc from 'fast-check'
import {afterAll, beforeAll, describe, expect, it} from 'vitest'
import {
  OPAMP_BLOCK, STAGE_BODIES, damagedNote, dimension, noteText, quantityText, resistorText, stageBody
} from './arbitraries.js'
import {Sandbox, type FuzzCall} from './sandbox.js'

const RUNS = Number(process.env['FUZZ_RUNS'] ?? 300)
const SEED = process.env['FUZZ_SEED'] === undefined ? {} : {seed: Number(process.env['FUZZ_SEED'])}
/** Per input: far above the slowest honest note (tens of ms), so only a hang trips it. */
const PER_RUN_MS = 20_000
/** Whole-note inputs run fewer cases in `npm test`: each goes through the engine. */
const NOTE_RUNS = Math.max(1, Math.round(RUNS * (process.env['FUZZ_RUNS'] === undefined ? 2 / 3 : 1)))

const sandbox = new Sandbox()
beforeAll(async () => {
  // Start the worker before the first timed run.
  await sandbox.run({kind: 'quantity', text: '1k', dim: 'resistance'})
})
afterAll(() => sandbox.close())

const options = (numRuns: number): fc.Parameters<unknown> => ({
  numRuns,
  timeout: PER_RUN_MS,
  interruptAfterTimeLimit: Math.max(60_000, numRuns * 50),
  markInterruptAsFailure: true,
  ...SEED
})

/** Assert that every generated call passes the worker's invariants. */
async function holds<T>(arb: fc.Arbitrary<T>, call: (value: T) => FuzzCall, numRuns: number): Promise<void> {
  await fc.assert(
    fc.asyncProperty(arb, async (value) => {
      const problems = await sandbox.run(call(value))
      expect(problems).toEqual([])
    }),
    options(numRuns)
  )
}

const testTimeout = (runs: number): number => Math.max(60_000, runs * 200)

describe('fuzz: the quantity grammar', () => {
  it('parseQuantity() gives a finite value or a placed message, on every dimension', async () => {
    await holds(fc.tuple(quantityText, dimension), ([text, dim]) => ({kind: 'quantity', text, dim}), RUNS)
  }, testTimeout(RUNS))

  it('parseRange() gives finite, ordered ends or a placed message', async () => {
    await holds(fc.tuple(quantityText, dimension), ([text, dim]) => ({kind: 'range', text, dim}), RUNS)
  }, testTimeout(RUNS))

  it('parseSupply() gives two different finite rails or a placed message', async () => {
    await holds(quantityText, (text) => ({kind: 'supply', text}), RUNS)
  }, testTimeout(RUNS))

  it('parseResistor() gives a finite value, tolerance under 100 % and tempco of 0 or more, or a placed message', async () => {
    await holds(resistorText, (text) => ({kind: 'resistor', text}), RUNS)
  }, testTimeout(RUNS))
})

describe('fuzz: the stage language', () => {
  it('reads random and mutated stage blocks without throwing, and evaluates what it accepts', async () => {
    await holds(
      fc.tuple(fc.boolean(), stageBody),
      ([withOpamp, body]) => ({kind: 'note', text: `${withOpamp ? `${OPAMP_BLOCK}\n\n` : ''}\`\`\`stage s-1\n${body}\n\`\`\`\n`}),
      NOTE_RUNS
    )
  }, testTimeout(NOTE_RUNS))
})

describe('fuzz: whole notes', () => {
  it('reads random Markdown around random blocks without throwing, and evaluates what it accepts', async () => {
    await holds(noteText, (text) => ({kind: 'note', text}), NOTE_RUNS)
  }, testTimeout(NOTE_RUNS))

  const good = readFileSync(join(import.meta.dirname, '..', 'fixtures', 'note', 'good.md'), 'utf8')
  const small = `${OPAMP_BLOCK}\n\n${STAGE_BODIES.map((b, i) => `\`\`\`stage s-${i}\n${b.join('\n')}\n\`\`\``).join('\n\n')}\n`
  it.each([
    ['the good fixture note', good],
    ['one stage of each topology', small]
  ])('reads %s with random damage without throwing', async (_name, valid) => {
    await holds(damagedNote(valid), (text) => ({kind: 'note', text}), Math.max(1, Math.round(NOTE_RUNS / 2)))
  }, testTimeout(NOTE_RUNS))
})
