/**
 * Run the compiled CLI (dist/, built once per run by test/global-setup.ts) in a child
 * process, as a user would, and make throw-away folders of notes.
 */
import {spawnSync} from 'node:child_process'
import {mkdtempSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import {join, resolve} from 'node:path'

export const ROOT = resolve(import.meta.dirname, '..', '..')
export const CLI = join(ROOT, 'dist', 'bin', 'index.js')

export interface CliRun {
  status: number | null
  stdout: string
  stderr: string
}

export function runCli(args: string[], opts: {cwd?: string; env?: Record<string, string>} = {}): CliRun {
  const r = spawnSync(process.execPath, [CLI, ...args], {
    cwd: opts.cwd ?? ROOT,
    env: {...process.env, ...opts.env},
    encoding: 'utf8'
  })
  return {status: r.status, stdout: r.stdout, stderr: r.stderr}
}

/** A fresh temporary folder with the given files written into it. */
export function tempNotes(files: Record<string, string | Uint8Array>): string {
  const dir = mkdtempSync(join(tmpdir(), 'ampreview-test-'))
  for (const [name, content] of Object.entries(files)) writeFileSync(join(dir, name), content)
  return dir
}
