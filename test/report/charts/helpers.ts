/**
 * Hand-built engine results for the chart tests (invented numbers, computed here from simple
 * closed forms), the DejaVu fonts read from the package, and small SVG readers.
 */
import {readFileSync} from 'node:fs'
import {fileURLToPath} from 'node:url'
import {NOISE_KEYS, type DcBudget, type NoiseKey, type Stability, type StageCurves} from '../../../src/engine/types.js'
import type {ChartFonts} from '../../../src/render/chart/vega.js'

const ttf = (name: string) =>
  new Uint8Array(readFileSync(fileURLToPath(new URL(`../../../node_modules/dejavu-fonts-ttf/ttf/${name}`, import.meta.url))))

/** DejaVu Sans regular and bold, read once. */
export const FONTS: ChartFonts = {regular: ttf('DejaVuSans.ttf'), bold: ttf('DejaVuSans-Bold.ttf')}

/** n points per decade from lo to hi inclusive, Hz. */
export function logGrid(lo: number, hi: number, perDecade: number): number[] {
  const n = Math.round(Math.log10(hi / lo) * perDecade)
  return Array.from({length: n + 1}, (_, i) => lo * 10 ** (i / perDecade))
}

/** Invented stage: noise gain 11, en 7 nV/√Hz with a 4 Hz corner, rf 20 kΩ, rg 2 kΩ, 300 K. */
const NOISE_GAIN = 11
const KT4 = 4 * 1.380649e-23 * 300

/** Loop: A0 = 2·10⁵, first pole 15 Hz, second pole 500 kHz, β = 1/11. */
const LOOP = {a0: 2e5, p1: 15, p2: 500e3, beta: 1 / NOISE_GAIN}

export function loopGainAt(f: number): {magnitude: number; phase: number} {
  const magnitude = (LOOP.a0 * LOOP.beta) / Math.hypot(1, f / LOOP.p1) / Math.hypot(1, f / LOOP.p2)
  const phase = (-(Math.atan(f / LOOP.p1) + Math.atan(f / LOOP.p2)) * 180) / Math.PI
  return {magnitude, phase}
}

/** Crossover of the invented loop by bisection on log f, Hz. */
export function crossoverOf(): number {
  let lo = 1
  let hi = 1e9
  for (let i = 0; i < 200; i++) {
    const mid = Math.sqrt(lo * hi)
    if (loopGainAt(mid).magnitude > 1) lo = mid
    else hi = mid
  }
  return Math.sqrt(lo * hi)
}

export function stageCurves(): StageCurves {
  const noiseFrequency = logGrid(0.1, 10e3, 20)
  const zero = noiseFrequency.map(() => 0)
  const noiseDensity = Object.fromEntries(NOISE_KEYS.map((k) => [k, zero])) as Record<NoiseKey, number[]>
  noiseDensity.en = noiseFrequency.map((f) => 7e-9 * Math.sqrt(1 + 4 / f) * NOISE_GAIN)
  noiseDensity['r:rf'] = noiseFrequency.map(() => Math.sqrt(KT4 * 20e3))
  noiseDensity['r:rg'] = noiseFrequency.map(() => Math.sqrt(KT4 * 2e3) * 10)
  // 0.2 pA/√Hz through rf: about 4 nV/√Hz, kept.
  noiseDensity['in-'] = noiseFrequency.map((f) => 0.2e-12 * Math.sqrt(1 + 50 / f) * 20e3)
  // Far below 0.1 % of the total everywhere: left out.
  noiseDensity['in+'] = noiseFrequency.map(() => 1e-14)
  const noiseTotal = noiseFrequency.map((_, i) => Math.hypot(...NOISE_KEYS.map((k) => noiseDensity[k][i] as number)))
  const cumulativeRms: number[] = [0]
  let power = 0
  for (let i = 1; i < noiseFrequency.length; i++) {
    const df = (noiseFrequency[i] as number) - (noiseFrequency[i - 1] as number)
    power += (df * ((noiseTotal[i] as number) ** 2 + (noiseTotal[i - 1] as number) ** 2)) / 2
    cumulativeRms.push(Math.sqrt(power))
  }
  const frequency = logGrid(1, 100e6, 25)
  const loop = frequency.map(loopGainAt)
  return {
    noiseFrequency,
    noiseDensity,
    noiseTotal,
    noiseTotalZeroSignal: noiseTotal,
    cumulativeRms,
    frequency,
    loopGainMagnitude: loop.map((l) => l.magnitude),
    loopGainPhase: loop.map((l) => l.phase),
    closedLoopMagnitude: loop.map((l) => NOISE_GAIN * (l.magnitude / Math.hypot(1, l.magnitude))),
    // Not drawn by these charts (the low-pass response chart has its own data).
    closedLoopPhase: frequency.map(() => 0)
  }
}

export function stability(): Stability {
  const fc = crossoverOf()
  return {phaseMargin: 180 + loopGainAt(fc).phase, crossover: fc, bandwidth: fc * 1.2, peaking: 0.4, suggestedCf: null}
}

export function dcBudget(): DcBudget {
  return {
    temperatureSpan: 60,
    fullScaleOutput: 4.5,
    contributors: [
      {key: 'vos', output: 275e-6},
      {key: 'vos-drift', output: 66e-6},
      {key: 'ib', output: 1.1e-3},
      {key: 'ios', output: 0},
      {key: 'cmrr', output: 14e-6},
      {key: 'psrr', output: 3.2e-6},
      {key: 'aol-gain', output: 0.25e-3},
      {key: 'resistor-tolerance', output: 9e-3}
    ],
    calibrated: null,
    networkCmrr: null,
    worstCaseOutput: 10.7e-3,
    rssOutput: 9.1e-3,
    worstCaseInput: 0.97e-3,
    rssInput: 0.83e-3
  }
}

/** One `<text>` element of an SVG: its content and its translate() position. */
export interface SvgText {
  text: string
  x: number
  y: number
}

const unescape = (s: string) =>
  s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&')

/** Every `<text>` of an SVG, in document order. */
export function svgTexts(svg: string): SvgText[] {
  const out: SvgText[] = []
  for (const m of svg.matchAll(/<text\b([^>]*)>([^<]*)<\/text>/g)) {
    const pos = /translate\(([-0-9.e]+),([-0-9.e]+)\)/.exec(m[1] ?? '')
    out.push({text: unescape(m[2] ?? ''), x: Number(pos?.[1] ?? NaN), y: Number(pos?.[2] ?? NaN)})
  }
  return out
}

/** The distinct values of one attribute across the SVG. */
export function attributeValues(svg: string, name: string): string[] {
  return [...new Set([...svg.matchAll(new RegExp(`\\s${name}="([^"]*)"`, 'g'))].map((m) => m[1] ?? ''))]
}
