/**
 * Comparing two runs (DESIGN §6 objects): every value of every stage that changed, old →
 * new and by how much, and every requirement verdict that flipped. Pure; the CLI loads
 * the two sides and prints the result as text or Markdown.
 */
import {TOPOLOGIES, type RequirementKey, type Topology} from '../engine/types.js'
import {formatQuantity, formatSlew} from '../units/format.js'
import {gainUnit, inputUnit, requirementUnit} from './labels.js'
import type {JsonAlternative, JsonStage} from './json.js'
import type {JsonChain} from './chain-json.js'
import {CHAIN_REQUIREMENT_KEYS} from '../engine/chain/types.js'

/** The parts of a stage's §6 object that a comparison reads (older result files may lack the topology). */
type StageJson = Pick<JsonStage, 'id' | 'gain' | 'noiseGain' | 'requirements'> & {
  topology?: string
  dc: Pick<JsonStage['dc'], 'contributors' | 'worstCaseOutput' | 'rssOutput' | 'worstCaseInput' | 'rssInput'>
  noise: Pick<JsonStage['noise'], 'outputRms' | 'outputPeakToPeak' | 'inputRms' | 'contributors'>
  stability: JsonStage['stability']
  /** Absent in result files written before the Monte Carlo (DESIGN §8.7). */
  yield?: JsonStage['yield']
  /** Absent in results written before alternatives existed (DESIGN §8.8). */
  alternatives?: Pick<JsonAlternative, 'candidate' | 'worstCaseOutput' | 'outputRms' | 'phaseMargin'>[] | null
}

/** The parts of a run (`JsonRun`, declared once in ./json.ts) that a comparison reads. */
export interface RunJson {
  files: {file: string; stages: StageJson[]; chains?: ChainJson[]}[]
}

/** The parts of a chain's §8.6 object that a comparison reads. */
type ChainJson = Pick<JsonChain, 'id' | 'gain' | 'bandwidth' | 'rangeUsed' | 'aliasRejection' | 'requirements'> & {
  dc: Pick<JsonChain['dc'], 'worstCaseOutput' | 'rssOutput' | 'worstCaseInput' | 'worstCaseLsb'>
  noise: JsonChain['noise']
  /** Absent in results written before chains had a Monte Carlo. */
  yield?: JsonChain['yield']
}

/** A chain's values by dotted name (units: V at the converter, LSB, bits, dB). */
function chainValues(c: ChainJson): Map<string, {unit: string; v: number | null}> {
  const m = new Map<string, {unit: string; v: number | null}>()
  m.set('gain', {unit: 'V/V', v: c.gain})
  m.set('bandwidth', {unit: 'Hz', v: c.bandwidth})
  m.set('rangeUsed', {unit: '', v: c.rangeUsed})
  for (const k of ['worstCaseOutput', 'rssOutput', 'worstCaseInput'] as const) m.set(`dc.${k}`, {unit: 'V', v: c.dc[k]})
  m.set('dc.worstCaseLsb', {unit: 'LSB', v: c.dc.worstCaseLsb})
  for (const k of ['outputRms', 'zeroSignalOutputRms', 'inputRms', 'converterRms', 'widebandRms'] as const) m.set(`noise.${k}`, {unit: 'V', v: c.noise[k]})
  for (const k of ['noiseFreeBits', 'effectiveBits'] as const) m.set(`noise.${k}`, {unit: 'bits', v: c.noise[k]})
  m.set('aliasRejection', {unit: 'dB', v: c.aliasRejection})
  for (const r of c.requirements) if (r.kind === 'require') m.set(`require.${r.key}`, {unit: CHAIN_REQUIREMENT_KEYS[r.key]?.unit === 'input' ? 'V' : CHAIN_REQUIREMENT_KEYS[r.key]?.unit ?? '', v: r.value})
  // The chain's Monte Carlo (DESIGN §8.7), as for a stage: each requirement's yield, the error's percentiles (V at the converter).
  const y = c.yield ?? null
  if (y !== null) {
    for (const r of y.results) {
      m.set(`yield.${r.key}`, {unit: '%', v: r.yield})
      m.set(`yield.${r.key}.low`, {unit: '%', v: r.interval[0]})
    }
    if (y.errorPercentiles !== null) for (const k of ['p50', 'p99', 'p999'] as const) m.set(`yield.error.${k}`, {unit: 'V', v: y.errorPercentiles[k]})
  }
  return m
}

