/**
 * The key tables of the stage language: every key of a `stage` block (DESIGN §3.3) and of
 * an `opamp` block (§3.2), with how its value is read and where it applies. One table
 * drives parsing, unknown-key hints, keys that don't apply to a topology, and missing
 * required keys; `stage-block.ts` and `opamp-block.ts` only walk it.
 */
import type {Dimension} from '../units/index.js'
import type {OpampParams, Topology} from '../engine/types.js'

/** r = required, o = optional, – = an error if given (DESIGN §3.3's table). */
export type Use = 'r' | 'o' | '-'
type Uses = Readonly<Record<Topology, Use>>

/**
 * Columns in TOPOLOGIES order: noninverting, inverting, follower, transimpedance, difference,
 * lowpass-sallen-key, lowpass-mfb, instrumentation.
 */
const uses = (...u: [Use, Use, Use, Use, Use, Use, Use, Use]): Uses => ({
  noninverting: u[0], inverting: u[1], follower: u[2], transimpedance: u[3], difference: u[4], 'lowpass-sallen-key': u[5], 'lowpass-mfb': u[6], instrumentation: u[7]
})
const ALL_R: Uses = uses('r', 'r', 'r', 'r', 'r', 'r', 'r', 'r')
const ALL_O: Uses = uses('o', 'o', 'o', 'o', 'o', 'o', 'o', 'o')
/** Keys of the op-amp's loop and output network: an integrated INA has neither (DESIGN §8.2). */
const OPAMP_STAGES_O: Uses = uses('o', 'o', 'o', 'o', 'o', 'o', 'o', '-')
const TIA_ONLY: Uses = uses('-', '-', '-', 'o', '-', '-', '-', '-')
const DIFFERENCE_R: Uses = uses('-', '-', '-', '-', 'r', '-', '-', '-')
const FILTERS_R: Uses = uses('-', '-', '-', '-', '-', 'r', 'r', '-')

/** How a stage value is read. */
export type StageKind =
  | {kind: 'text'}
  | {kind: 'topology'}
  | {kind: 'opamp'}
  /** `value [tolerance] [tempco]`. */
  | {kind: 'resistor'}
  /** A resistance without tolerance or tempco (rshunt, rload). */
  | {kind: 'shunt'}
  /** `value [tolerance]` (DESIGN §8.4). */
  | {kind: 'capacitor'}
  /** Common-mode range, V; a single value is x .. x. */
  | {kind: 'input-cm'}
  /** An ina block id or an INA archetype (DESIGN §8.2). */
  | {kind: 'ina'}
  /** `none | offset | offset-and-gain` (DESIGN §4.6). */
  | {kind: 'calibration'}
  | {kind: 'quantity'; dim: Dimension}
  /** Signal range: V, or A for transimpedance; a single value is 0 .. x. */
  | {kind: 'input'}
  | {kind: 'supply'}
  /** Temperature range; a single value is x .. x. */
  | {kind: 'temperature-range'}
  /** Frequency range; a single value is 0 .. x (and so refused: it starts at 0 Hz). */
  | {kind: 'band'}
  | {kind: 'require'}
  /** `design` (default) or `baseline`: a stage kept for comparison, shown but not counted. */
  | {kind: 'role'}
  /** `{ trials, seed, distribution }` of the Monte Carlo (DESIGN §8.7). */
  | {kind: 'yield'}
  /** A map of rule id → the author's reason for accepting that rule's note (the ids are checked in src/evaluate). */
  | {kind: 'accept'}
  /** `true` or `false` (DESIGN §8.8's `alternatives`). */
  | {kind: 'flag'}

export interface StageKeySpec {
  readonly read: StageKind
  readonly use: Uses
}

