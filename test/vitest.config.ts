import {resolve} from 'node:path'
import {defineConfig} from 'vitest/config'

export default defineConfig({
  test: {
    root: resolve(import.meta.dirname, '..'),
    include: ['test/**/*.test.ts'],
    globalSetup: ['test/global-setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // In CI, also a JSON report, from which .ci/run prints the plain "N passed, N failed" line.
    ...(process.env['CI'] ? {reporters: ['default', 'json'], outputFile: {json: 'test-results.json'}} : {})
  }
})
