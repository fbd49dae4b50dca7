/**
 * Schematics (DESIGN §8.9): one symbol per component of the stage's netlist, none for parts
 * the stage does not have, every part labelled with its key and value, a clear fallback for
 * a topology without a layout, and the drawing in the PDF and the Markdown report.
 */
import {readFileSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {stageNetlist} from '../../src/engine/topology/index.js'
import type {StageInput, Topology} from '../../src/engine/types.js'
import {drawingToSvg} from '../../src/render/markdown/schematic-svg.js'
import {schematicLabels, stageSchematic} from '../../src/report/schematic/stage.js'
import type {Drawing} from '../../src/report/schematic/types.js'
import {inputOf} from '../note/helpers.js'
import {readPdf} from '../render/helpers.js'
import {pdfOf, ROOT, sample} from './helpers.js'

const FIXTURE = join(ROOT, 'test', 'fixtures', 'schematics.md')
const note = readFileSync(FIXTURE, 'utf8')
const stage = (id: string): StageInput => inputOf(note, id)

function drawingOf(id: string): Drawing {
  const d = stageSchematic(stage(id))
  if (d === null) throw new Error(`no schematic for ${id}`)
  return d
}

/** `data-key` of every resistor and capacitor symbol in the SVG, in drawing order. */
function componentSymbols(svg: string): string[] {
  return [...svg.matchAll(/<g class="part" data-key="([^"]+)" data-symbol="(resistor|capacitor)">/g)].map((m) => m[1] ?? '')
}

/** The board's components as the engine solves them: resistors and nonzero capacitors, not the op-amp's own. */
function netlistComponents(input: StageInput): string[] {
  return stageNetlist(input).elements
    .filter((e) => !e.label.startsWith('cin-') && e.value !== 0)
    .map((e) => e.label).sort()
}

// The expected parts are written from each fixture stage's keys by hand, independently of
// the netlist code: a part the author gave is drawn, a part not given is not.
const CASES: [string, string[]][] = [
  ['inv-full', ['ccomp', 'cf', 'cstray', 'rcomp', 'rf', 'rg', 'rs']],
  ['inv-bare', ['rf', 'rg']],
  ['tia-full', ['ccomp', 'cf', 'csource', 'cstray', 'rcomp', 'rf', 'rshunt']],
  ['tia-vref', ['rf']],
  ['noninv-full', ['ccomp', 'cf', 'cstray', 'rcomp', 'rf', 'rg', 'rs']],
  ['follower-rf', ['cf', 'rf', 'rs']],
  ['follower-bare', []]
]

describe('stageSchematic()', () => {
  it.each(CASES)('draws one symbol per component for %s, and none for absent parts', (id, expected) => {
    const svg = drawingToSvg(drawingOf(id))
    const symbols = componentSymbols(svg)
    expect([...symbols].sort()).toEqual(expected)
    expect(new Set(symbols).size).toBe(symbols.length)
  })

  it.each(CASES)('draws exactly the components of the netlist for %s', (id) => {
    expect(componentSymbols(drawingToSvg(drawingOf(id))).sort()).toEqual(netlistComponents(stage(id)))
  })

  it.each(CASES.map(([id]) => id))('draws the source, the op-amp and the output terminal for %s', (id) => {
    const parts = drawingOf(id).parts.map((p) => `${p.key}:${p.symbol}`)
    const source = stage(id).topology === 'transimpedance' ? 'source:current-source' : 'source:voltage-source'
    expect(parts).toEqual(expect.arrayContaining([source, 'opamp:opamp', 'out:terminal']))
  })

  it('draws the reference as a source when vref is not 0 V, and a ground when it is', () => {
    expect(drawingOf('tia-vref').parts.filter((p) => p.key === 'vref')).toHaveLength(1)
    expect(drawingOf('inv-bare').parts.filter((p) => p.key === 'vref')).toHaveLength(0)
  })

  it('labels every component with its key and value', () => {
    const texts = drawingOf('inv-full').labels.flatMap((p) => (p.kind === 'text' ? [p.text] : []))
    for (const t of ['rs', '100 Ω', 'rg', '10 kΩ', 'rf', '100 kΩ', 'cf', '10 pF', 'rcomp', '9.1 kΩ', 'ccomp', '100 nF', 'cstray', '2 pF', 'vref', '2.5 V']) {
      expect(texts).toContain(t)
    }
  })

  it('labels the source range, the supply rails and the op-amp', () => {
    const texts = drawingOf('tia-full').labels.flatMap((p) => (p.kind === 'text' ? [p.text] : []))
    expect(texts).toEqual(expect.arrayContaining(['0 … 2 µA', 'idark 50 pA', '+5 V', '−5 V', 'precision-jfet', '(archetype)']))
  })

  it('puts a junction dot where three wires meet and none at a plain corner', () => {
    const dots = (id: string): number => drawingOf(id).wiring.filter((p) => p.kind === 'circle' && p.fill).length
    // follower-bare: the output node only (op-amp output, feedback wire, wire to the terminal).
    expect(dots('follower-bare')).toBe(1)
    expect(dots('inv-full')).toBeGreaterThan(dots('inv-bare'))
  })

  it('keeps every primitive inside the drawing', () => {
    for (const [id] of CASES) {
      const d = drawingOf(id)
      const points = [...d.parts.flatMap((p) => p.primitives), ...d.wiring].flatMap((p) =>
        p.kind === 'line' || p.kind === 'polygon' ? p.points : p.kind === 'circle' ? [[p.cx, p.cy] as const] : p.kind === 'rect' ? [[p.x, p.y] as const] : [[p.x, p.y] as const])
      for (const [x, y] of points) {
        expect(x).toBeGreaterThanOrEqual(0)
        expect(y).toBeGreaterThanOrEqual(0)
        expect(x).toBeLessThanOrEqual(d.width)
        expect(y).toBeLessThanOrEqual(d.height)
      }
    }
  })

  it('returns null for a topology without a layout instead of failing', () => {
    const input = {...stage('inv-bare'), topology: 'no-such-topology' as Topology}
    expect(stageSchematic(input)).toBeNull()
  })

  it('gives the same SVG bytes twice', () => {
    expect(drawingToSvg(drawingOf('tia-full'))).toBe(drawingToSvg(drawingOf('tia-full')))
  })

  it('labels every part it knows of', () => {
    expect([...schematicLabels(stage('noninv-full')).keys()].sort()).toEqual(
      ['ccomp', 'cf', 'cstray', 'opamp', 'out', 'rcomp', 'rf', 'rg', 'rs', 'source', 'supply'])
  })
})

describe('the schematic in the load-cell PDF, read back with pdfjs', async () => {
  const {pdf} = await pdfOf(sample('load-cell-bridge.md'))
  const pages = (await readPdf(pdf)).pages
  const page = pages.findIndex((p) => p.includes('Figure 5 — Schematic of stage adc-driver'))

  // The note's block diagram is Figure 1 and the first stage is an instrumentation stage (no
  // layout yet: a sentence; three charts), so the driver's schematic is Figure 5.
  it('is Figure 5, in the stage section before its parameters table', () => {
    expect(page).toBeGreaterThanOrEqual(0)
    const all = pages.join('\n')
    expect(all.indexOf('Figure 5 — Schematic')).toBeLessThan(all.indexOf('Parameters of stage adc-driver'))
  })

  it.each(['rcomp', '2 kΩ', 'rg', '10 kΩ', 'rf', '2.49 kΩ', 'cstray', '2 pF', 'source', '+15 V', '−15 V', 'wm-amp'])(
    'carries the label “%s” as text', (label) => {
      expect((pages[page] ?? '').normalize('NFKC')).toContain(label.normalize('NFKC'))
    })
})
