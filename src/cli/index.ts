#!/usr/bin/env node
/**
 * The `ampreview` executable: `main` (main.ts) on this process's arguments, streams and
 * environment. Results go to stdout, diagnostics and progress to stderr; the exit code is
 * the highest of the notes'. No stack trace unless --debug.
 */
import {main} from './main.js'

const out = (s: string): void => { process.stdout.write(s) }
const err = (s: string): void => { process.stderr.write(s) }

const abort = new AbortController()
// First Ctrl-C, or SIGTERM (how CI cancels a job): finish the notes under way (no partial
// files), start no more, exit 130. A second signal: leave now.
const interrupt = (): void => {
  if (abort.signal.aborted) process.exit(130)
  abort.abort()
  err('\nampreview: interrupted; finishing the notes under way (Ctrl-C again to stop at once)\n')
}
process.on('SIGINT', interrupt)
process.on('SIGTERM', interrupt)
process.exitCode = await main(process.argv.slice(2), {
  out, err, env: process.env, stdoutTTY: process.stdout.isTTY === true, stderrTTY: process.stderr.isTTY === true
}, abort)
