/**
 * Every sample design evaluates without errors, and its `check --json` output has exactly
 * the DESIGN §6 shape: field names, types, SI numbers, null (never NaN or Infinity) where a
 * value does not exist.
 */
import {describe, expect, it} from 'vitest'
import {readdirSync, readFileSync} from 'node:fs'
import {join} from 'node:path'
import {ROOT, runCli} from './cli/helpers.js'
import {TOPOLOGIES} from '../src/engine/types.js'

const SAMPLES = readdirSync(join(ROOT, 'sample-designs')).filter((f) => f.endsWith('.md')).sort()
/** One starting note per topology (written by `ampreview new`), so all four are covered. */
const TOPOLOGY_NOTES = readdirSync(join(ROOT, 'test', 'fixtures', 'topologies')).filter((f) => f.endsWith('.md')).sort()

type Json = Record<string, unknown>
const isNum = (v: unknown): boolean => typeof v === 'number' && Number.isFinite(v)
const isNumOrNull = (v: unknown): boolean => v === null || isNum(v)

function checkStage(s: Json): void {
  expect(Object.keys(s)).toEqual(['id', 'topology', 'opamp', 'gain', 'noiseGain', 'dc', 'noise', 'stability', 'filter', 'requirements', 'notes', 'role', 'alternatives', 'yield'])
  expect(['design', 'baseline']).toContain(s['role'])
  // DESIGN §8.7: null when off, else the yield object with its results, percentiles and variance shares.
  const y = s['yield'] as Json | null
  if (y !== null) {
    expect(Object.keys(y)).toEqual(['trials', 'seed', 'distribution', 'unavailable', 'results', 'basis', 'worstCase', 'errorPercentiles', 'maxError', 'variance', 'varianceAt', 'varianceRows'])
    for (const r of y['results'] as Json[]) expect(isNum(r['yield']) && (r['interval'] as number[]).every(isNum)).toBe(true)
    if (y['unavailable'] === null) expect(Object.values(y['errorPercentiles'] as Json).every(isNum)).toBe(true)
  }
  expect(typeof s['id']).toBe('string')
  expect(TOPOLOGIES as readonly unknown[]).toContain(s['topology'])
  expect(isNum(s['gain']) && isNum(s['noiseGain'])).toBe(true)
  const dc = s['dc'] as Json
  expect(Object.keys(dc)).toEqual(['temperatureSpan', 'fullScaleOutput', 'contributors', 'worstCaseOutput', 'rssOutput', 'worstCaseInput', 'rssInput', 'calibrated', 'networkCmrr'])
  expect(isNumOrNull(dc['networkCmrr'])).toBe(true)
  expect(s['topology'] === 'difference' || dc['networkCmrr'] === null).toBe(true)
  for (const c of dc['contributors'] as Json[]) expect(typeof c['key'] === 'string' && isNum(c['output'])).toBe(true)
  // DESIGN §4.6: null without calibration, else the residuals with their totals.
  const cal = dc['calibrated'] as Json | null
  if (cal !== null) {
    expect(Object.keys(cal)).toEqual(['calibration', 'contributors', 'worstCaseOutput', 'rssOutput', 'worstCaseInput', 'rssInput'])
    expect((cal['contributors'] as Json[]).map((c) => c['key'])).toEqual((dc['contributors'] as Json[]).map((c) => c['key']))
  }
  const noise = s['noise'] as Json
  expect(Object.keys(noise)).toEqual(['band', 'temperature', 'outputRms', 'zeroSignalOutputRms', 'outputPeakToPeak', 'inputRms', 'contributors'])
  expect(noise['zeroSignalOutputRms'] as number).toBeLessThanOrEqual(noise['outputRms'] as number)
  expect((noise['band'] as unknown[]).every(isNum)).toBe(true)
  expect(noise['temperature'] as number).toBeGreaterThan(200) // kelvin, not °C
  for (const c of noise['contributors'] as Json[]) expect(typeof c['key'] === 'string' && isNum(c['outputRms'])).toBe(true)
  const st = s['stability'] as Json
  expect(Object.keys(st)).toEqual(['phaseMargin', 'crossover', 'bandwidth', 'peaking', 'suggestedCf'])
  expect(['phaseMargin', 'crossover', 'bandwidth', 'suggestedCf'].every((k) => isNumOrNull(st[k])) && isNum(st['peaking'])).toBe(true)
  const filter = s['filter'] as Json | null
  const lowpass = s['topology'] === 'lowpass-sallen-key' || s['topology'] === 'lowpass-mfb'
  if (lowpass) expect(Object.keys(filter as Json)).toEqual(['f0', 'q', 'passbandGain'])
  else expect(filter).toBeNull()
  const kinds = (s['requirements'] as Json[]).map((r) => r['kind'])
  // The author's requirements first, then the four limits of DESIGN §4.6.
  expect(kinds.slice(-4)).toEqual(['limit', 'limit', 'limit', 'limit'])
  expect(kinds.slice(0, -4).every((k) => k === 'require')).toBe(true)
  const pair = (v: unknown): boolean => Array.isArray(v) && v.length === 2 && v.every(isNumOrNull)
  for (const r of s['requirements'] as Json[]) {
    if (r['kind'] === 'require') {
      expect(Object.keys(r)).toEqual(['key', 'kind', 'limit', 'value', 'met'])
      expect(isNum(r['limit']) && isNumOrNull(r['value']) && typeof r['met'] === 'boolean').toBe(true)
      continue
    }
    expect(Object.keys(r).slice(0, 5)).toEqual(['key', 'kind', 'limit', 'value', 'met'])
    expect(r['met'] === null || typeof r['met'] === 'boolean').toBe(true)
    if (r['key'] === 'output-swing' || r['key'] === 'input-common-mode') expect(pair(r['value']) && (r['limit'] === null || pair(r['limit']))).toBe(true)
    else expect(isNum(r['value']) && isNumOrNull(r['limit'])).toBe(true)
  }
  // DESIGN §8.8: null unless asked for; else one row per candidate, the one in use and the best marked once.
  const alts = s['alternatives'] as Json[] | null
  if (alts !== null) {
    for (const a of alts) {
      expect(Object.keys(a)).toEqual(['candidate', 'inputType', 'worstCaseOutput', 'outputRms', 'phaseMargin', 'dominant', 'met', 'current', 'best'])
      expect(isNum(a['worstCaseOutput']) && isNum(a['outputRms']) && isNumOrNull(a['phaseMargin'])).toBe(true)
      expect(Object.keys(a['met'] as Json)).toEqual((s['requirements'] as Json[]).map((r) => r['key']))
    }
    expect(alts.filter((a) => a['current'] === true).map((a) => a['candidate'])).toEqual([s['opamp']])
    expect(alts.filter((a) => a['best'] === true)).toHaveLength(1)
  }
  for (const n of s['notes'] as Json[]) {
    expect(Object.keys(n)).toEqual(['rule', 'severity', 'text', 'accepted'])
    expect(n['accepted'] === null || typeof n['accepted'] === 'string').toBe(true)
    expect(['info', 'caution', 'warning', 'safety']).toContain(n['severity'])
  }
}

