import {describe, expect, it} from 'vitest'
import {TOPOLOGIES} from '../../src/engine/types.js'
import {decodeNote, noteMessages} from '../../src/note/index.js'
import {chainMessages} from '../../src/note/chain-messages.js'
import {unitsMessages} from '../../src/units/index.js'
import {blocksOf, errorsOf, noteOf} from './helpers.js'

// Lines 1–13: an opamp block; line 14 blank; line 15 the stage fence, id `gain-a` at column 10.
const OPAMP = [
  '```opamp amp-a', 'input-type: bipolar', 'vos: 60 uV', 'ib: 2 nA', 'ios: 1.8 nA', 'en: 9 nV/√Hz',
  'in: 0.15 pA/√Hz', 'gbw: 1.2 MHz', 'aol: 126 dB', 'pm-unity: 60 deg', 'cmrr: 120 dB', 'psrr: 118 dB', '```'
].join('\n')
// Stage body lines 16–21.
const BODY = ['topology: noninverting', 'opamp: amp-a', 'rf: 49.9k 0.1% 25ppm/K', 'rg: 1.00k', 'input: -10m .. 10m V', 'supply: ±15 V']

/** The test note with the stage body changed by `edit` (which gets the body lines). */
const note = (edit: (lines: string[]) => string[] = (l) => l): string =>
  `${OPAMP}\n\n\`\`\`stage gain-a\n${edit([...BODY]).join('\n')}\n\`\`\`\n`
const replaceLine = (index: number, line: string) => (l: string[]) => l.map((x, i) => (i === index ? line : x))
const err = (line: number, column: number, message: string): string => `${line}:${column}: error: ${message}`
const warn = (line: number, column: number, message: string): string => `${line}:${column}: warning: ${message}`

