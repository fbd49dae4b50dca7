/**
 * Compile src/ to dist/ once before the suite, so CLI tests run the real command.
 */
import {execFileSync} from 'node:child_process'
import {resolve} from 'node:path'

export default function setup(): void {
  const root = resolve(import.meta.dirname, '..')
  execFileSync(process.execPath, [resolve(root, 'node_modules/typescript/bin/tsc'), '-p', 'tsconfig.build.json'], {cwd: root, stdio: 'inherit'})
}
