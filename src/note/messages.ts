/**
 * Message catalog of `src/note`: every diagnostic it raises, worded "Unexpected …, expected
 * …" with what was found, what was expected and how to fix it. Tests compare against these
 * functions, so wording lives here only. Value problems from the quantity grammar arrive
 * already worded by `src/units/messages.ts`.
 */

const q = (s: string): string => `\`${s}\``
const hint = (suggestion: string | null): string => (suggestion === null ? '' : `; did you mean ${q(suggestion)}?`)

/** A block kind's name, a key of the one table of kinds (./block-kinds.ts; not imported here, so no import loop). */
export type BlockKind = string

/** "stage `bridge-amp`", "front matter". */
export const blockName = (kind: BlockKind, id: string | null): string => (id === null ? `${kind} block` : `${kind} ${q(id)}`)

export const noteMessages = {
  binaryFile: () => 'This is a binary file, not a Markdown note (it contains NUL bytes)',
  tooLarge: (bytes: number, max: number) =>
    `The note is ${(bytes / 2 ** 20).toFixed(2)} MiB, larger than the ${max / 2 ** 20} MiB a note may be: split it into several notes`,
  notUtf8: () => 'The note is not valid UTF-8 text; save it as UTF-8',
  emptyNote: () => 'The note is empty: expected Markdown prose and stage blocks',
  tooManyBlocks: (found: number, max: number) =>
    `Unexpected ${found} stage and opamp blocks in one note, expected at most ${max}: split the note into several`,
  tooDeep: (max: number) =>
    `Unexpected nesting of lists or block quotes more than ${max} levels deep, expected at most ${max}: flatten the structure`,
  frontMatterNotFirst: (line: number) =>
    `Unexpected \`---\` on line ${line} after blank lines, expected front matter to start on line 1: remove the blank lines before it (as written it is a rule and a heading)`,
  frontMatterUnclosed: () =>
    'Unexpected `---` on line 1 without a closing `---`, expected front matter between two `---` lines: add `---` after its last key (as written the title, status and reviewers are lost)',
  yamlSyntax: (where: string, detail: string) => `Unexpected YAML in ${where}: ${detail}; expected \`key: value\` lines`,
  yamlWarning: (where: string, detail: string) => `Unexpected YAML in ${where}: ${detail}`,
  notAMap: (where: string, found: string) => `Unexpected ${found} in ${where}, expected \`key: value\` lines`,
  badKey: (where: string) => `Unexpected key that is not plain text in ${where}, expected a key name such as \`rf\``,
  duplicateKey: (key: string, where: string) => `Unexpected second ${q(key)} in ${where}, expected each key once: remove one`,
  firstKey: (key: string) => `First ${q(key)} here`,

  missingId: (kind: BlockKind) =>
    `Unexpected ${q(kind)} block without an id, expected one after ${q(kind)} (\`\`\`${kind} my-${kind}): add an id`,
  badId: (kind: BlockKind, id: string) =>
    `Unexpected ${kind} id ${q(id)}, expected one word of letters, digits, \`-\`, \`_\` or \`.\`: rename it`,
  duplicateId: (kind: BlockKind, id: string) =>
    `Unexpected second ${kind} ${q(id)}, expected each ${kind} id once: rename one`,
  firstId: (kind: BlockKind, id: string) => `First ${kind} ${q(id)} defined here`,
  swallowedBlock: (inner: string, where: string) =>
    `Unexpected \`${inner}\` fence inside the unclosed ${where}, expected ${where} closed before it (as written it swallows the rest of the note): add \`\`\` after its last key (a closing fence needs at least as many backticks as the opening one)`,
  unclosedFence: (where: string) =>
    `Unexpected end of the document inside ${where}, expected a closing fence: add \`\`\` after the last key (at least as many backticks as the opening fence)`,

  unknownKey: (key: string, where: string, kind: string, suggestion: string | null, otherKind: string | null) =>
    otherKind === null
      ? `Unexpected key ${q(key)} in ${where}, expected ${kind} key${hint(suggestion)}`
      : `Unexpected key ${q(key)} in ${where}, expected ${kind} key: ${q(key)} belongs in ${otherKind}`,
  keyNotForTopology: (key: string, topology: string, where: string) =>
    `Unexpected key ${q(key)} in ${topology} ${where}, expected only keys ${/^[aeiou]/.test(topology) ? 'an' : 'a'} ${topology} stage takes: remove it or change \`topology\``,
  missingKey: (key: string, where: string, why: string) =>
    `Missing ${q(key)} in ${where}, expected it ${why}: add \`${key}: …\``,
  notScalar: (key: string, found: string) => `Unexpected ${found} for ${q(key)}, expected a single value`,
  emptyValue: (key: string, expected: string) => `Unexpected empty value for ${q(key)}, expected ${expected}`,
  unknownChoice: (key: string, value: string, choices: readonly string[], suggestion: string | null) =>
    `Unexpected ${q(value)} for ${q(key)}, expected one of ${choices.map(q).join(', ')}${hint(suggestion)}`,

  negative: (key: string, value: string, expected: string) =>
    `Unexpected negative ${q(value)} for ${q(key)}, expected ${expected} of 0 or more: drop the minus sign, or check the value`,
  notPositive: (key: string, value: string, expected: string) =>
    `Unexpected ${q(value)} for ${q(key)}, expected ${expected} above 0: give its real value${key === 'rf' || key === 'rg' ? ' (a follower needs no `rg`; use `topology: follower` for unity gain)' : ''}`,
  notAboveZeroDb: (key: string, value: string) =>
    `Unexpected ${q(value)} for ${q(key)}, expected a ratio above 0 dB (more than 1 V/V): write the datasheet figure as a positive number of dB, e.g. \`120 dB\``,
  bandFromZero: () =>
    'Unexpected `band` starting at 0 Hz, expected a lower edge above 0 Hz (1/f noise has no finite total from 0 Hz): write e.g. `0.1 .. 10k Hz`',
  bandEmpty: (value: string) =>
    `Unexpected empty band ${q(value)}, expected a lower edge below the upper one: write e.g. \`0.1 .. 10k Hz\``,
  pmOutOfRange: (value: string) =>
    `Unexpected \`pm-unity\` of ${q(value)}, expected 0° < φ ≤ 90° (90° means no second pole): give the datasheet's unity-gain phase margin, e.g. \`60 deg\``,
  supplyTolerance: (value: string) =>
    `Unexpected supply tolerance ${q(value)}, expected under 100 %: write e.g. \`5 %\``,
  vrefOutsideSupply: (value: string, supply: string) =>
    `Unexpected \`vref\` of ${q(value)} outside the supply ${supply}, expected a reference between the rails (the + input cannot sit beyond them): change \`vref\` or \`supply\``,
  ccompWithoutRcomp: () =>
    'Unexpected `ccomp` without `rcomp`, expected `rcomp` beside it (ccomp bypasses the compensation resistor): add `rcomp` or remove `ccomp`',
  cfWithoutRf: () =>
    'Unexpected `cf` on a follower without `rf`, expected `rf` with it (cf sits across rf): add `rf` or remove `cf`',
  shuntParts: (key = 'rshunt') =>
    key === 'rshunt'
      ? 'Unexpected tolerance or tempco on `rshunt`, expected its value alone (the source shunt is not a chosen part): remove them'
      : `Unexpected tolerance or tempco on ${q(key)}, expected its value alone (a load's tolerance does not enter the budget): remove them`,
  capacitorExtra: (text: string) =>
    `Unexpected ${q(text)} after the capacitance, expected at most a tolerance (\`10 nF 5%\`)`,
  rgWithoutRf: () =>
    'Unexpected `rg` without `rf` on a Sallen-Key stage, expected both (gain 1 + rf/rg) or neither (unity gain): add `rf` or remove `rg`',
  implausible: (key: string, what: string, value: string, bound: string) =>
    `Unexpected ${what} ${q(value)} for ${q(key)}, beyond ${bound}: check the value and its prefix (the figures computed from it are shown, flagged where they leave the usual range)`,
  milliOhm: (key: string, value: string) =>
    `Unexpected ${q(value)} for ${q(key)}, a resistance under 1 Ω written with \`m\` (milli), expected more for this key; did you mean \`M\` (mega)?`,
  unknownRequirement: (key: string, suggestion: string | null, known: readonly string[] = []) =>
    `Unexpected requirement ${q(key)}, expected a requirement key${suggestion === null && known.length > 0 ? ` (one of ${known.map(q).join(', ')})` : hint(suggestion)}`,
  unknownRole: (value: string, suggestion: string | null) =>
    `Unexpected role ${q(value)}, expected ${q('design')} or ${q('baseline')}${hint(suggestion)}`,
  acceptNotMap: () => 'Unexpected value for `accept`, expected a map of rule ids to the reason each is accepted (`bandwidth-margin: "reason"` on the lines below, indented)',
  acceptNoReason: (rule: string) => `Expected a reason after ${q(rule)} in \`accept\`: say why the note is accepted, so that the reviewer can judge it`,
  yieldNotMap: (value: string) =>
    `Unexpected ${value === '' ? 'value' : q(value)} for \`yield\`, expected a map such as \`{ trials: 100k, seed: 1, distribution: uniform }\` (each key optional), or \`on\` for the defaults`,
  yieldTrials: (value: string, max: number) =>
    `Unexpected ${q(value)} for \`yield.trials\`, expected a whole number of trials from 1 to ${max.toLocaleString('en-US')} (\`100k\`, \`1M\`, \`20000\`)`,
  yieldRequirement: (value: string) => `Unexpected ${q(value)} for \`require.yield\`, expected a minimum yield above 0 % and at most 100 % (\`99.7 %\`)`,
  yieldWithoutDcRequirement: () =>
    'Unexpected `yield` without a DC error requirement, expected it beside `output-error`, `input-error` or their `-calibrated` forms (the yield is the share of trials meeting them)',
  yieldSeed: (value: string) => `Unexpected ${q(value)} for \`yield.seed\`, expected a whole number from 0 to 4294967295`,
  yieldUnknownKey: (key: string, suggestion: string | null, known: readonly string[]) =>
    `Unexpected key ${q(key)} in \`yield\`, expected ${suggestion === null ? `one of ${known.map(q).join(', ')}` : `${q(suggestion)}`}`,
  requireNotMap: () => 'Unexpected value for `require`, expected a map of requirements (`noise-rms: 30 uV` on the lines below, indented)',

  unknownOpamp: (name: string, stage: string, suggestion: string | null, archetypes: readonly string[] = []) =>
    `Unexpected opamp ${q(name)} in ${stage}, expected the id of an opamp block of this note or an archetype${suggestion === null && archetypes.length > 0 ? `: add an \`opamp ${name}\` block above the stage, or name an archetype (${archetypes.map(q).join(', ')})` : hint(suggestion)}`,
  unknownIna: (name: string, stage: string, suggestion: string | null, archetypes: readonly string[] = []) =>
    `Unexpected ina ${q(name)} in ${stage}, expected the id of an ina block above the stage or an INA archetype${suggestion === null && archetypes.length > 0 ? ` (${archetypes.map(q).join(', ')})` : hint(suggestion)}`,
  opampDefinedLater: (name: string, line: number) =>
    `Unexpected opamp ${q(name)} before its block (line ${line}), expected it defined above the stage: move the opamp block up`,
  opampHasErrors: (stage: string, name: string) =>
    `${stage} is not evaluated: its opamp ${q(name)} has errors`,
  archetypeShadowed: (id: string) =>
    `Unexpected opamp block ${q(id)} with the name of a built-in archetype, expected a name of its own: the block is used, not the archetype; rename it to avoid confusion`,

  unknownMetaKey: (key: string, suggestion: string | null) =>
    `Unexpected front-matter key ${q(key)}, expected a document key${hint(suggestion)}; it is ignored`,
  metaNotText: (key: string, found: string) => `Unexpected ${found} for ${q(key)}, expected text`,
  metaNotList: (key: string, found: string) => `Unexpected ${found} for ${q(key)}, expected a list (\`- item\` lines)`,
  badReviewer: (found: string) =>
    `Unexpected reviewer ${found}, expected "Name", "Name (Role)" or a map with \`name\` and \`role\``,
  unknownReviewerKey: (key: string) => `Unexpected reviewer key ${q(key)}, expected \`name\` or \`role\`; it is ignored`
} as const
