/**
 * A module-load trace, preloaded with `node --import ./test/bench/load-trace.mjs`: every
 * ES module the process loads (a line `module URL`) and every font file it reads (a line
 * `font PATH`) are appended to the file named by AMPREVIEW_LOAD_TRACE. Used by the bench and
 * by test/cli/load-trace.test.ts to show what `check` loads.
 */
import fs from 'node:fs'
import {register, syncBuiltinESMExports} from 'node:module'

const out = process.env['AMPREVIEW_LOAD_TRACE']
if (out) {
  const hooks = `
    import {appendFileSync} from 'node:fs'
    export async function load(url, context, next) {
      appendFileSync(${JSON.stringify(out)}, 'module ' + url + '\\n')
      return next(url, context)
    }`
  register(`data:text/javascript,${encodeURIComponent(hooks)}`)
  const isFont = (p) => typeof p === 'string' && /\.(ttf|otf|afm|woff2?)$/i.test(p)
  const log = (p) => { if (isFont(String(p))) fs.appendFileSync(out, `font ${String(p)}\n`) }
  const {readFile, readFileSync} = fs
  const promisesReadFile = fs.promises.readFile
  fs.readFileSync = function (p, ...rest) { log(p); return readFileSync.call(this, p, ...rest) }
  fs.readFile = function (p, ...rest) { log(p); return readFile.call(this, p, ...rest) }
  fs.promises.readFile = function (p, ...rest) { log(p); return promisesReadFile.call(this, p, ...rest) }
  syncBuiltinESMExports()
}
