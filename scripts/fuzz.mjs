#!/usr/bin/env node
/**
 * The long fuzz campaign of the note reader: test/hardening/fuzz.test.ts with many more
 * cases per property than `npm test` runs (default 10,000; `npm run fuzz -- 50000` for more).
 * A failure prints fast-check's seed and path; replay it with FUZZ_SEED=<seed>.
 *
 *   node scripts/fuzz.mjs [RUNS]
 */
import {spawnSync} from 'node:child_process'
import {dirname, join} from 'node:path'
import {fileURLToPath} from 'node:url'

const root = join(dirname(fileURLToPath(import.meta.url)), '..')
const runs = process.argv[2] ?? process.env.FUZZ_RUNS ?? '10000'
if (!/^\d+$/.test(runs) || Number(runs) < 1) {
  process.stderr.write(`fuzz: expected a positive whole number of runs, got \`${runs}\`\n`)
  process.exit(2)
}
process.stderr.write(`fuzz: ${runs} cases per property\n`)
const vitest = join(root, 'node_modules', 'vitest', 'vitest.mjs')
const r = spawnSync(process.execPath, [vitest, 'run', 'test/hardening/fuzz.test.ts'], {
  cwd: root,
  stdio: 'inherit',
  env: {...process.env, FUZZ_RUNS: runs}
})
process.exit(r.status ?? 2)
