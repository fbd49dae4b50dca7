/**
 * Message catalog of the `adc` and `chain` blocks (DESIGN §8.5, §8.6), worded as the rest of
 * `src/note` ("Unexpected …, expected …").
 */
const q = (s: string): string => `\`${s}\``
const hint = (suggestion: string | null): string => (suggestion === null ? '' : `; did you mean ${q(suggestion)}?`)

export const chainMessages = {
  bitsNotInteger: (value: string) =>
    `Unexpected ${q(value)} for \`bits\`, expected a whole number of bits from 1 to 32, e.g. \`24\``,
  adcInputEmpty: (value: string) =>
    `Unexpected converter input range ${q(value)}, expected a lower end below the upper one, e.g. \`-2.5 .. 2.5 V\``,
  stagesNotList: () => 'Unexpected value for `stages`, expected a list of stage ids in signal order, e.g. `[front-end, filter]`',
  stagesEmpty: () => 'Unexpected empty `stages`, expected at least one stage id',
  stageNotText: () => 'Unexpected item in `stages`, expected a stage id',
  unknownStage: (name: string, chain: string, suggestion: string | null) =>
    `Unexpected stage ${q(name)} in ${chain}, expected the id of a stage block of this note${hint(suggestion)}`,
  stageDefinedLater: (name: string, line: number) =>
    `Unexpected stage ${q(name)} before its block (line ${line}), expected every stage of a chain defined above the chain: move the chain block down`,
  stageRepeated: (name: string) => `Unexpected second ${q(name)} in \`stages\`, expected each stage once in a chain`,
  firstHere: (name: string) => `First ${q(name)} here`,
  stageInTwoChains: (name: string, other: string) =>
    `Unexpected stage ${q(name)}, already in chain ${q(other)}, expected each stage in one chain at most (its input would come from two places)`,
  otherChain: (other: string) => `Chain ${q(other)} defined here`,
  onlyFirst: (name: string, topology: string) =>
    `Unexpected ${topology} stage ${q(name)} after the first place of the chain, expected it first: a ${topology} stage takes the sensor's own signal`,
  stageHasErrors: (chain: string, name: string) => `${chain} is not evaluated: its stage ${q(name)} has errors`,
  unknownAdc: (name: string, chain: string, suggestion: string | null, archetypes: readonly string[]) =>
    `Unexpected converter ${q(name)} in ${chain}, expected the id of an adc block of this note or an archetype${suggestion === null ? ` (${archetypes.map(q).join(', ')})` : hint(suggestion)}`,
  adcDefinedLater: (name: string, line: number) =>
    `Unexpected converter ${q(name)} before its block (line ${line}), expected it defined above the chain: move the adc block up`,
  adcHasErrors: (chain: string, name: string) => `${chain} is not evaluated: its converter ${q(name)} has errors`,
  lsbWithoutConverter: (key: string) =>
    `Unexpected requirement ${q(key)} on a chain without \`adc\`, expected an \`adc:\` key (LSB and bits are the converter's): add one or remove the requirement`,
  yieldWithoutDcRequirement: () =>
    'Unexpected `yield` without a DC error requirement on the chain, expected it beside `output-error`, `input-error`, `error-lsb` or their `-calibrated` forms (the yield is the share of trials meeting them)',
  aliasWithoutRate: () =>
    'Unexpected requirement `alias-rejection` without a converter `sample-rate`, expected one on the adc block: add `sample-rate` or remove the requirement',
  inputDiffers: (stage: string, given: string, computed: string, previous: string) =>
    `Stage ${q(stage)}: its \`input\` ${given} differs from the output of ${q(previous)}, ${computed}, by more than 1 % of the span; the computed range is used (DESIGN §8.6): remove \`input\` or correct it`
} as const
