import {resolve} from 'node:path'
import {defineConfig} from 'vitest/config'

export default defineConfig({
  test: {
    root: resolve(import.meta.dirname, '..'),
    include: ['test/**/*.test.ts'],
    globalSetup: ['test/global-setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks'
  }
})
