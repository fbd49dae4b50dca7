/**
 * fast-check generators for the fuzz tests: quantity texts built from the grammar's own
 * pieces (numbers, prefixes, units, separators) and from junk, `key: value` lines for the
 * stage language, valid blocks to mutate, and whole notes of random Markdown around them.
 * Parts and values are invented.
 */
import fc from 'fast-check'
import {ARCHETYPE_NAMES} from '../../src/engine/archetypes.js'
import {INPUT_TYPES, REQUIREMENT_KEYS, TOPOLOGIES} from '../../src/engine/types.js'
import {OPAMP_BLOCK_KEYS, STAGE_KEYS} from '../../src/note/keys.js'
import {DIMENSIONS, DIMENSION_NAMES, type Dimension} from '../../src/units/index.js'

const UNIT_SYMBOLS = [...new Set(Object.values(DIMENSIONS).flatMap((d) => d.units.flatMap((u) => [...u.symbols])))]
const PREFIX_LETTERS = ['f', 'p', 'n', 'u', 'µ', 'μ', 'm', 'k', 'K', 'M', 'G', 'T', 'P', 'g', 'N', 'U', 'F', 'R']

/** Numbers as people (and mistakes) write them. */
export const numberText: fc.Arbitrary<string> = fc.oneof(
  fc.integer({min: -100000, max: 100000}).map(String),
  fc.double({noDefaultInfinity: false}).map(String),
  fc.double({min: 1e-18, max: 1e18, noNaN: true}).map((x) => x.toPrecision(3)),
  fc.tuple(fc.nat(999), fc.constantFrom(...'RkKMGpnuµm'), fc.nat(99)).map(([a, l, b]) => `${a}${l}${b}`),
  fc.constantFrom(
    '0', '-0', '+5', '−5', '.5', '5.', '1e', '1e-', '1e400', '-1e400', '1e-400', '1e308', '1e-320', 'NaN', 'nan', 'Infinity',
    '-Infinity', 'inf', '1,5', '1,000', '4k7', 'R47', '1M0', '2R2', '4n7', 'k', 'R', '1..2', '1 .. 2', '0x10', '1_000', '3.5.1',
    '99999999999999999999999999999999999999999', '0.000000000000000000000000000000000000001'
  )
)

/** Glue between the pieces of a value. */
const glue = fc.constantFrom('', ' ', '  ', '\t', '..', ' .. ', '…', ' … ', '±', '+-', '-', '−', ',', '/', '(', ')', '%', '#',
  ' constructor ', ' __proto__ ', 'toString', ' valueOf ')

/** One piece of a quantity text. */
const piece: fc.Arbitrary<string> = fc.oneof(
  {weight: 4, arbitrary: numberText},
  {weight: 3, arbitrary: fc.constantFrom(...UNIT_SYMBOLS)},
  {weight: 2, arbitrary: fc.constantFrom(...PREFIX_LETTERS)},
  {weight: 3, arbitrary: glue},
  {weight: 1, arbitrary: fc.string({maxLength: 6})},
  {weight: 1, arbitrary: fc.string({unit: 'grapheme', maxLength: 4})}
)

/** A plausible value: a number, maybe a prefix, a unit of some dimension. */
const plausible: fc.Arbitrary<string> = fc
  .tuple(numberText, fc.constantFrom('', ' '), fc.constantFrom('', ...PREFIX_LETTERS.slice(0, 11)), fc.constantFrom('', ...UNIT_SYMBOLS))
  .map(([n, s, p, u]) => `${n}${s}${p}${u}`)

/** A text for the quantity grammar: built from its pieces, plausible, or anything. */
export const quantityText: fc.Arbitrary<string> = fc.oneof(
  {weight: 5, arbitrary: fc.array(piece, {maxLength: 8}).map((ps) => ps.join(''))},
  {weight: 3, arbitrary: plausible},
  {weight: 2, arbitrary: fc.tuple(plausible, fc.constantFrom(' .. ', '..', ' … ', ' to '), plausible).map(([a, s, b]) => `${a}${s}${b}`)},
  {weight: 1, arbitrary: fc.string({maxLength: 30})},
  {weight: 1, arbitrary: fc.string({unit: 'binary', maxLength: 30})}
)

/** A resistor text: a value and up to three parts. */
export const resistorText: fc.Arbitrary<string> = fc.oneof(
  quantityText,
  fc.tuple(plausible, fc.array(fc.oneof(quantityText, fc.constantFrom('0.1%', '±1 %', '25ppm/K', '5 ppm/°C', '150%', '-1%', '1e400%')), {maxLength: 3}))
    .map(([v, parts]) => [v, ...parts].join(' '))
)

export const dimension: fc.Arbitrary<Dimension> = fc.constantFrom(...DIMENSION_NAMES)

const STAGE_KEY_NAMES = Object.keys(STAGE_KEYS)
const REQUIRE_KEYS = Object.keys(REQUIREMENT_KEYS)

