/**
 * Worker thread for the fuzz tests: runs one input through the compiled note reader,
 * quantity grammar and evaluate phase (dist/, built by test/global-setup.ts) and checks
 * the invariants that hold for every input, whatever it is. It runs off the test's thread
 * so that an input that hangs the parser can be caught by fast-check's `timeout` (a
 * synchronous loop on the test's own thread would block the timer that should stop it).
 *
 * Message in: {id, kind: 'quantity' | 'range' | 'supply' | 'resistor' | 'note', text, dim?}.
 * Message out: {id, problems: string[]}; an exception is a problem too, with its stack.
 */
import {writeFileSync} from 'node:fs'
import {parentPort} from 'node:worker_threads'
import {VFile} from 'vfile'
import {parseQuantity, parseRange, parseResistor, parseSupply} from '../../dist/units/index.js'
import {parseNote} from '../../dist/note/index.js'
import {evaluateNote} from '../../dist/evaluate/index.js'
import {jsonStage} from '../../dist/results/json.js'

const finite = (x) => typeof x === 'number' && Number.isFinite(x)

/** A failed parse must say something and point inside (or just after) the text. */
function failure(r, text, problems) {
  if (typeof r.message !== 'string' || r.message.trim() === '') problems.push('empty message')
  if (/\bundefined\b|\bNaN\b|\[object /.test(r.message) && !/NaN/.test(text)) problems.push(`message shows an internal value: ${r.message}`)
  if (!Number.isInteger(r.offset) || r.offset < 0 || r.offset > text.length) problems.push(`offset ${r.offset} outside 0..${text.length}`)
}

function checkQuantity(text, dim, problems) {
  const r = parseQuantity(text, dim)
  if (!r.ok) return failure(r, text, problems)
  if (!finite(r.value)) problems.push(`accepted a non-finite value ${r.value}`)
  // Temperatures carry the kelvin offset; every other value is SI as written.
  else if (Math.abs(r.value) > 1e18 + (dim === 'temperature' ? 273.15 : 0)) problems.push(`accepted ${r.value}, beyond 10^18`)
  else if (dim !== 'temperature' && r.value !== 0 && Math.abs(r.value) < 1e-24) problems.push(`accepted ${r.value}, below 10^-24`)
}

function checkRange(text, dim, problems) {
  const r = parseRange(text, dim, {single: dim === 'temperature' ? 'point' : 'from-zero'})
  if (!r.ok) return failure(r, text, problems)
  const [lo, hi] = r.value
  if (!finite(lo) || !finite(hi)) problems.push(`accepted non-finite ends ${lo} .. ${hi}`)
  if (!(lo <= hi)) problems.push(`accepted a reversed range ${lo} .. ${hi}`)
}

function checkSupply(text, problems) {
  const r = parseSupply(text)
  if (!r.ok) return failure(r, text, problems)
  const [lo, hi] = r.value
  if (!finite(lo) || !finite(hi) || !(lo < hi)) problems.push(`accepted supply ${lo} .. ${hi}`)
}

function checkResistor(text, problems) {
  const r = parseResistor(text)
  if (!r.ok) return failure(r, text, problems)
  const {value, tolerance, tempco} = r.value
  if (!finite(value)) problems.push(`accepted a non-finite resistance ${value}`)
  if (!(tolerance >= 0 && tolerance < 1)) problems.push(`accepted tolerance ${tolerance}`)
  if (!(finite(tempco) && tempco >= 0)) problems.push(`accepted tempco ${tempco}`)
}

/** Non-finite numbers anywhere in a §6 JSON stage, by path. */
function nonFinite(value, path, out) {
  if (typeof value === 'number' && !Number.isFinite(value)) out.push(path)
  else if (Array.isArray(value)) value.forEach((v, i) => nonFinite(v, `${path}[${i}]`, out))
  else if (value !== null && typeof value === 'object') for (const [k, v] of Object.entries(value)) nonFinite(v, `${path}.${k}`, out)
  return out
}

function checkNote(text, problems) {
  const file = new VFile({path: 'fuzz.md', value: text})
  const parsed = parseNote(file)
  const lines = text.split(/\r\n|\r|\n/).length
  for (const m of file.messages) {
    if (!(Number.isInteger(m.line) && m.line >= 1 && m.line <= lines + 1)) problems.push(`message without a valid line (${m.line}): ${m.reason}`)
    if (!(Number.isInteger(m.column) && m.column >= 1)) problems.push(`message without a valid column (${m.column}): ${m.reason}`)
    if (/\bundefined\b|\[object /.test(m.reason)) problems.push(`message shows an internal value: ${m.reason}`)
  }
  const evaluations = evaluateNote(parsed, file)
  for (const m of file.messages) {
    if (m.ruleId === 'evaluation-failed') problems.push(`engine failed on an accepted stage: ${m.reason}`)
  }
  for (const ev of evaluations) {
    for (const path of nonFinite(jsonStage(ev), ev.input.id, [])) problems.push(`non-finite number in the result at ${path}`)
  }
}

const trace = process.env.FUZZ_TRACE
parentPort.on('message', ({id, kind, text, dim}) => {
  // FUZZ_TRACE=FILE: write each input before running it, to find one that hangs.
  if (trace) writeFileSync(trace, JSON.stringify({kind, dim, text}))
  const problems = []
  try {
    if (kind === 'quantity') checkQuantity(text, dim, problems)
    else if (kind === 'range') checkRange(text, dim, problems)
    else if (kind === 'supply') checkSupply(text, problems)
    else if (kind === 'resistor') checkResistor(text, problems)
    else checkNote(text, problems)
  } catch (error) {
    problems.push(`threw: ${error instanceof Error ? error.stack : String(error)}`)
  }
  parentPort.postMessage({id, problems})
})
