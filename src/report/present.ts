/**
 * Which budget contributors exist in a stage's circuit: the tables and charts leave out the
 * rows of parts the stage does not have (no rcomp, no source current), while the JSON keeps
 * every key that applies to the topology (DESIGN §6).
 */
import type {DcKey, NoiseKey, StageInput} from '../engine/types.js'

const has = (r: {value: number} | null): boolean => r !== null && r.value > 0

/** True when the DC contributor `key` comes from something the stage has. */
export function dcPresent(input: StageInput, key: DcKey): boolean {
  return key === 'idark' ? input.idark > 0 : true
}

/** True when the noise contributor `key` comes from a part the stage has. */
export function noisePresent(input: StageInput, key: NoiseKey): boolean {
  switch (key) {
    case 'r:rf': return has(input.rf)
    case 'r:rg': return has(input.rg)
    case 'r:rs': return has(input.rs)
    case 'r:rcomp': return has(input.rcomp)
    case 'r:rshunt': return input.rshunt !== null
    case 'shot': return input.idark > 0
    case 'shot-signal': return input.topology === 'transimpedance' && (input.input[0] !== 0 || input.input[1] !== 0)
    case 'r:rp': return has(input.rp)
    case 'r:rref': return has(input.rref)
    case 'r:r1': return has(input.r1)
    case 'r:r2': return has(input.r2)
    case 'r:r3': return has(input.r3)
    case 'r:riso': return has(input.riso)
    case 'r:rload': return input.rload !== null && input.rload > 0
    case 'en':
    case 'en-in':
    case 'en-out':
    case 'in+':
    case 'in-':
      return true
  }
}