/** Keys of the stage language, of the opamp block, and near misses. */
const keyName = fc.oneof(
  {weight: 6, arbitrary: fc.constantFrom(...STAGE_KEY_NAMES)},
  {weight: 2, arbitrary: fc.constantFrom(...OPAMP_BLOCK_KEYS)},
  {weight: 1, arbitrary: fc.constantFrom('rff', 'Rf', 'r f', 'rg ', '', '-', '? x', '[a]', '"rf"', 'require.noise-rms', '&a', '*a', 'constructor', '__proto__', 'toString')},
  {weight: 1, arbitrary: fc.string({maxLength: 8})}
)

/** A value for a key line: words of the language, quantities, YAML oddities. */
const valueText = fc.oneof(
  {weight: 5, arbitrary: quantityText},
  {weight: 2, arbitrary: fc.constantFrom(...TOPOLOGIES, ...ARCHETYPE_NAMES, ...INPUT_TYPES, 'amp-1', 'amp-2')},
  {weight: 1, arbitrary: fc.constantFrom('', '~', 'null', '[1, 2]', '{a: 1}', '"10k"', "'10k'", '|', '>', '&a 1k', '*a', '!!str 1k', '- 1k', ': x', '"unclosed', '[unclosed', '# only a comment')}
)

/** One line of a block: `key: value`, a `require` map, or a broken line. */
export const blockLine: fc.Arbitrary<string> = fc.oneof(
  {weight: 8, arbitrary: fc.tuple(keyName, fc.constantFrom(': ', ':', ':  ', ' : ', ':\t'), valueText).map(([k, s, v]) => `${k}${s}${v}`)},
  {weight: 2, arbitrary: fc.array(fc.tuple(fc.constantFrom(...REQUIRE_KEYS, 'gain', 'noise'), quantityText), {maxLength: 3})
    .map((rs) => ['require:', ...rs.map(([k, v]) => `  ${k}: ${v}`)].join('\n'))},
  {weight: 1, arbitrary: fc.constantFrom('', '  ', '\t', '# comment', '---', '...', '```', '- item', 'rf', ':', '  rf: 1k', '\trf: 1k')}
)

/** An opamp block of invented values, valid as written. */
export const OPAMP_BLOCK = [
  '```opamp amp-1',
  'input-type: bipolar',
  'vos: 50 uV', 'vos-drift: 0.5 uV/K', 'ib: 2 nA', 'ios: 1 nA', 'en: 8 nV/√Hz', 'en-corner: 3 Hz',
  'in: 0.2 pA/√Hz', 'in-corner: 50 Hz', 'gbw: 2 MHz', 'aol: 120 dB', 'pm-unity: 60 deg', 'cmrr: 110 dB',
  'psrr: 110 dB', 'cin-diff: 3 pF', 'cin-cm: 4 pF', 'slew: 1 V/us', 'swing-headroom: 1 V',
  '```'
].join('\n')

/** Valid stage bodies, one per topology, to mutate. */
export const STAGE_BODIES: readonly (readonly string[])[] = [
  ['topology: noninverting', 'opamp: amp-1', 'rf: 49.9k 0.1% 25ppm/K', 'rg: 1k 0.1% 25ppm/K', 'rs: 350', 'cstray: 2 pF',
    'input: -10m .. 10m V', 'supply: ±15 V', 'temperature: -40 .. 85 °C', 'band: 0.1 .. 1k Hz', 'require:', '  noise-rms: 30 uV'],
  ['topology: inverting', 'opamp: general-bipolar', 'rf: 100k 1%', 'rg: 10k 1%', 'vref: 2.5 V', 'input: -1 .. 1 V', 'supply: 0 .. 5 V'],
  ['topology: follower', 'opamp: precision-cmos', 'rs: 10k', 'input: 0 .. 2 V', 'supply: 5 V', 'band: 1 .. 10k Hz'],
  ['topology: transimpedance', 'opamp: precision-jfet', 'rf: 10M 1%', 'cf: 1 pF', 'rshunt: 1G', 'csource: 20 pF', 'idark: 50 pA',
    'input: 0 .. 100 nA', 'supply: ±5 V']
]

/** A mutation of a list of lines: replace, drop, add or duplicate a line. */
const mutation = fc.oneof(
  fc.tuple(fc.constant('replace' as const), fc.nat(), blockLine),
  fc.tuple(fc.constant('value' as const), fc.nat(), valueText),
  fc.tuple(fc.constant('drop' as const), fc.nat(), fc.constant('')),
  fc.tuple(fc.constant('add' as const), fc.nat(), blockLine),
  fc.tuple(fc.constant('duplicate' as const), fc.nat(), fc.constant(''))
)

function mutate(lines: readonly string[], ms: readonly (readonly [string, number, string])[]): string[] {
  const out = [...lines]
  for (const [kind, n, text] of ms) {
    const i = out.length === 0 ? 0 : n % out.length
    if (kind === 'replace') out[i] = text
    else if (kind === 'value') out[i] = `${(out[i] ?? 'rf').split(':')[0] ?? 'rf'}: ${text}`
    else if (kind === 'drop') out.splice(i, 1)
    else if (kind === 'add') out.splice(i, 0, text)
    else out.splice(i, 0, out[i] ?? '')
  }
  return out
}

