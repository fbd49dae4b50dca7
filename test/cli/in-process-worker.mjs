/**
 * The compiled command (dist/cli/main.js) kept loaded in a worker thread of a test file:
 * each request runs `main` once with captured stdout/stderr and answers on its port, then
 * wakes the waiting test thread (see `runCli` in helpers.ts). The modules load once per test
 * file instead of once per run.
 */
import {parentPort} from 'node:worker_threads'

const {main} = await import(new URL('../../dist/cli/main.js', import.meta.url).href)

parentPort.on('message', async ({args, env, port, signal}) => {
  let stdout = ''
  let stderr = ''
  let status
  try {
    status = await main(args, {
      out: (s) => { stdout += s }, err: (s) => { stderr += s }, env, stdoutTTY: false, stderrTTY: false
    })
  } catch (error) {
    // main turns every error into exit code 2 and a message; anything here is a bug in it.
    stderr += `in-process run threw: ${error instanceof Error ? error.stack : String(error)}\n`
    status = 70
  }
  port.postMessage({status, stdout, stderr})
  port.close()
  Atomics.store(signal, 0, 1)
  Atomics.notify(signal, 0)
})