describe('parseNote() diagnostics', () => {
  it('raises nothing on the base note, and builds it', () => {
    const r = blocksOf(note())
    expect(r.diagnostics).toEqual([])
    expect(r.stages[0]?.input).not.toBeNull()
  })

  it('points at the value start for a resistance given in mV', () => {
    const r = blocksOf(note(replaceLine(2, 'rf: 10 mV')))
    expect(r.diagnostics).toEqual([err(18, 8, unitsMessages.wrongDimension('mV', 'voltage', 'resistance', ' for `rf`'))])
    expect(r.stages[0]?.input).toBeNull()
  })

  it('points at the unit for an unknown unit', () => {
    expect(noteOf(note(replaceLine(2, 'rf: 10 kQ'))).diagnostics).toEqual([
      err(18, 8, unitsMessages.unknownUnit('kQ', 'resistance', ' for `rf`'))
    ])
  })

  it('reports a missing required key at the stage id', () => {
    expect(noteOf(note((l) => l.filter((x) => !x.startsWith('rg:')))).diagnostics).toEqual([
      err(15, 10, noteMessages.missingKey('rg', 'stage `gain-a`', 'for a noninverting stage'))
    ])
  })

  it('reports an unknown topology at its value with a hint', () => {
    expect(errorsOf(noteOf(note(replaceLine(0, 'topology: non-inverting'))).diagnostics)).toEqual([
      err(16, 11, noteMessages.unknownChoice('topology', 'non-inverting', TOPOLOGIES, 'noninverting'))
    ])
  })

  it('reports a reversed range at the value', () => {
    expect(noteOf(note(replaceLine(4, 'input: 10m .. -10m V'))).diagnostics).toEqual([
      err(20, 8, unitsMessages.rangeReversed('10m .. -10m V', '-10m V .. 10m', ' for `input`'))
    ])
  })

  it('reports an unknown key at the key with did-you-mean', () => {
    expect(noteOf(note((l) => [...l, 'cstary: 2 pF'])).diagnostics).toEqual([
      err(22, 1, noteMessages.unknownKey('cstary', 'stage `gain-a`', 'a stage', 'cstray', null))
    ])
  })

  it('says where an opamp key written in a stage belongs', () => {
    expect(noteOf(note((l) => [...l, 'vos: 1 mV'])).diagnostics).toEqual([
      err(22, 1, noteMessages.unknownKey('vos', 'stage `gain-a`', 'a stage', null, 'an opamp block'))
    ])
  })

  it('reports a key of another topology, naming the topology', () => {
    expect(noteOf(note((l) => [...l, 'rshunt: 1G'])).diagnostics).toEqual([
      err(22, 1, noteMessages.keyNotForTopology('rshunt', 'noninverting', 'stage `gain-a`'))
    ])
  })

  it('reports malformed YAML in a block at its place, once', () => {
    expect(noteOf(note(replaceLine(2, 'rf: [49.9k'))).diagnostics).toEqual([
      err(19, 1, noteMessages.yamlSyntax('stage `gain-a`', 'Flow sequence in block collection must be sufficiently indented and end with a ]'))
    ])
  })

  it('reports malformed YAML in the front matter at its place', () => {
    const md = `---\ntitle: Test\nauthor: [Kim\n---\n\n${note()}`
    // YAML finds the unclosed flow sequence at the end of its line.
    expect(noteOf(md).diagnostics).toEqual([
      err(3, 13, noteMessages.yamlSyntax('front matter', 'Flow sequence in block collection must be sufficiently indented and end with a ]'))
    ])
  })

  it('reports a duplicate key at the second one, with a cause at the first', () => {
    const {file, diagnostics} = noteOf(note((l) => [...l, 'rf: 10k']))
    expect(diagnostics).toEqual([err(22, 1, noteMessages.duplicateKey('rf', 'stage `gain-a`'))])
    const cause = file.messages[0]?.cause as {place?: unknown; reason?: string} | undefined
    expect(cause?.reason).toBe(noteMessages.firstKey('rf'))
    expect(cause?.place).toEqual({line: 18, column: 1})
  })

  it('reports a duplicate stage id with a cause at the first definition', () => {
    const md = `${note()}\n\`\`\`stage gain-a\n${BODY.join('\n')}\n\`\`\`\n`
    const {file, diagnostics, note: parsed} = noteOf(md)
    expect(diagnostics).toEqual([err(24, 10, noteMessages.duplicateId('stage', 'gain-a'))])
    expect((file.messages[0]?.cause as {place?: unknown}).place).toEqual({line: 15, column: 10})
    expect(parsed.stages.map((s) => s.input === null)).toEqual([false, true])
  })

  it('allows a stage and an opamp to share an id', () => {
    const md = note().replace('```stage gain-a', '```stage amp-a')
    expect(noteOf(md).diagnostics).toEqual([])
  })

  it('reports an opamp defined below the stage, saying where it is', () => {
    const md = `\`\`\`stage gain-a\n${BODY.join('\n')}\n\`\`\`\n\n${OPAMP}\n`
    expect(noteOf(md).diagnostics).toEqual([err(3, 8, noteMessages.opampDefinedLater('amp-a', 10))])
  })

  it('reports an opamp never defined, with a hint across blocks and archetypes', () => {
    expect(noteOf(note(replaceLine(1, 'opamp: amp-b'))).diagnostics).toEqual([
      err(17, 8, noteMessages.unknownOpamp('amp-b', 'stage `gain-a`', 'amp-a'))
    ])
    expect(noteOf(note(replaceLine(1, 'opamp: zero-drfit'))).diagnostics).toEqual([
      err(17, 8, noteMessages.unknownOpamp('zero-drfit', 'stage `gain-a`', 'zero-drift'))
    ])
  })

  it('reports three different mistakes in one run', () => {
    const md = note((l) => [...l.filter((x) => !x.startsWith('rg:')), 'cstary: 2 pF'].map((x) => (x.startsWith('supply') ? 'supply: ±15 mA' : x)))
    expect(noteOf(md).diagnostics).toEqual([
      err(20, 13, unitsMessages.wrongDimension('mA', 'current', 'voltage', ' for `supply`')),
      err(21, 1, noteMessages.unknownKey('cstary', 'stage `gain-a`', 'a stage', 'cstray', null)),
      err(15, 10, noteMessages.missingKey('rg', 'stage `gain-a`', 'for a noninverting stage'))
    ])
  })

  it.each([
    ['ccomp without rcomp', 'ccomp: 10 nF', err(22, 1, noteMessages.ccompWithoutRcomp())],
    ['a negative capacitance', 'cstray: -2 pF', err(22, 9, noteMessages.negative('cstray', '-2 pF', 'a capacitance'))],
    ['a band from 0 Hz', 'band: 0 .. 10k Hz', err(22, 7, noteMessages.bandFromZero())],
    ['a single band value (0 .. x)', 'band: 10k', err(22, 7, noteMessages.bandFromZero())],
    ['a supply tolerance over 100 %', 'supply-tolerance: 5', err(22, 19, noteMessages.supplyTolerance('5'))],
    ['an unknown requirement', 'require:\n  noise: 1 uV', err(23, 3, noteMessages.unknownRequirement('noise', 'noise-pp'))],
    ['a comma as decimal mark', 'cstray: 2,2 pF', err(22, 10, unitsMessages.comma('2,2', '2.2', ' for `cstray`'))]
  ])('reports %s', (_name, line, expected) => {
    expect(noteOf(note((l) => [...l, line])).diagnostics).toEqual([expected])
  })

  it('warns about an m resistance under 1 Ω on rf and still builds', () => {
    const r = blocksOf(note(replaceLine(2, 'rf: 10m')))
    expect(r.diagnostics).toEqual([warn(18, 5, noteMessages.milliOhm('rf', '10 mΩ'))])
    expect(r.stages[0]?.input?.rf?.value).toBe(0.01)
  })

  it('reports a tolerance on rshunt at the tolerance', () => {
    const md = note((l) => ['topology: transimpedance', 'opamp: amp-a', 'rf: 1M', 'rshunt: 1G 1%', 'input: 0 .. 1 uA', 'supply: ±5 V'])
    expect(noteOf(md).diagnostics).toEqual([err(19, 12, noteMessages.shuntParts())])
  })

  it('reports cf on a follower without rf', () => {
    const md = note(() => ['topology: follower', 'opamp: amp-a', 'cf: 10 pF', 'input: 1 V', 'supply: ±5 V'])
    expect(noteOf(md).diagnostics).toEqual([err(18, 1, noteMessages.cfWithoutRf())])
  })

  it.each([
    ['gbw: 0 Hz', err(8, 6, noteMessages.notPositive('gbw', '0 Hz', 'a frequency'))],
    ['pm-unity: 120 deg', err(10, 11, noteMessages.pmOutOfRange('120 deg'))],
    ['pm-unity: 0 deg', err(10, 11, noteMessages.pmOutOfRange('0 deg'))],
    ['ib: -2 nA', err(4, 5, noteMessages.negative('ib', '-2 nA', 'a current'))]
  ])('reports opamp value %s', (line, expected) => {
    const key = line.split(':')[0] ?? ''
    const md = note().split('\n').map((x) => (x.startsWith(`${key}:`) ? line : x)).join('\n')
    const d = noteOf(md).diagnostics
    expect(d[0]).toBe(expected)
    // The stage refers to the broken opamp: an info, not a second error.
    expect(d.slice(1)).toEqual([`17:8: info: ${noteMessages.opampHasErrors('stage `gain-a`', 'amp-a')}`])
  })

  it('reports a missing opamp key at the opamp id', () => {
    const md = note().replace('gbw: 1.2 MHz\n', '')
    expect(errorsOf(noteOf(md).diagnostics)).toEqual([err(1, 10, noteMessages.missingKey('gbw', 'opamp `amp-a`', 'in every opamp block'))])
  })
})