describe('sample designs', () => {
  it('are three or more', () => {
    expect(SAMPLES.length).toBeGreaterThanOrEqual(3)
  })

  it('with the topology notes, cover every topology', () => {
    const topologies = new Set<string>()
    for (const path of [...SAMPLES.map((n) => join('sample-designs', n)), ...TOPOLOGY_NOTES.map((n) => join('test', 'fixtures', 'topologies', n))]) {
      const out = JSON.parse(runCli(['check', '--json', path]).stdout) as {files: {stages: {topology: string}[]}[]}
      for (const s of out.files[0]!.stages) topologies.add(s.topology)
    }
    expect([...topologies].sort()).toEqual([...TOPOLOGIES].sort())
  })

  it.each([
    ...SAMPLES.map((n) => join('sample-designs', n)),
    ...TOPOLOGY_NOTES.map((n) => join('test', 'fixtures', 'topologies', n))
  ])('%s evaluates with no error and a §6-shaped --json result', (path) => {
    const r = runCli(['check', '--json', path])
    expect([0, 1]).toContain(r.status)
    expect(r.stderr).not.toMatch(/: error: /)
    const out = JSON.parse(r.stdout) as {files: Json[]}
    expect(out.files).toHaveLength(1)
    const f = out.files[0]!
    expect(Object.keys(f)).toEqual(['file', 'sourceSha256', 'diagnostics', 'stages', 'chains'])
    for (const c of f['chains'] as Json[]) {
      expect(Object.keys(c)).toEqual(['id', 'stages', 'gain', 'bandwidth', 'rangeUsed', 'dc', 'noise', 'aliasRejection', 'requirements', 'notes'])
      expect(Object.keys(c['dc'] as Json)).toEqual(['contributors', 'worstCaseOutput', 'rssOutput', 'worstCaseInput', 'worstCaseLsb', 'calibrated'])
      expect(Object.keys(c['noise'] as Json)).toEqual(['outputRms', 'zeroSignalOutputRms', 'inputRms', 'converterRms', 'noiseFreeBits', 'effectiveBits', 'widebandRms'])
    }
    expect((f['stages'] as Json[]).length).toBeGreaterThan(0)
    for (const s of f['stages'] as Json[]) checkStage(s)
  })

  it('are described truthfully by the demo script: exit 0, the baseline stage it names misses its own on purpose', () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as {scripts: Record<string, string>}
    const demo = pkg.scripts['demo'] ?? ''
    // No fallback that turns a failing build into a message: the demo fails when a sample does.
    expect(demo).not.toMatch(/\|\|/)
    expect(demo).toContain('every sample meets its requirements (exit 0)')
    const named = /baseline stage ([a-z0-9-]+) in ([a-z0-9-]+\.md)/.exec(demo)
    expect(named).not.toBeNull()
    const r = runCli(['check', join('sample-designs', named![2]!)])
    expect(r.status).toBe(0)
    expect(r.stderr).toContain(`of baseline stage \`${named![1]}\` not met`)
  })

  it('include one whose alternatives show a FET or CMOS input making the compensation resistor pointless', () => {
    const r = runCli(['check', '--json', join('sample-designs', 'soil-potential-input.md')])
    expect(r.status).toBe(0)
    type Alt = {candidate: string; inputType: string; worstCaseOutput: number; outputRms: number; met: Record<string, boolean | null>}
    const stages = (JSON.parse(r.stdout) as {files: {stages: {id: string; requirements: {met: boolean | null}[]; alternatives: Alt[] | null}[]}[]}).files[0]!.stages
    const withRcomp = stages.find((s) => s.id === 'probe-amp')!
    const without = stages.find((s) => s.id === 'probe-amp-cmos')!
    for (const s of [withRcomp, without]) expect(s.requirements.every((q) => q.met !== false)).toBe(true)
    const alt = (s: typeof withRcomp, name: string): Alt => s.alternatives!.find((a) => a.candidate === name)!
    // The bipolar part needs its rcomp: met with it, not met without.
    expect(alt(withRcomp, 'stock-bipolar').met['output-error']).toBe(true)
    expect(alt(without, 'stock-bipolar').met['output-error']).toBe(false)
    // Every JFET and CMOS candidate meets the DC budget without rcomp, and the resistor only adds noise.
    const fets = without.alternatives!.filter((a) => a.inputType === 'jfet' || a.inputType === 'cmos')
    expect(fets.map((a) => a.candidate).sort()).toEqual(['candidate-cmos', 'precision-cmos', 'precision-jfet'])
    for (const a of fets) {
      expect(a.met['output-error']).toBe(true)
      expect(alt(withRcomp, a.candidate).outputRms).toBeGreaterThan(a.outputRms)
      expect(Math.abs(alt(withRcomp, a.candidate).worstCaseOutput - a.worstCaseOutput)).toBeLessThan(0.02 * a.worstCaseOutput)
    }
  })

  it('include a baseline stage whose requirements are deliberately not met: shown, yet the run passes', () => {
    const r = runCli(['check', 'sample-designs'])
    expect(r.status).toBe(0)
    expect(r.stderr).toMatch(/info: Requirement `[a-z-]+` of baseline stage `ref-buffer` not met/)
  })
})
