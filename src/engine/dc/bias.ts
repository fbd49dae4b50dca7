/**
 * Input bias and offset currents over temperature (DESIGN §4.2, §4.3).
 *
 * `ib-max`/`ios-max` when entered; else FET and CMOS inputs (and a zero-drift part whose
 * block gives `ib-doubling`) double every `ib-doubling` kelvin above 25 °C (common practice:
 * gate leakage roughly doubles every 10 K); else the 25 °C value, flagged when the range
 * leaves 25 °C, since a bipolar part's bias current is largest when cold and a zero-drift
 * part's is set by its switching.
 */
import {DATASHEET_TEMPERATURE, DEFAULT_IB_DOUBLING} from '../constants.js'
import type {BiasUsed, OpampParams, Range, StageInput} from '../types.js'

/** Doubling interval in kelvin when the doubling rule applies to this part, else null. */
export function doublingInterval(opamp: OpampParams): number | null {
  if (opamp.inputType === 'jfet' || opamp.inputType === 'cmos') return opamp.ibDoubling ?? DEFAULT_IB_DOUBLING
  if (opamp.inputType === 'zero-drift' && opamp.ibDoubling !== null) return opamp.ibDoubling
  return null
}

/**
 * Bias current at temperature T by the doubling rule, A: ib·2^((T − 25)/doubling)
 * (common practice). For parts without the rule, ib.
 * @param t
 *   Temperature, °C.
 */
export function biasCurrentAt(opamp: OpampParams, t: number): number {
  const d = doublingInterval(opamp)
  return d === null ? opamp.ib : opamp.ib * 2 ** ((t - DATASHEET_TEMPERATURE) / d)
}

/**
 * Dark current of a transimpedance source at T (°C), A: idark·2^((T − 25)/idark-doubling)
 * (DESIGN §4.3; common practice for silicon photodiodes). Used for the shot noise.
 */
export const darkCurrentAt = (input: StageInput, t: number): number =>
  input.idark * 2 ** ((t - DATASHEET_TEMPERATURE) / input.idarkDoubling)

/** Idark,max over the stage's range (DESIGN §4.2): idark-max, else the doubling rule at the hot end. */
export function darkCurrentMax(input: StageInput): {value: number; source: BiasUsed['idarkSource']} {
  if (input.idarkMax !== null) return {value: input.idarkMax, source: 'idark-max'}
  return {value: input.idark * 2 ** (Math.max(0, input.temperature[1] - DATASHEET_TEMPERATURE) / input.idarkDoubling), source: 'doubling'}
}

/** IB,max and IOS,max over the stage's temperature range (DESIGN §4.2); Idark,max from `stage` when given. */
export function biasOverTemperature(opamp: OpampParams, temperature: Range, stage?: StageInput): BiasUsed {
  const d = doublingInterval(opamp)
  // Only the hot end raises leakage: 2^(max(0, Tmax − 25)/doubling) (DESIGN §4.2).
  const factor = d === null ? 1 : 2 ** (Math.max(0, temperature[1] - DATASHEET_TEMPERATURE) / d)
  const leaves25 = temperature[0] < DATASHEET_TEMPERATURE || temperature[1] > DATASHEET_TEMPERATURE
  const ibSource: BiasUsed['ibSource'] = opamp.ibMax !== null ? 'ib-max' : d !== null ? 'doubling' : 'datasheet-25C'
  const iosSource: BiasUsed['iosSource'] = opamp.iosMax !== null ? 'ios-max' : d !== null ? 'doubling' : 'datasheet-25C'
  return {
    ibMax: opamp.ibMax ?? opamp.ib * factor,
    iosMax: opamp.iosMax ?? opamp.ios * factor,
    ibSource,
    iosSource,
    overTemperatureMissing: leaves25 && ibSource === 'datasheet-25C',
    idarkMax: stage ? darkCurrentMax(stage).value : 0,
    idarkSource: stage ? darkCurrentMax(stage).source : 'doubling'
  }
}
