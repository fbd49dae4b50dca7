/**
 * The alternatives part of a stage section (DESIGN §8.8): two tables in score order, the
 * amplifier in use marked, and the sentence naming the best-scoring candidate by its id and
 * input type; the Markdown report carries the same tables.
 */
import {describe, expect, it} from 'vitest'
import {VFile} from 'vfile'
import type {RootContent, Table} from 'mdast'
import {toString} from 'mdast-util-to-string'
import {parseNote} from '../../src/note/index.js'
import {evaluateNote} from '../../src/evaluate/index.js'
import {buildReport} from '../../src/report/build.js'
import {loadTemplate} from '../../src/cli/resources.js'
import {reportToMarkdown} from '../../src/render/markdown/index.js'
import {compiledReportOf, reportOf, sample} from './helpers.js'
import {gainStage} from '../evaluate/helpers.js'

/** The nodes of the section named `stage` from its heading up to the next stage heading. */
function sectionOf(body: RootContent[], stage: string): RootContent[] {
  const start = body.findIndex((n) => n.type === 'heading' && n.depth === 2 && toString(n).startsWith(`Stage ${stage} `))
  const end = body.findIndex((n, i) => i > start && n.type === 'heading' && n.depth <= 2)
  return body.slice(start, end === -1 ? undefined : end)
}

/** The alternatives part of a section: its two tables and the paragraph after them. */
function alternativesOf(section: RootContent[]): {figures: Table; verdicts: Table; sentence: string} | null {
  const at = section.findIndex((n) => n.type === 'heading' && toString(n) === 'Input-technology alternatives')
  if (at === -1) return null
  const rest = section.slice(at)
  const tables = rest.filter((n): n is Table => n.type === 'table')
  const last = rest.findIndex((n) => n === tables[1])
  return {figures: tables[0]!, verdicts: tables[1]!, sentence: toString(rest[last + 1]!)}
}

const cells = (t: Table): string[][] => t.children.map((r) => r.children.map((c) => toString(c)))

async function reportOfText(md: string) {
  const file = new VFile({path: 'note.md', value: md})
  const parsed = parseNote(file)
  const evaluations = evaluateNote(parsed, file)
  const template = await loadTemplate('standard')
  return {evaluations, report: buildReport({parsed, evaluations, fragments: {method: template.method, closing: template.closing},
    sourceSha256: '0'.repeat(64), toolVersion: '0.0.0-test', fileName: 'note.md'})}
}

describe('alternatives in the soil-potential-input sample', async () => {
  const {document} = await reportOf(sample('soil-potential-input.md'))
  const body = document.body.children
  const bipolar = alternativesOf(sectionOf(body, 'probe-amp'))!
  const cmos = alternativesOf(sectionOf(body, 'probe-amp-cmos'))!

  it('gives both stages the figures and the verdicts tables, one row per candidate', () => {
    expect(cells(bipolar.figures)[0]).toEqual(['#', 'Candidate', 'Input type', 'Worst-case DC error', 'Output noise, rms', 'Phase margin', 'Dominant DC term'])
    expect(cells(bipolar.verdicts)[0]).toEqual(['#', 'Candidate', 'output-error', 'noise-rms', 'phase-margin', 'Limits'])
    for (const t of [bipolar.figures, bipolar.verdicts, cmos.figures, cmos.verdicts]) expect(t.children).toHaveLength(1 + 2 + 6)
  })

  it('marks the amplifier in use, on one row only', () => {
    const marked = (t: Table): string[] => cells(t).slice(1).filter((r) => r[1]!.endsWith('(in use)')).map((r) => r[1]!)
    expect(marked(bipolar.figures)).toEqual(['stock-bipolar (in use)'])
    expect(marked(cmos.verdicts)).toEqual(['candidate-cmos (in use)'])
  })

  it('shows the bipolar part meeting output-error with rcomp and missing it without', () => {
    const row = (t: Table, name: string): string[] => cells(t).find((r) => r[1]!.startsWith(name))!
    expect(row(bipolar.verdicts, 'stock-bipolar')[2]).toBe('✓')
    expect(row(cmos.verdicts, 'stock-bipolar')[2]).toBe('✗')
  })

  it('names the best-scoring candidate, first in the tables, by its id and input type', () => {
    const first = cells(cmos.figures)[1]!
    expect(first[1]).toBe('candidate-cmos (in use)')
    expect(cmos.sentence).toMatch(/^Best-scoring candidate: candidate-cmos \(CMOS input\), which meets all 5 /)
    expect(cmos.sentence).toContain('It is the amplifier the stage uses.')
  })

  it('says where the amplifier in use ranks when it is not the best, and what rcomp buys the FET inputs', () => {
    const place = cells(bipolar.figures).findIndex((r) => r[1] === 'stock-bipolar (in use)')
    expect(bipolar.sentence).toContain(`The amplifier in use, stock-bipolar (bipolar input), ranks ${place} of 8`)
    expect(bipolar.sentence).toMatch(/IB·rcomp is at most [\d.]+ µV, [\d.]+ µV at the output: [\d.]+ % of the smallest worst-case DC error among them\. /)
    expect(bipolar.sentence).toMatch(/The resistor’s own thermal noise reaches [\d.]+ nV rms at the output, so with those inputs it costs noise and buys little DC accuracy\.$/)
    expect(cmos.sentence).not.toContain('rcomp')
  })

  it('carries the same tables into the Markdown report', async () => {
    const {document: doc, figures} = await compiledReportOf(sample('soil-potential-input.md'))
    const md = reportToMarkdown(doc, figures, (n) => `fig${n}.svg`).markdown
    expect(md).toContain('| `output-error` | `noise-rms` | `phase-margin` | Limits |')
    expect(md.match(/^Best-scoring candidate: `candidate-cmos` \(CMOS input\)/gm)).toHaveLength(2)
  })
})

