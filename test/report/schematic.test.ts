/**
 * Schematics (DESIGN §8.9): one symbol per component of the stage's netlist, none for parts
 * the stage does not have, every part labelled with its key and value, a layout for every
 * topology, labels clear of each other and of the ink, wires clear of the parts, and the
 * drawing in the PDF and the Markdown report.
 */
import {readFileSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {stageNetlist} from '../../src/engine/topology/index.js'
import {TOPOLOGIES, type StageInput} from '../../src/engine/types.js'
import {drawingToSvg} from '../../src/render/markdown/schematic-svg.js'
import {schematicLabels, stageSchematic} from '../../src/report/schematic/stage.js'
import {LAYOUTS} from '../../src/report/schematic/layouts/index.js'
import type {Drawing, Point, Primitive} from '../../src/report/schematic/types.js'
import {inputOf} from '../note/helpers.js'
import {readPdf} from '../render/helpers.js'
import {pdfOf, ROOT, sample} from './helpers.js'

const FIXTURE = join(ROOT, 'test', 'fixtures', 'schematics.md')
const note = readFileSync(FIXTURE, 'utf8')
const stage = (id: string): StageInput => inputOf(note, id)

const drawingOf = (id: string): Drawing => stageSchematic(stage(id))

/** `data-key` of every resistor and capacitor symbol in the SVG, in drawing order. */
function componentSymbols(svg: string): string[] {
  return [...svg.matchAll(/<g class="part" data-key="([^"]+)" data-symbol="(resistor|capacitor)">/g)].map((m) => m[1] ?? '')
}

/** The board's components as the engine solves them: resistors and nonzero capacitors, not the op-amp's own (cin-*, rout). */
function netlistComponents(input: StageInput): string[] {
  return stageNetlist(input).elements
    .filter((e) => !e.label.startsWith('cin-') && e.label !== 'rout' && e.value !== 0)
    .map((e) => e.label).sort()
}

// The expected parts are written from each fixture stage's keys by hand, independently of
// the netlist code: a part the author gave is drawn, a part not given is not. A difference or
// instrumentation stage's rs sits in each leg, so it is drawn twice.
const CASES: [string, string[]][] = [
  ['inv-full', ['ccomp', 'cf', 'cstray', 'rcomp', 'rf', 'rg', 'rs']],
  ['inv-bare', ['rf', 'rg']],
  // The + pin sits on ground (no rcomp, vref 0 V): cstray-plus is shorted and not in the netlist.
  ['inv-load', ['cload', 'rf', 'rg', 'riso', 'rload']],
  ['tia-full', ['ccomp', 'cf', 'csource', 'cstray', 'cstray-plus', 'rcomp', 'rf', 'rshunt']],
  ['tia-vref', ['rf']],
  ['tia-load', ['cf', 'csource', 'rf', 'rload']],
  ['noninv-full', ['ccomp', 'cf', 'cstray', 'rcomp', 'rf', 'rg', 'rs']],
  ['noninv-load', ['cload', 'cstray-plus', 'rf', 'rg', 'riso', 'rload']],
  ['follower-rf', ['cf', 'rf', 'rs']],
  ['follower-bare', []],
  ['follower-riso', ['riso']],
  ['diff-full', ['cf', 'cload', 'cstray', 'cstray-plus', 'rf', 'rg', 'riso', 'rload', 'rp', 'rref', 'rs', 'rs']],
  ['diff-bare', ['rf', 'rg', 'rp', 'rref']],
  ['sk-gain', ['c1', 'c2', 'cf', 'cload', 'cstray', 'cstray-plus', 'r1', 'r2', 'rf', 'rg', 'riso', 'rload']],
  ['sk-unity', ['c1', 'c2', 'r1', 'r2']],
  ['mfb-full', ['c1', 'c2', 'ccomp', 'cload', 'cstray', 'cstray-plus', 'r1', 'r2', 'r3', 'rcomp', 'riso', 'rload']],
  ['mfb-bare', ['c1', 'c2', 'r1', 'r2', 'r3']],
  ['ina-full', ['rg', 'rload', 'rs', 'rs']],
  ['ina-bare', ['rg']]
]

/** The in-amp block has no netlist of ours (DESIGN §8.2): its board parts, read from the stage's fields. */
function inaComponents(input: StageInput): string[] {
  return [
    ...(input.rg ? ['rg'] : []),
    ...(input.rs && input.rs.value > 0 ? ['rs', 'rs'] : []),
    ...(input.rload !== null ? ['rload'] : [])
  ].sort()
}

const texts = (d: Drawing): string[] => d.labels.flatMap((p) => (p.kind === 'text' ? [p.text] : []))

describe('stageSchematic()', () => {
  it('has a case for every topology', () => {
    expect(new Set(CASES.map(([id]) => stage(id).topology))).toEqual(new Set(TOPOLOGIES))
  })

  it('has a layout for every topology', () => {
    expect(Object.keys(LAYOUTS).sort()).toEqual([...TOPOLOGIES].sort())
  })

  it.each(CASES)('draws one symbol per component for %s, and none for absent parts', (id, expected) => {
    const svg = drawingToSvg(drawingOf(id))
    expect(componentSymbols(svg).sort()).toEqual(expected)
  })

  it.each(CASES)('draws exactly the components of the netlist for %s', (id) => {
    const input = stage(id)
    const components = input.topology === 'instrumentation' ? inaComponents(input) : netlistComponents(input)
    expect(componentSymbols(drawingToSvg(drawingOf(id))).sort()).toEqual(components)
  })

  it.each(CASES.map(([id]) => id))('draws the source, the amplifier and the output terminal for %s', (id) => {
    const input = stage(id)
    const parts = drawingOf(id).parts.map((p) => `${p.key}:${p.symbol}`)
    const source = input.topology === 'transimpedance' ? 'source:current-source' : 'source:voltage-source'
    const amp = input.topology === 'instrumentation' ? 'opamp:inamp' : 'opamp:opamp'
    expect(parts).toEqual(expect.arrayContaining([source, amp]))
    expect(parts.filter((p) => p === 'out:terminal')).toHaveLength(1)
    expect(parts.filter((p) => p.startsWith('opamp:'))).toHaveLength(1)
  })

  it('draws a differential source as two halves of vd around the common mode', () => {
    for (const id of ['diff-full', 'ina-full']) {
      const parts = drawingOf(id).parts.map((p) => `${p.key}:${p.symbol}`)
      expect(parts).toEqual(expect.arrayContaining(['source:voltage-source', 'source-half:voltage-source', 'vcm:voltage-source']))
    }
    expect(texts(drawingOf('diff-full'))).toEqual(expect.arrayContaining(['vd 0 … 20 mV', 'vd/2', 'vcm', '4.5 … 5.5 V']))
    expect(texts(drawingOf('ina-full'))).toEqual(expect.arrayContaining(['vcm', '2.5 V']))
    // No input-cm: the common mode is 0 V and the midpoint is grounded, no vcm source.
    expect(drawingOf('diff-bare').parts.filter((p) => p.key === 'vcm')).toHaveLength(0)
    expect(drawingOf('ina-bare').parts.filter((p) => p.key === 'vcm')).toHaveLength(0)
  })

  it('draws the reference as a source when vref is not 0 V, and a ground when it is', () => {
    for (const id of ['tia-vref', 'inv-full', 'diff-full', 'mfb-full', 'ina-full']) {
      expect(drawingOf(id).parts.filter((p) => p.key === 'vref'), id).toHaveLength(1)
      expect(texts(drawingOf(id)), id).toContain('vref')
    }
    for (const id of ['inv-bare', 'diff-bare', 'mfb-bare', 'ina-bare']) {
      expect(drawingOf(id).parts.filter((p) => p.key === 'vref'), id).toHaveLength(0)
    }
  })

  it('labels every component with its key and value', () => {
    for (const t of ['rs', '100 Ω', 'rg', '10 kΩ', 'rf', '100 kΩ', 'cf', '10 pF', 'rcomp', '9.1 kΩ', 'ccomp', '100 nF', 'cstray', '2 pF', 'vref', '2.5 V']) {
      expect(texts(drawingOf('inv-full'))).toContain(t)
    }
    for (const t of ['r1', '10 kΩ', 'r2', '20 kΩ', 'r3', '4.7 kΩ', 'c1', '1 nF', 'c2', '22 nF', 'rcomp', '6.2 kΩ', 'cstray-plus', 'riso', '47 Ω', 'cload', 'rload']) {
      expect(texts(drawingOf('mfb-full'))).toContain(t)
    }
    for (const t of ['rg', '499 Ω', 'rs', '175 Ω', 'rload', '10 kΩ', 'precision-ina', '(archetype)', '+15 V', '−15 V']) {
      expect(texts(drawingOf('ina-full'))).toContain(t)
    }
    // Each leg's rs carries its own label.
    expect(texts(drawingOf('diff-full')).filter((t) => t === 'rs')).toHaveLength(2)
  })

  it('labels the source range, the supply rails and the op-amp', () => {
    expect(texts(drawingOf('tia-full'))).toEqual(expect.arrayContaining(['0 … 2 µA', 'idark 50 pA', '+5 V', '−5 V', 'precision-jfet', '(archetype)']))
  })

  it('says the load is open only when there is no rload or cload, and puts the terminal past the load', () => {
    expect(texts(drawingOf('inv-bare'))).toContain('load: open')
    expect(texts(drawingOf('follower-riso'))).toContain('load: open')
    for (const id of ['inv-load', 'tia-load', 'noninv-load', 'diff-full', 'sk-gain', 'mfb-full', 'ina-full']) {
      const d = drawingOf(id)
      expect(texts(d), id).not.toContain('load: open')
      const xOf = (key: string): number => Math.max(...(d.parts.find((p) => p.key === key)?.primitives ?? []).flatMap((p) => (p.kind === 'line' ? p.points.map((q) => q[0]) : [])))
      const terminal = d.parts.find((p) => p.key === 'out')?.primitives[0]
      expect(terminal?.kind).toBe('circle')
      if (terminal?.kind === 'circle') expect(terminal.cx, id).toBeGreaterThan(xOf('rload'))
    }
  })

  it('puts a junction dot where three wires meet and none at a plain corner', () => {
    const dots = (id: string): number => drawingOf(id).wiring.filter((p) => p.kind === 'circle' && p.fill).length
    // follower-bare: the output node only (op-amp output, feedback wire, wire to the terminal).
    expect(dots('follower-bare')).toBe(1)
    // follower-riso: riso in series adds no node where three meet.
    expect(dots('follower-riso')).toBe(1)
    expect(dots('inv-full')).toBeGreaterThan(dots('inv-bare'))
    // noninv-load: + pin (cstray-plus), − node (rg), output node, the load node (cload), rload's node.
    expect(dots('noninv-load')).toBe(5)
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

  it.each(CASES.map(([id]) => id))('lays out %s without a label over another label, a part or a wire', (id) => {
    const d = drawingOf(id)
    const boxes = d.labels.flatMap((p) => (p.kind === 'text' ? [{text: p.text, box: labelBox(p)}] : []))
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i]!
        const b = boxes[j]!
        expect(overlap(grow(a.box, 3), b.box), `${a.text} / ${b.text}`).toBe(false)
      }
    }
    const ink = [...d.parts.flatMap((p) => p.primitives), ...d.wiring].filter((p) => p.kind !== 'text')
    for (const {text, box} of boxes) {
      for (const p of ink) expect(touches(p, box), `${text} on a ${p.kind}`).toBe(false)
    }
  })

  it.each(CASES.map(([id]) => id))('routes no wire of %s through a part or across another wire', (id) => {
    const d = drawingOf(id)
    const wires = d.wiring.flatMap((p) => (p.kind === 'line' ? segmentsOf(p.points) : []))
    for (const part of d.parts) {
      for (const body of part.primitives.filter((p) => p.kind === 'rect' || p.kind === 'polygon' || (p.kind === 'circle' && p.r > 3))) {
        for (const s of wires) expect(crossesBody(s, body), `wire ${JSON.stringify(s)} through ${part.key}`).toBe(false)
      }
    }
    for (let i = 0; i < wires.length; i++) {
      for (let j = i + 1; j < wires.length; j++) expect(properCrossing(wires[i]!, wires[j]!), `${JSON.stringify(wires[i])} × ${JSON.stringify(wires[j])}`).toBe(false)
    }
  })

  it('gives the same SVG bytes twice', () => {
    expect(drawingToSvg(drawingOf('tia-full'))).toBe(drawingToSvg(drawingOf('tia-full')))
    expect(drawingToSvg(drawingOf('ina-full'))).toBe(drawingToSvg(drawingOf('ina-full')))
  })

  it('labels every part it knows of', () => {
    expect([...schematicLabels(stage('noninv-full')).keys()].sort()).toEqual(
      ['ccomp', 'cf', 'cstray', 'opamp', 'out', 'rcomp', 'rf', 'rg', 'rs', 'source', 'supply'])
  })
})

