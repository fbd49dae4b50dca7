/**
 * The stage key `yield: { trials: 100k, seed: 1, distribution: uniform }` (DESIGN §8.7): a
 * map of three optional keys, each with a positioned error for a bad value. `yield: on`
 * (or `true`) takes the defaults; `yield: off` (or `false`) leaves it off.
 */
import {YIELD_DISTRIBUTIONS, type YieldOptions} from '../engine/types.js'
import {DEFAULT_YIELD_TRIALS} from '../engine/constants.js'
import type {Field} from './block-yaml.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {noteMessages} from './messages.js'
import {choiceOf, scalarOf} from './values.js'

/** Largest trial count of a stage (two Float64Arrays of errors are kept: 160 MB at this count). */
export const MAX_YIELD_TRIALS = 10_000_000
const YIELD_MAP_KEYS = ['trials', 'seed', 'distribution'] as const

/** `100k`, `1M`, `20000`, `2.5k`: a whole number of trials (k = 10³, M = 10⁶). */
export function parseTrials(text: string): number | null {
  const m = /^(\d+(?:\.\d+)?)\s*([kM]?)$/.exec(text.trim())
  if (m === null) return null
  const v = Number(m[1]) * (m[2] === 'k' ? 1e3 : m[2] === 'M' ? 1e6 : 1)
  return Number.isInteger(v) ? v : null
}

/** The `yield` field of a stage: its options, or null (off, or an error reported). */
export function readYield(field: Field, report: Reporter): YieldOptions | null {
  const v = field.value
  const options: YieldOptions = {trials: DEFAULT_YIELD_TRIALS, seed: 1, distribution: 'uniform'}
  if (v.type === 'scalar') {
    const word = v.text?.trim() ?? ''
    if (word === 'on' || word === 'true') return options
    if (word === 'off' || word === 'false') return null
    report.error(noteMessages.yieldNotMap(word), v.at(0), 'bad-value')
    return null
  }
  if (v.type !== 'map') {
    report.error(noteMessages.yieldNotMap(''), v.at, 'bad-value')
    return null
  }
  let ok = true
  for (const sub of v.fields) {
    const name = sub.key.slice('yield.'.length)
    if (name === 'trials') {
      const s = scalarOf(sub, 'a number of trials', report)
      if (s === null) {
        ok = false
        continue
      }
      const n = parseTrials(s.text)
      if (n === null || n < 1 || n > MAX_YIELD_TRIALS) {
        report.error(noteMessages.yieldTrials(s.text.trim(), MAX_YIELD_TRIALS), s.at(0), 'bad-value')
        ok = false
      } else options.trials = n
    } else if (name === 'seed') {
      const s = scalarOf(sub, 'a seed', report)
      if (s === null) {
        ok = false
        continue
      }
      const t = s.text.trim()
      const n = /^\d+$/.test(t) ? Number(t) : NaN
      if (!(Number.isSafeInteger(n) && n <= 0xffffffff)) {
        report.error(noteMessages.yieldSeed(t), s.at(0), 'bad-value')
        ok = false
      } else options.seed = n
    } else if (name === 'distribution') {
      const d = choiceOf(sub, YIELD_DISTRIBUTIONS, report)
      if (d === null) ok = false
      else options.distribution = d
    } else {
      const suggestion = didYouMean(name, YIELD_MAP_KEYS)
      report.error(noteMessages.yieldUnknownKey(name, suggestion, YIELD_MAP_KEYS), sub.keyAt, 'unknown-key', {
        actual: name, ...(suggestion ? {expected: [suggestion]} : {})
      })
      ok = false
    }
  }
  return ok ? options : null
}