describe('alternatives in a stage section', () => {
  it('are absent when the stage does not ask for them', async () => {
    const {document} = await reportOf(sample('reference-buffer.md'))
    expect(document.body.children.some((n) => n.type === 'heading' && toString(n) === 'Input-technology alternatives')).toBe(false)
  })

  it('name as best the candidate that meets more requirements, even when another has less DC error', async () => {
    // A tight noise budget: the zero-drift archetype has the least DC error but 40 nV/√Hz of noise.
    const md = gainStage('amp', '10k', '1k', '-10m .. 10m V', '\nalternatives: true\nrequire:\n  output-error: 5 mV\n  noise-rms: 1 uV')
    const {evaluations, report} = await reportOfText(md)
    const alts = evaluations[0]!.alternatives!
    const zd = alts.candidates.find((c) => c.candidate === 'zero-drift')!
    const lowest = Math.min(...alts.candidates.map((c) => c.result.dc.worstCaseOutput))
    expect(zd.result.dc.worstCaseOutput).toBe(lowest)
    expect(zd.result.requirements.find((r) => r.key === 'noise-rms')!.met).toBe(false)
    const meetsAll = alts.candidates.filter((c) => c.result.requirements.every((r) => r.met !== false))
    const expected = meetsAll.sort((a, b) => a.result.dc.worstCaseOutput - b.result.dc.worstCaseOutput)[0]!
    const sentence = alternativesOf(sectionOf(report.document.body.children, 'amp'))!.sentence
    expect(sentence.startsWith(`Best-scoring candidate: ${expected.candidate} (`)).toBe(true)
    expect(expected.candidate).not.toBe('zero-drift')
  })

  it('draw no conclusion on rcomp when the FET inputs’ bias current through it is not small', async () => {
    // 125 °C doubles a FET input's bias current ten times over: nanoamperes through 10 MΩ.
    const md = gainStage('amp', '10k', '1k', '-10m .. 10m V', '\nrcomp: 10M\ntemperature: 25 .. 125 °C\nalternatives: true')
    const {report} = await reportOfText(md)
    const sentence = alternativesOf(sectionOf(report.document.body.children, 'amp'))!.sentence
    expect(sentence).toMatch(/The resistor’s own thermal noise reaches [\d.]+ [nµ]V rms at the output\.$/)
    expect(sentence).not.toContain('buys little')
  })

  it('say so when no candidate meets every requirement', async () => {
    const md = gainStage('amp', '10k', '1k', '-10m .. 10m V', '\nalternatives: true\nrequire:\n  output-error: 1 uV')
    const {report} = await reportOfText(md)
    const sentence = alternativesOf(sectionOf(report.document.body.children, 'amp'))!.sentence
    expect(sentence).toMatch(/^Best-scoring candidate: zero-drift \(zero-drift input, archetype\), which misses 1 of /)
  })

})