describe('parseNote() positions in containers and encodings', () => {
  it('shifts columns for a block inside a list item', () => {
    const md = `- Item\n\n  ${OPAMP.split('\n').join('\n  ')}\n\n  \`\`\`stage gain-a\n  ${BODY.join('\n  ').replace('rf: 49.9k', 'rf: 10 mV 49.9k')}\n  \`\`\`\n`
    expect(noteOf(md).diagnostics).toEqual([err(20, 10, unitsMessages.wrongDimension('mV', 'voltage', 'resistance', ' for `rf`'))])
  })

  it('shifts columns for a block inside a block quote', () => {
    const md = `> \`\`\`stage s\n> topology: follower\n> opamp: zero-drift\n> rff: 1k\n> input: 1 V\n> supply: 5 V\n> \`\`\`\n`
    expect(noteOf(md).diagnostics).toEqual([err(4, 3, noteMessages.unknownKey('rff', 'stage `s`', 'a stage', 'rf', null))])
  })

  it('keeps lines and columns with CRLF line endings', () => {
    const md = note(replaceLine(2, 'rf: 10 mV')).replace(/\n/g, '\r\n')
    expect(noteOf(md).diagnostics).toEqual([err(18, 8, unitsMessages.wrongDimension('mV', 'voltage', 'resistance', ' for `rf`'))])
  })

  it('does not count a BOM as a column', () => {
    const md = `\uFEFF${note(replaceLine(2, 'rf: 10 mV'))}`
    expect(noteOf(md).diagnostics).toEqual([err(18, 8, unitsMessages.wrongDimension('mV', 'voltage', 'resistance', ' for `rf`'))])
  })

  it('counts a tab in a list item as one column', () => {
    const md = '- ```stage s\n\ttopology: follower\n\topamp: zero-drift\n\trf: 10 mV\n\tinput: 1 V\n\tsupply: 5 V\n  ```\n'
    // "\trf: 10 mV": the tab is column 1, so `mV` starts at column 9.
    expect(noteOf(md).diagnostics).toEqual([err(4, 9, unitsMessages.wrongDimension('mV', 'voltage', 'resistance', ' for `rf`'))])
  })
})