/** Chains by `chain <id>`; prefixed by the note's file name when either side holds several notes. */
function chainsOf(run: RunJson, multi: boolean): Map<string, ChainJson> {
  const out = new Map<string, ChainJson>()
  for (const f of run.files) for (const c of f.chains ?? []) out.set(`${multi ? `${f.file.split('/').pop()}/` : ''}chain ${c.id}`, c)
  return out
}

export interface ValueChange {
  stage: string
  /** Dotted name, e.g. `dc.worstCaseOutput` or `noise.en`. */
  name: string
  unit: string
  old: number | null
  new: number | null
}

export interface VerdictFlip {
  stage: string
  requirement: string
  old: boolean | null
  new: boolean | null
}

export interface Comparison {
  changes: ValueChange[]
  flips: VerdictFlip[]
  addedStages: string[]
  removedStages: string[]
  /** True when some requirement went from met to not met (or a met requirement disappeared with its stage). */
  regressed: boolean
}

const REL = 1e-9

/** Units follow the topology: a transimpedance stage's input is a current and its gain is in Ω. */
function values(s: StageJson): Map<string, {unit: string; v: number | null}> {
  const t: Topology = (TOPOLOGIES as readonly string[]).includes(s.topology ?? '') ? s.topology as Topology : 'noninverting'
  const m = new Map<string, {unit: string; v: number | null}>()
  m.set('gain', {unit: gainUnit(t), v: s.gain})
  m.set('noiseGain', {unit: 'V/V', v: s.noiseGain})
  for (const k of ['worstCaseOutput', 'rssOutput'] as const) m.set(`dc.${k}`, {unit: 'V', v: s.dc[k]})
  for (const k of ['worstCaseInput', 'rssInput'] as const) m.set(`dc.${k}`, {unit: inputUnit(t), v: s.dc[k]})
  for (const c of s.dc.contributors) m.set(`dc.${c.key}`, {unit: 'V', v: c.output})
  for (const k of ['outputRms', 'outputPeakToPeak'] as const) m.set(`noise.${k}`, {unit: 'V', v: s.noise[k]})
  m.set('noise.inputRms', {unit: inputUnit(t), v: s.noise.inputRms})
  for (const c of s.noise.contributors) m.set(`noise.${c.key}`, {unit: 'V', v: c.outputRms})
  m.set('stability.phaseMargin', {unit: '°', v: s.stability.phaseMargin})
  m.set('stability.crossover', {unit: 'Hz', v: s.stability.crossover})
  m.set('stability.bandwidth', {unit: 'Hz', v: s.stability.bandwidth})
  m.set('stability.peaking', {unit: 'dB', v: s.stability.peaking})
  m.set('stability.suggestedCf', {unit: 'F', v: s.stability.suggestedCf})
  // The Monte Carlo (DESIGN §8.7): each requirement's yield, the percentiles of the error.
  const y = s.yield ?? null
  if (y !== null && y !== undefined) {
    for (const r of y.results) {
      m.set(`yield.${r.key}`, {unit: '%', v: r.yield})
      m.set(`yield.${r.key}.low`, {unit: '%', v: r.interval[0]})
    }
    if (y.errorPercentiles !== null) for (const k of ['p50', 'p99', 'p999'] as const) m.set(`yield.error.${k}`, {unit: 'V', v: y.errorPercentiles[k]})
  }
  for (const r of s.requirements) {
    if (r.kind !== 'limit') m.set(`require.${r.key}`, {unit: requirementUnit(r.key as RequirementKey, t) ?? 'V', v: typeof r.value === 'number' ? r.value : null})
    else if (typeof r.value === 'number') m.set(`limit.${r.key}`, {unit: r.key === 'slew' ? 'V/s' : r.key === 'output-current' ? 'A' : 'V', v: r.value})
  }
  // Alternatives are figures, not verdicts: their changes are listed, never counted as a regression.
  for (const a of s.alternatives ?? []) {
    m.set(`alternatives.${a.candidate}.worstCaseOutput`, {unit: 'V', v: a.worstCaseOutput})
    m.set(`alternatives.${a.candidate}.outputRms`, {unit: 'V', v: a.outputRms})
    m.set(`alternatives.${a.candidate}.phaseMargin`, {unit: '°', v: a.phaseMargin})
  }
  return m
}