export const STAGE_KEYS = {
  title: {read: {kind: 'text'}, use: ALL_O},
  topology: {read: {kind: 'topology'}, use: ALL_R},
  opamp: {read: {kind: 'opamp'}, use: uses('r', 'r', 'r', 'r', 'r', 'r', 'r', '-')},
  ina: {read: {kind: 'ina'}, use: uses('-', '-', '-', '-', '-', '-', '-', 'r')},
  rf: {read: {kind: 'resistor'}, use: uses('r', 'r', 'o', 'r', 'r', 'o', '-', '-')},
  rg: {read: {kind: 'resistor'}, use: uses('r', 'r', '-', '-', 'r', 'o', '-', 'r')},
  rs: {read: {kind: 'resistor'}, use: uses('o', 'o', 'o', '-', 'o', '-', '-', 'o')},
  rp: {read: {kind: 'resistor'}, use: DIFFERENCE_R},
  rref: {read: {kind: 'resistor'}, use: DIFFERENCE_R},
  r1: {read: {kind: 'resistor'}, use: FILTERS_R},
  r2: {read: {kind: 'resistor'}, use: FILTERS_R},
  r3: {read: {kind: 'resistor'}, use: uses('-', '-', '-', '-', '-', '-', 'r', '-')},
  c1: {read: {kind: 'capacitor'}, use: FILTERS_R},
  c2: {read: {kind: 'capacitor'}, use: FILTERS_R},
  rcomp: {read: {kind: 'resistor'}, use: uses('o', 'o', 'o', 'o', '-', '-', 'o', '-')},
  ccomp: {read: {kind: 'quantity', dim: 'capacitance'}, use: uses('o', 'o', 'o', 'o', '-', '-', 'o', '-')},
  cf: {read: {kind: 'quantity', dim: 'capacitance'}, use: uses('o', 'o', 'o', 'o', 'o', 'o', '-', '-')},
  cstray: {read: {kind: 'quantity', dim: 'capacitance'}, use: OPAMP_STAGES_O},
  'cstray-plus': {read: {kind: 'quantity', dim: 'capacitance'}, use: OPAMP_STAGES_O},
  rshunt: {read: {kind: 'shunt'}, use: TIA_ONLY},
  csource: {read: {kind: 'quantity', dim: 'capacitance'}, use: TIA_ONLY},
  idark: {read: {kind: 'quantity', dim: 'current'}, use: TIA_ONLY},
  'idark-max': {read: {kind: 'quantity', dim: 'current'}, use: TIA_ONLY},
  'idark-doubling': {read: {kind: 'quantity', dim: 'temperature-interval'}, use: TIA_ONLY},
  vref: {read: {kind: 'quantity', dim: 'voltage'}, use: uses('-', 'o', '-', 'o', 'o', '-', 'o', 'o')},
  riso: {read: {kind: 'resistor'}, use: OPAMP_STAGES_O},
  cload: {read: {kind: 'quantity', dim: 'capacitance'}, use: OPAMP_STAGES_O},
  input: {read: {kind: 'input'}, use: ALL_R},
  'input-cm': {read: {kind: 'input-cm'}, use: uses('-', '-', '-', '-', 'o', '-', '-', 'o')},
  supply: {read: {kind: 'supply'}, use: ALL_R},
  'supply-tolerance': {read: {kind: 'quantity', dim: 'fraction'}, use: ALL_O},
  temperature: {read: {kind: 'temperature-range'}, use: ALL_O},
  band: {read: {kind: 'band'}, use: ALL_O},
  'noise-temperature': {read: {kind: 'quantity', dim: 'temperature'}, use: ALL_O},
  'signal-frequency': {read: {kind: 'quantity', dim: 'frequency'}, use: ALL_O},
  rload: {read: {kind: 'shunt'}, use: ALL_O},
  calibration: {read: {kind: 'calibration'}, use: ALL_O},
  require: {read: {kind: 'require'}, use: ALL_O},
  role: {read: {kind: 'role'}, use: ALL_O},
  accept: {read: {kind: 'accept'}, use: ALL_O},
  /** Re-evaluate the stage with every archetype of its kind and every amplifier block of the note (DESIGN §8.8). */
  alternatives: {read: {kind: 'flag'}, use: ALL_O},
  yield: {read: {kind: 'yield'}, use: ALL_O}
} as const satisfies Record<string, StageKeySpec>

export type StageKey = keyof typeof STAGE_KEYS
export const isStageKey = (s: string): s is StageKey => Object.hasOwn(STAGE_KEYS, s)
type KindOf<K extends StageKey> = (typeof STAGE_KEYS)[K]['read']['kind']
type KeysOfKind<T extends string> = {[K in StageKey]: KindOf<K> extends T ? K : never}[StageKey]
/** Keys read as a resistor spec. */
export type ResistorKey = KeysOfKind<'resistor'>
/** Keys read as a single quantity. */
export type QuantityKey = KeysOfKind<'quantity'>
/** Keys read as a capacitor spec. */
export type CapacitorKey = KeysOfKind<'capacitor'>

/** Resistor keys where a value under 1 Ω written with `m` is suspicious (DESIGN §3.1). */
export const MILLI_CHECKED: readonly ResistorKey[] = ['rf', 'rg', 'rs', 'rp', 'rref', 'r1', 'r2', 'r3']