describe('parseNote() fences and files', () => {
  it('reports a block without an id at the fence', () => {
    const md = note().replace('```stage gain-a', '```stage')
    expect(noteOf(md).diagnostics).toEqual([err(15, 1, noteMessages.missingId('stage'))])
  })

  it('warns about an unclosed fence and still reads the block', () => {
    const md = note().replace(/```\n$/, '')
    const r = blocksOf(md)
    expect(r.diagnostics).toEqual([warn(15, 1, noteMessages.unclosedFence('stage `gain-a`'))])
    expect(r.stages[0]?.input).not.toBeNull()
  })

  it('reads a chain block into a chain node, and names an unknown stage at its place', () => {
    const {note: parsed, diagnostics} = noteOf('```chain front-end\nstages: [gain-a]\n```\n')
    expect(diagnostics).toEqual([err(2, 10, chainMessages.unknownStage('gain-a', 'chain `front-end`', null))])
    expect(parsed.tree.children[0]?.type).toBe('chainBlock')
  })

  it('refuses a binary file before parsing, with one message', () => {
    expect(decodeNote(new Uint8Array([0x23, 0x00, 0x41]))).toEqual({ok: false, message: noteMessages.binaryFile()})
    expect(decodeNote(new Uint8Array([0x23, 0xff, 0x41]))).toEqual({ok: false, message: noteMessages.notUtf8()})
    expect(decodeNote(new TextEncoder().encode('# A \uFFFD kept\n'))).toEqual({ok: true, text: '# A \uFFFD kept\n'})
    expect(decodeNote(new TextEncoder().encode(' \n\t'))).toEqual({ok: false, message: noteMessages.emptyNote()})
  })

  it('warns about front matter after a blank line', () => {
    expect(noteOf('\n---\ntitle: Late\n---\n').diagnostics).toEqual([warn(2, 1, noteMessages.frontMatterNotFirst(2))])
  })

  it('warns about an unknown front-matter key with a hint', () => {
    expect(noteOf('---\ntitel: X\n---\n').diagnostics).toEqual([warn(2, 1, noteMessages.unknownMetaKey('titel', 'title'))])
  })

  it('reports an unknown hazard context at its item', () => {
    expect(noteOf('---\ncontext:\n  - mains-conected\n---\n').diagnostics).toEqual([
      err(3, 5, noteMessages.unknownChoice('context', 'mains-conected', ['mains-connected', 'patient-connected', 'high-voltage', 'battery'], 'mains-connected'))
    ])
  })
})