type Seg = [Point, Point]
interface Box { left: number; right: number; top: number; bottom: number }

/**
 * A label's extent, generous: DejaVu Sans averages under 0.6 em a character, bold a little
 * more; the text is centred on its y with the font's full height.
 */
function labelBox(p: Extract<Primitive, {kind: 'text'}>): Box {
  const w = (p.bold ? 0.66 : 0.6) * p.size * [...p.text].length
  const left = p.anchor === 'start' ? p.x : p.anchor === 'middle' ? p.x - w / 2 : p.x - w
  return {left, right: left + w, top: p.y - 0.55 * p.size, bottom: p.y + 0.55 * p.size}
}

/** A box grown by `d` to each side: labels side by side keep that much clear space (lines of one label stack closer). */
const grow = (b: Box, d: number): Box => ({...b, left: b.left - d, right: b.right + d})
const overlap = (a: Box, b: Box): boolean => a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom
const inside = ([x, y]: Point, b: Box): boolean => x > b.left && x < b.right && y > b.top && y < b.bottom

const segmentsOf = (points: readonly Point[]): Seg[] => points.slice(1).map((q, i): Seg => [points[i]!, q])

/** Points every 0.5 pt along a segment. */
function samples([a, b]: Seg): Point[] {
  const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / 0.5))
  return Array.from({length: n + 1}, (_, i): Point => [a[0] + ((b[0] - a[0]) * i) / n, a[1] + ((b[1] - a[1]) * i) / n])
}