/** How an opamp value may be signed. */
export type Sign = 'any' | 'nonnegative' | 'positive'
/** Required, or the default used when not given (0, or null = "not entered"). */
export type Need = 'required' | 'zero' | 'null'

export interface OpampKeySpec {
  readonly dim: Dimension
  readonly need: Need
  readonly sign: Sign
  /** Field of `OpampParams` it fills. */
  readonly field: Exclude<keyof OpampParams, 'name' | 'archetype' | 'inputType'>
}

/** Opamp keys with a quantity value (DESIGN §3.2); `input-type` is read separately. */
export const OPAMP_KEYS = {
  vos: {dim: 'voltage', need: 'required', sign: 'nonnegative', field: 'vos'},
  'vos-drift': {dim: 'drift', need: 'zero', sign: 'nonnegative', field: 'vosDrift'},
  ib: {dim: 'current', need: 'required', sign: 'nonnegative', field: 'ib'},
  ios: {dim: 'current', need: 'required', sign: 'nonnegative', field: 'ios'},
  'ib-max': {dim: 'current', need: 'null', sign: 'nonnegative', field: 'ibMax'},
  'ios-max': {dim: 'current', need: 'null', sign: 'nonnegative', field: 'iosMax'},
  'ib-doubling': {dim: 'temperature-interval', need: 'null', sign: 'positive', field: 'ibDoubling'},
  en: {dim: 'voltage-density', need: 'required', sign: 'nonnegative', field: 'en'},
  'en-corner': {dim: 'frequency', need: 'zero', sign: 'nonnegative', field: 'enCorner'},
  in: {dim: 'current-density', need: 'required', sign: 'nonnegative', field: 'in'},
  'in-corner': {dim: 'frequency', need: 'zero', sign: 'nonnegative', field: 'inCorner'},
  gbw: {dim: 'frequency', need: 'required', sign: 'positive', field: 'gbw'},
  aol: {dim: 'ratio-db', need: 'required', sign: 'positive', field: 'aol'},
  'pm-unity': {dim: 'angle', need: 'required', sign: 'positive', field: 'pmUnity'},
  cmrr: {dim: 'ratio-db', need: 'required', sign: 'positive', field: 'cmrr'},
  psrr: {dim: 'ratio-db', need: 'required', sign: 'positive', field: 'psrr'},
  'vcm-ref': {dim: 'voltage', need: 'null', sign: 'any', field: 'vcmRef'},
  'cin-diff': {dim: 'capacitance', need: 'zero', sign: 'nonnegative', field: 'cinDiff'},
  'cin-cm': {dim: 'capacitance', need: 'zero', sign: 'nonnegative', field: 'cinCm'},
  slew: {dim: 'slew', need: 'null', sign: 'positive', field: 'slew'},
  'swing-headroom': {dim: 'voltage', need: 'null', sign: 'nonnegative', field: 'swingHeadroom'},
  'swing-headroom-neg': {dim: 'voltage', need: 'null', sign: 'nonnegative', field: 'swingHeadroomNeg'},
  'swing-headroom-pos': {dim: 'voltage', need: 'null', sign: 'nonnegative', field: 'swingHeadroomPos'},
  // A negative common-mode headroom means the range extends beyond that rail (DESIGN §4.6).
  'cm-headroom': {dim: 'voltage', need: 'null', sign: 'any', field: 'cmHeadroom'},
  'cm-headroom-neg': {dim: 'voltage', need: 'null', sign: 'any', field: 'cmHeadroomNeg'},
  'cm-headroom-pos': {dim: 'voltage', need: 'null', sign: 'any', field: 'cmHeadroomPos'},
  'iout-max': {dim: 'current', need: 'null', sign: 'positive', field: 'ioutMax'},
  rout: {dim: 'resistance', need: 'null', sign: 'nonnegative', field: 'rout'}
} as const satisfies Record<string, OpampKeySpec>

export type OpampKey = keyof typeof OPAMP_KEYS
export const isOpampKey = (s: string): s is OpampKey => Object.hasOwn(OPAMP_KEYS, s)
/** Every key an opamp block takes, `input-type` included. */
export const OPAMP_BLOCK_KEYS: readonly string[] = ['input-type', ...Object.keys(OPAMP_KEYS)]

/** Front-matter keys (DESIGN §3). */
export const META_KEYS = [
  'title', 'document', 'revision', 'date', 'author', 'reviewers', 'project', 'status', 'context', 'template'
] as const
export type MetaKey = (typeof META_KEYS)[number]
