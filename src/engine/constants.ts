/**
 * Physical constants and fixed conventions of the engine.
 *
 * The two SI defining constants are exact by definition (BIPM, The International System of
 * Units, SI Brochure, 9th edition, 2019, Table 1). Nothing here depends on a stage.
 */

/** Boltzmann constant k, J/K, exact (SI Brochure, 9th ed., 2019). */
export const BOLTZMANN = 1.380649e-23

/** Elementary charge q, C, exact (SI Brochure, 9th ed., 2019). */
export const ELEMENTARY_CHARGE = 1.602176634e-19

/** Offset between the Celsius and kelvin scales, K (SI Brochure, 9th ed., §2.3.1). */
export const CELSIUS_TO_KELVIN = 273.15

/** Reference temperature of datasheet values, °C (common practice: datasheet tables at 25 °C). */
export const DATASHEET_TEMPERATURE = 25

/** Peak-to-peak over rms for Gaussian noise, about 99.9 % of the time (common practice). */
export const PEAK_TO_PEAK_FACTOR = 6.6

/** Default FET/CMOS bias-current doubling interval, K (common practice: doubles every ~10 K). */
export const DEFAULT_IB_DOUBLING = 10

/** Phase margin targeted by the transimpedance Cf suggestion, degrees (DESIGN §4.4). */
export const TARGET_PHASE_MARGIN = 60

/** Largest Cf the transimpedance suggestion considers, F (DESIGN §4.4). */
export const MAX_SUGGESTED_CF = 1e-6

/** Default dark-current doubling interval, K (common practice: a silicon photodiode's dark current roughly doubles every 8–10 K). */
export const DEFAULT_IDARK_DOUBLING = 10

/** Trials of a Monte Carlo that asks for none: a yield requirement alone, or the CLI's `--yield` (DESIGN §8.7). */
export const DEFAULT_YIELD_TRIALS = 100_000