function touches(p: Primitive, box: Box): boolean {
  switch (p.kind) {
    case 'line': return segmentsOf(p.points).some((s) => samples(s).some((q) => inside(q, box)))
    case 'polygon': return segmentsOf([...p.points, p.points[0]!]).some((s) => samples(s).some((q) => inside(q, box)))
    case 'rect': return overlap({left: p.x, right: p.x + p.width, top: p.y, bottom: p.y + p.height}, box)
    case 'circle': return overlap({left: p.cx - p.r, right: p.cx + p.r, top: p.cy - p.r, bottom: p.cy + p.r}, box)
    case 'text': return false
  }
}

/** Strictly inside a convex polygon, more than 0.5 pt from every edge. */
function inPolygon([x, y]: Point, pts: readonly Point[]): boolean {
  const area = pts.reduce((s, p, i) => { const q = pts[(i + 1) % pts.length]!; return s + p[0] * q[1] - q[0] * p[1] }, 0)
  return pts.every((p, i) => {
    const q = pts[(i + 1) % pts.length]!
    const cross = (q[0] - p[0]) * (y - p[1]) - (q[1] - p[1]) * (x - p[0])
    return (Math.sign(area) * cross) / Math.hypot(q[0] - p[0], q[1] - p[1]) > 0.5
  })
}

