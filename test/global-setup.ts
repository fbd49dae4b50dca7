/**
 * Build dist/ once before the suite (`npm run build`: tsc, then the bundled command in
 * dist/bin/), so the CLI tests run the real `ampreview` command.
 */
import {execFileSync} from 'node:child_process'
import {resolve} from 'node:path'

export default function setup(): void {
  const root = resolve(import.meta.dirname, '..')
  const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm'
  execFileSync(npm, ['run', 'build', '--silent'], {cwd: root, stdio: 'inherit'})
}