/** A change worth printing: appeared or vanished, or moved by more than `threshold` (relative; at least rounding noise). */
const differs = (a: number | null, b: number | null, threshold: number): boolean =>
  a === null || b === null ? a !== b : Math.abs(a - b) > Math.max(threshold, REL) * Math.max(Math.abs(a), Math.abs(b), 1e-30)

export interface CompareOptions {
  /** Relative change below which a value is left out, a fraction (default 0: every change). Verdict flips are always listed. */
  threshold?: number
}

/** Stages by id; prefixed by the note's file name when either side holds several notes. */
function stagesOf(run: RunJson, multi: boolean): Map<string, StageJson> {
  const out = new Map<string, StageJson>()
  for (const f of run.files) for (const s of f.stages) out.set(multi ? `${f.file.split('/').pop()}/${s.id}` : s.id, s)
  return out
}

export function compareRuns(oldRun: RunJson, newRun: RunJson, opts: CompareOptions = {}): Comparison {
  const threshold = opts.threshold ?? 0
  const multi = oldRun.files.length > 1 || newRun.files.length > 1
  const a = stagesOf(oldRun, multi)
  const b = stagesOf(newRun, multi)
  const changes: ValueChange[] = []
  const flips: VerdictFlip[] = []
  for (const [id, so] of a) {
    const sn = b.get(id)
    if (!sn) continue
    const vo = values(so)
    const vn = values(sn)
    for (const name of new Set([...vo.keys(), ...vn.keys()])) {
      const o = vo.get(name)?.v ?? null
      const n = vn.get(name)?.v ?? null
      if (differs(o, n, threshold)) changes.push({stage: id, name, unit: (vo.get(name) ?? vn.get(name))!.unit, old: o, new: n})
    }
    const ro = new Map(so.requirements.map((r) => [r.key, r.met]))
    const rn = new Map(sn.requirements.map((r) => [r.key, r.met]))
    for (const key of new Set([...ro.keys(), ...rn.keys()])) {
      const o = ro.get(key) ?? null
      const n = rn.get(key) ?? null
      if (o !== n) flips.push({stage: id, requirement: key, old: o, new: n})
    }
  }
  const ca = chainsOf(oldRun, multi)
  const cb = chainsOf(newRun, multi)
  for (const [id, co] of ca) {
    const cn = cb.get(id)
    if (!cn) continue
    const vo = chainValues(co)
    const vn = chainValues(cn)
    for (const name of new Set([...vo.keys(), ...vn.keys()])) {
      const o = vo.get(name)?.v ?? null
      const n = vn.get(name)?.v ?? null
      if (differs(o, n, threshold)) changes.push({stage: id, name, unit: (vo.get(name) ?? vn.get(name))!.unit, old: o, new: n})
    }
    const ro = new Map(co.requirements.map((r) => [r.key, r.met] as const))
    const rn = new Map(cn.requirements.map((r) => [r.key, r.met] as const))
    for (const key of new Set([...ro.keys(), ...rn.keys()])) {
      const o = ro.get(key) ?? null
      const n = rn.get(key) ?? null
      if (o !== n) flips.push({stage: id, requirement: key, old: o, new: n})
    }
  }
  const removedStages = [...[...a.keys()].filter((k) => !b.has(k)), ...[...ca.keys()].filter((k) => !cb.has(k))]
  const addedStages = [...[...b.keys()].filter((k) => !a.has(k)), ...[...cb.keys()].filter((k) => !ca.has(k))]
  const regressed = flips.some((f) => f.old === true && f.new === false) ||
    removedStages.some((id) => (a.get(id)?.requirements ?? ca.get(id)?.requirements ?? []).some((r) => r.met === true))
  return {changes, flips, addedStages, removedStages, regressed}
}