function crossesBody(s: Seg, body: Primitive): boolean {
  const pts = samples(s)
  switch (body.kind) {
    case 'rect': return pts.some(([x, y]) => x > body.x + 0.5 && x < body.x + body.width - 0.5 && y > body.y + 0.5 && y < body.y + body.height - 0.5)
    case 'circle': return pts.some(([x, y]) => Math.hypot(x - body.cx, y - body.cy) < body.r - 0.5)
    case 'polygon': return pts.some((q) => inPolygon(q, body.points))
    default: return false
  }
}

/** Two axis-parallel segments crossing in both their interiors (a crossing a drawing must not have). */
function properCrossing([a, b]: Seg, [c, d]: Seg): boolean {
  const h1 = a[1] === b[1]
  const h2 = c[1] === d[1]
  if (h1 === h2) return false
  const [h, v] = h1 ? [[a, b], [c, d]] : [[c, d], [a, b]]
  const y = h[0]![1]
  const x = v[0]![0]
  const within = (t: number, p: number, q: number): boolean => t > Math.min(p, q) + 0.01 && t < Math.max(p, q) - 0.01
  return within(x, h[0]![0], h[1]![0]) && within(y, v[0]![1], v[1]![1])
}

describe('the schematics in the load-cell PDF, read back with pdfjs', async () => {
  const {pdf} = await pdfOf(sample('load-cell-bridge.md'))
  const pages = (await readPdf(pdf)).pages
  const all = pages.join('\n')
  const figure = (id: string): number => Number(new RegExp(`Figure (\\d+) — Schematic of stage ${id}`).exec(all)?.[1] ?? NaN)
  const pageOf = (id: string): string => (pages.find((p) => p.includes(`Schematic of stage ${id}`)) ?? '').normalize('NFKC')

  it('draws the instrumentation stage and then the driver, each before its parameters table', () => {
    expect(figure('bridge-ina')).toBeGreaterThan(0)
    expect(figure('adc-driver')).toBeGreaterThan(figure('bridge-ina'))
    for (const id of ['bridge-ina', 'adc-driver']) {
      expect(all.indexOf(`Schematic of stage ${id}`)).toBeLessThan(all.indexOf(`Parameters of stage ${id}`))
    }
    expect(all).not.toContain('No schematic is drawn')
  })

  it.each(['rcomp', '2 kΩ', 'rg', '10 kΩ', 'rf', '2.49 kΩ', 'cstray', '2 pF', 'riso', '220 Ω', 'cload', '1 nF', 'source', '+15 V', '−15 V', 'wm-amp'])(
    'carries the driver label “%s” as text', (label) => {
      expect(pageOf('adc-driver')).toContain(label.normalize('NFKC'))
    })

  it.each(['rg', '499 Ω', 'rs', '175 Ω', 'vcm', '2.5 V', 'vd/2', 'wm-ina', 'ref'])(
    'carries the instrumentation label “%s” as text', (label) => {
      expect(pageOf('bridge-ina')).toContain(label.normalize('NFKC'))
    })
})

describe('the difference schematic in the current-shunt PDF, read back with pdfjs', async () => {
  const {pdf} = await pdfOf(sample('current-shunt-monitor.md'))
  const pages = (await readPdf(pdf)).pages
  const page = (pages.find((p) => p.includes('Schematic of stage shunt-amp')) ?? '').normalize('NFKC')

  it.each(['rg', 'rf', '200 kΩ', 'rp', 'rref', 'vcm', '4.75 … 5.25 V', 'vd 0 … 50 mV', 'vref', '250 mV', 'riso', '110 Ω', 'cload', '10 nF', 'cs-amp'])(
    'carries the label “%s” as text', (label) => {
      expect(page).toContain(label.normalize('NFKC'))
    })
})
