/**
 * The one noninverting stage the benchmark times (sections b and the Monte Carlo), as a
 * StageInput: a gain-101 bridge amplifier with 0.1 % 25 ppm/K resistors. Invented values.
 */
export const res = (value, tolerance = 0.001, tempco = 25e-6) => ({value, tolerance, tempco})

/** @param {Record<string, object>} archetypes the engine's ARCHETYPES @param {object} require */
export const benchStage = (archetypes, require = {}) => ({
  id: 'bench', title: 'bench', topology: 'noninverting', opamp: archetypes['precision-bipolar'], rf: res(49.9e3), rg: res(499), rs: res(350, 0, 0),
  rcomp: null, ccomp: 0, cf: 0, cstray: 2e-12, rshunt: null, csource: 0, idark: 0, vref: 0, input: [-0.01, 0.01],
  supply: [-15, 15], supplyTolerance: 0.05, temperature: [0, 50], band: [0.1, 10], noiseTemperature: 25,
  idarkMax: null, idarkDoubling: 10, signalFrequency: null, rload: null, calibration: 'none',
  rp: null, rref: null, r1: null, r2: null, r3: null, c1: null, c2: null, riso: null, cload: 0, cstrayPlus: 0, inputCm: [0, 0], ina: null,
  require
})
