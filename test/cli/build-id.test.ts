import {describe, expect, it} from 'vitest'
import {execFileSync} from 'node:child_process'
import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join, resolve} from 'node:path'
import {buildId} from '../../src/cli/resources.js'

const SCRIPT = resolve(import.meta.dirname, '..', '..', 'scripts', 'build-id.mjs')
const idOf = (dir: string): string => {
  execFileSync(process.execPath, [SCRIPT, dir])
  return readFileSync(join(dir, 'build-id.txt'), 'utf8').trim()
}

describe('the build id the cache keys on', () => {
  it('is written by npm run build for the bundle that runs, and buildId() reads it', async () => {
    const id = await buildId()
    expect(id).toMatch(/^[0-9a-f]{64}$/)
    // The script run again on dist/bin gives the same id (it leaves its own file out).
    expect(idOf(resolve(import.meta.dirname, '..', '..', 'dist', 'bin'))).toBe(id)
  })

  it('changes when one byte of one bundle file changes, and when a file is renamed', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ampreview-build-id-'))
    try {
      writeFileSync(join(dir, 'index.js'), 'console.log(1)\n')
      writeFileSync(join(dir, 'chunk-A.js'), 'export const a = 1\n')
      const first = idOf(dir)
      expect(idOf(dir)).toBe(first)
      writeFileSync(join(dir, 'chunk-A.js'), 'export const a = 2\n')
      const second = idOf(dir)
      expect(second).not.toBe(first)
      rmSync(join(dir, 'chunk-A.js'))
      writeFileSync(join(dir, 'chunk-B.js'), 'export const a = 2\n')
      expect(idOf(dir)).not.toBe(second)
    } finally {
      rmSync(dir, {recursive: true, force: true})
    }
  })
})