const show = (v: number | null, unit: string): string =>
  v === null ? 'none' : unit === '%' ? `${(v * 100).toFixed(3)} %` : unit === '°' ? `${v.toFixed(2)}°` : unit === 'dB' ? `${v.toFixed(2)} dB`
    : unit === 'LSB' || unit === 'bits' ? `${v.toFixed(2)} ${unit}` : unit === '' ? v.toFixed(4) : unit === 'V/s' ? formatSlew(v, {digits: 4}) : formatQuantity(v, unit, {digits: 4})

const delta = (c: ValueChange): string => {
  if (c.old === null || c.new === null) return ''
  const d = c.new - c.old
  const sign = d >= 0 ? '+' : '−'
  // A yield moves in percentage points; a relative change of a percentage would read twice.
  if (c.unit === '%') return `${sign}${(Math.abs(d) * 100).toFixed(3)} percentage points`
  const rel = c.old !== 0 ? ` (${sign}${Math.abs((d / c.old) * 100).toFixed(2)} %)` : ''
  return `${sign}${show(Math.abs(d), c.unit)}${rel}`
}

const verdictWord = (m: boolean | null): string => (m === null ? 'absent' : m ? 'met' : 'NOT MET')

export function comparisonText(c: Comparison, markdown: boolean): string {
  const lines: string[] = []
  if (markdown) lines.push('## ampreview comparison', '')
  if (c.changes.length === 0 && c.flips.length === 0 && c.addedStages.length === 0 && c.removedStages.length === 0) {
    lines.push('No value or verdict changed.')
    return `${lines.join('\n')}\n`
  }
  if (c.flips.length > 0) {
    if (markdown) lines.push('| Stage | Requirement | Old | New |', '| --- | --- | --- | --- |')
    for (const f of c.flips) {
      lines.push(markdown ? `| ${f.stage} | \`${f.requirement}\` | ${verdictWord(f.old)} | ${verdictWord(f.new)} |`
        : `verdict ${f.stage} ${f.requirement}: ${verdictWord(f.old)} → ${verdictWord(f.new)}`)
    }
    if (markdown) lines.push('')
  }
  for (const s of c.addedStages) lines.push(markdown ? `- stage **${s}** added` : `stage ${s}: added`)
  for (const s of c.removedStages) lines.push(markdown ? `- stage **${s}** removed` : `stage ${s}: removed`)
  if (c.changes.length > 0) {
    if (markdown) lines.push('', '| Stage | Value | Old | New | Change |', '| --- | --- | --- | ---: | ---: |')
    for (const ch of c.changes) {
      lines.push(markdown ? `| ${ch.stage} | \`${ch.name}\` | ${show(ch.old, ch.unit)} | ${show(ch.new, ch.unit)} | ${delta(ch)} |`
        : `${ch.stage} ${ch.name}: ${show(ch.old, ch.unit)} → ${show(ch.new, ch.unit)} ${delta(ch)}`.trimEnd())
    }
  }
  if (c.regressed) lines.push('', markdown ? '**A requirement went from met to not met.**' : 'A requirement went from met to not met.')
  return `${lines.join('\n')}\n`
}
