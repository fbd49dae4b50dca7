/**
 * Message catalog of the quantity grammar. Every message says what was found, what was
 * expected, and how to fix it ("Unexpected …, expected …"). `where` is an optional phrase
 * naming the key (" for `rf`"); callers in `src/note` pass it so that the message names the
 * key, and callers without a key pass "".
 */
import {DIMENSIONS, type Dimension} from './dimensions.js'

const expectedOf = (dim: Dimension): string => {
  const d = DIMENSIONS[dim]
  return `${d.label} (${d.si}, e.g. \`${d.example}\`)`
}

export const unitsMessages = {
  empty: (dim: Dimension, where: string) => `Unexpected empty value${where}, expected ${expectedOf(dim)}`,
  noNumber: (found: string, dim: Dimension, where: string) =>
    `Unexpected \`${found}\`${where}, expected a number first, as ${expectedOf(dim)}`,
  comma: (found: string, fixed: string, where: string) =>
    `Unexpected comma in \`${found}\`${where}, expected a decimal point: use a point (\`${fixed}\`)`,
  nonFinite: (found: string, where: string, dim?: Dimension) =>
    `Unexpected non-finite number \`${found}\`${where}, expected a finite value${dim === undefined ? '' : ` (${DIMENSIONS[dim].label}, e.g. \`${DIMENSIONS[dim].example}\`)`}: write the number itself`,
  outOfRange: (found: string, dim: Dimension, where: string, direction: 'overflow' | 'underflow') =>
    `Unexpected \`${found}\`${where}: ${direction === 'overflow' ? 'too large to represent (it overflows to infinity)' : 'too small to represent (it underflows to 0)'}, expected ${expectedOf(dim)}: check the exponent and the prefix`,
  beyondPhysical: (found: string, dim: Dimension, where: string) =>
    `Unexpected \`${found}\`${where}: beyond any physical value (more than 10^18 ${DIMENSIONS[dim].si === 'dB' ? 'as a linear ratio, i.e. over 360 dB' : `${DIMENSIONS[dim].si}`}), expected ${expectedOf(dim)}: check the exponent and the prefix`,
  belowPhysical: (found: string, dim: Dimension, where: string) =>
    `Unexpected \`${found}\`${where}: below any physical value (under 10^-24 ${DIMENSIONS[dim].si === 'dB' ? 'as a linear ratio, i.e. under −480 dB' : `${DIMENSIONS[dim].si}`} but not 0), expected ${expectedOf(dim)}: check the exponent and the prefix, or write 0`,
  loneSign: (where: string) => `Unexpected lone \`±\`${where}, expected a number after it (\`±15 V\`)`,
  plusMinus: (where: string) =>
    `Unexpected \`±\`${where}, expected a single value; \`±\` is only for a supply or a range (\`supply: ±15 V\`, \`input: ±10 mV\`)`,
  bareDecibel: (found: string, db: number, where: string) =>
    `Unexpected \`${found}\`${where}: a bare number on a dB key is read as dB (${found} dB, beyond any physical ratio); ` +
    `if ${found} is the linear ratio, write \`${Number(db.toFixed(1))} dB\``,
  unknownUnit: (unit: string, dim: Dimension, where: string) =>
    `Unexpected unit \`${unit}\`${where}, expected ${expectedOf(dim)}`,
  wrongDimension: (unit: string, found: Dimension, dim: Dimension, where: string) =>
    `Unexpected unit \`${unit}\` (${DIMENSIONS[found].label})${where}, expected ${expectedOf(dim)}`,
  lsbNotHere: (unit: string, dim: Dimension, where: string) =>
    `Unexpected unit \`${unit}\`${where}, expected ${expectedOf(dim)}: \`LSB\` is legal only on the keys of an adc block and a chain's converter requirements`,
  wrongCase: (prefix: string, meant: string, unit: string, where: string) =>
    `Unexpected prefix \`${prefix}\` in \`${unit}\`${where}, expected \`${meant}\`: SI prefixes are case-sensitive`,
  prefixNotAllowed: (unit: string, dim: Dimension, where: string) =>
    `Unexpected prefix in \`${unit}\`${where}, expected ${expectedOf(dim)} with no prefix`,
  rkmWithPrefix: (found: string, unit: string, where: string) =>
    `Unexpected prefix in \`${unit}\` after the RKM code \`${found}\`${where}, expected no second multiplier: the letter inside \`${found}\` already is one; write \`${found}\` alone or a decimal value with a prefix (\`4.7 kΩ\`)`,
  rangeInSingle: (where: string, dim?: Dimension) =>
    `Unexpected range${where}, expected a single value${dim === undefined ? '' : ` (${DIMENSIONS[dim].label}, e.g. \`${DIMENSIONS[dim].example}\`)`}: ranges \`a .. b\` are only for \`input\`, \`supply\`, \`temperature\` and \`band\``,
  belowAbsoluteZero: (found: string, where: string) =>
    `Unexpected temperature \`${found}\`${where}, expected one above absolute zero (−273.15 °C): check the sign and the unit (\`-40 °C\`, \`233 K\`)`,
  rangeNoSpaces: (found: string, fixed: string, where: string) =>
    `Unexpected \`..\` without spaces in \`${found}\`${where}, expected spaces around it: \`${fixed}\``,
  rangeTooMany: (where: string) => `Unexpected second \`..\`${where}, expected one range \`low .. high\``,
  rangeReversed: (found: string, fixed: string, where: string) =>
    `Unexpected reversed range \`${found}\`${where}, expected low before high: \`${fixed}\``,
  rangePrefixOneEnd: (found: string, prefix: string, unit: string, meant: string, where: string) =>
    `Range \`${found}\`${where} reads its left end in \`${unit}\`, without the prefix \`${prefix}\` (a prefix stays with its number); if both ends are in \`${prefix}${unit}\`, write \`${meant}\``,
  rangePrefixNotShared: (found: string, prefix: string, unit: string, fixed: string, where: string) =>
    `Unexpected reversed range \`${found}\`${where}: the left end takes the unit \`${unit}\` but not the prefix \`${prefix}\` (a prefix stays with its number), expected low before high: write \`${fixed}\``,
  supplyEmpty: (found: string, where: string) =>
    `Unexpected empty supply \`${found}\`${where}, expected two different rails (\`±15 V\`, \`0 .. 5 V\`)`,
  supplyMagnitude: (found: string, where: string) =>
    `Unexpected \`±${found}\`${where}, expected a positive magnitude after \`±\` (\`±15 V\`)`,
  resistorExtra: (found: string, where: string) =>
    `Unexpected \`${found}\` after the resistor value${where}, expected a tolerance (\`0.1%\`) or a tempco (\`25ppm/K\`)`,
  resistorTwice: (part: 'tolerance' | 'tempco', found: string, where: string) =>
    `Unexpected second ${part} \`${found}\`${where}, expected at most one: remove one of them`,
  toleranceTooLarge: (found: string, where: string) =>
    `Unexpected tolerance \`${found}\`${where}, expected under 100 % (at 100 % or more the resistor could be 0 Ω or negative): write e.g. \`0.1%\``,
  negativePart: (part: 'tolerance' | 'tempco', found: string, where: string) =>
    `Unexpected negative ${part} \`${found}\`${where}, expected a magnitude (each resistor moves by ± its ${part})`
} as const