/** A stage body: a valid one with a few mutations (often still valid), or random lines. */
export const stageBody: fc.Arbitrary<string> = fc.oneof(
  {weight: 3, arbitrary: fc.tuple(fc.constantFrom(...STAGE_BODIES), fc.array(mutation, {maxLength: 2})).map(([b, ms]) => mutate(b, ms).join('\n'))},
  {weight: 2, arbitrary: fc.constantFrom(...STAGE_BODIES).map((b) => b.join('\n'))},
  {weight: 2, arbitrary: fc.array(blockLine, {maxLength: 12}).map((ls) => ls.join('\n'))}
)

const fenced = (info: string, body: string): string => `\`\`\`${info}\n${body}\n\`\`\``

/** Ordinary Markdown pieces. */
const prose = fc.oneof(
  fc.constantFrom('# Heading', '## Stage notes', 'Some prose with *emphasis* and `code`.', '- a list item', '1. numbered',
    '> a quote', '| a | b |\n| - | - |\n| 1 | 2 |', '- [ ] task', 'Text[^1].\n\n[^1]: A footnote.', '---', '***',
    '```js\nconsole.log(1)\n```', '    indented code', '<div>html</div>', '![image](missing.png)', ''),
  fc.string({maxLength: 40})
)

/** A block, maybe inside a list item or a quote (each line prefixed), maybe with its fence left open. */
const block = fc
  .tuple(
    fc.oneof(
      {weight: 4, arbitrary: stageBody.map((b) => ({info: 'stage', body: b}))},
      {weight: 1, arbitrary: fc.constant({info: 'opamp', body: OPAMP_BLOCK.split('\n').slice(1, -1).join('\n')})},
      {weight: 1, arbitrary: fc.array(blockLine, {maxLength: 6}).map((ls) => ({info: 'opamp', body: ls.join('\n')}))},
      {weight: 1, arbitrary: fc.constant({info: 'chain', body: 'stages: [a, b]'})}
    ),
    fc.constantFrom('s-1', 's-2', 'amp-1', 'amp-2', '', 'two words', 'general-bipolar', 'x'),
    fc.constantFrom('', '- ', '> ', '  ', '\t', '1. '),
    fc.boolean()
  )
  .map(([{info, body}, id, prefix, open]) => {
    const text = fenced(`${info}${id === '' ? '' : ` ${id}`}`, body)
    const lines = (open ? text.slice(0, text.lastIndexOf('\n')) : text).split('\n')
    return lines.map((l, i) => (i === 0 || prefix.trim() === '' || prefix === '> ' ? prefix : ' '.repeat(prefix.length)) + l).join('\n')
  })

const frontMatter = fc.oneof(
  fc.constant(''),
  fc.constant('---\ntitle: A note\nstatus: draft\nreviewers:\n  - A. Person (Approver)\ncontext: [battery]\n---\n'),
  fc.array(fc.tuple(fc.constantFrom('title', 'status', 'reviewers', 'context', 'date', 'template', 'titel', 'x'), valueText), {maxLength: 4})
    .map((kv) => `---\n${kv.map(([k, v]) => `${k}: ${v}`).join('\n')}\n---\n`),
  fc.constant('\n---\ntitle: late\n---\n'),
  fc.constant('---\ntitle: [unclosed\n---\n')
)

/** A whole note: front matter, then prose and blocks in any order, with LF, CRLF or CR endings. */
export const noteText: fc.Arbitrary<string> = fc
  .tuple(
    frontMatter,
    fc.boolean(),
    fc.array(fc.oneof({weight: 2, arbitrary: prose}, {weight: 3, arbitrary: block}), {maxLength: 6}),
    fc.constantFrom('\n', '\r\n', '\r'),
    fc.boolean()
  )
  .map(([fm, withOpamp, parts, eol, bom]) => {
    const body = [fm, ...(withOpamp ? [OPAMP_BLOCK] : []), ...parts].join('\n\n')
    return (bom ? '\uFEFF' : '') + body.replace(/\r\n|\r|\n/g, eol)
  })

/** A valid note text with character-level damage: a cut, an insertion, a swap of lines. */
export const damagedNote = (valid: string): fc.Arbitrary<string> =>
  fc.array(fc.tuple(fc.constantFrom('cut', 'insert', 'swap'), fc.nat(), fc.nat(40), fc.oneof(piece, blockLine, prose)), {minLength: 1, maxLength: 4})
    .map((edits) => {
      let text = valid
      for (const [kind, at, len, insert] of edits) {
        const i = at % (text.length + 1)
        if (kind === 'cut') text = text.slice(0, i) + text.slice(i + len)
        else if (kind === 'insert') text = text.slice(0, i) + insert + text.slice(i)
        else {
          const lines = text.split('\n')
          const a = at % lines.length
          const b = (at + len) % lines.length
          ;[lines[a], lines[b]] = [lines[b] ?? '', lines[a] ?? '']
          text = lines.join('\n')
        }
      }
      return text
    })
