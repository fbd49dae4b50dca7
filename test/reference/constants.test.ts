/**
 * Physical constants and Johnson–Nyquist thermal noise (DESIGN §4, §4.3).
 */
import {boltzmann, elementaryCharge} from 'mathjs'
import {describe, expect, it} from 'vitest'
import {BOLTZMANN, ELEMENTARY_CHARGE, noiseAnalysis, thermalCurrentPsd} from '../../src/engine/index.js'
import {stageInput, testOpamp} from '../engine/helpers.js'

describe('constants', () => {
  // Source: BIPM, SI Brochure, 9th ed. (2019), Table 1 — exact defining values.
  it('k is exactly 1.380649e-23 J/K (SI Brochure 9th ed.)', () => {
    expect(BOLTZMANN).toBe(1.380649e-23)
  })
  it('q is exactly 1.602176634e-19 C (SI Brochure 9th ed.)', () => {
    expect(ELEMENTARY_CHARGE).toBe(1.602176634e-19)
  })
  // Source: mathjs physical constants (package registry); same exact values, so equality.
  it('k agrees with mathjs `boltzmann`', () => {
    expect(BOLTZMANN).toBe(boltzmann.toNumber('J/K'))
  })
  it('q agrees with mathjs `elementaryCharge`', () => {
    expect(ELEMENTARY_CHARGE).toBe(elementaryCharge.toNumber('C'))
  })
})

describe('thermal noise √(4kTR)', () => {
  // Common practice: "about 4 nV/√Hz per kΩ" at room temperature, 4.06 nV/√Hz at 25 °C;
  // tolerance 0.15 % covers the rounding of the quoted 3-digit value.
  it('gives 4.06 nV/√Hz for 1 kΩ at 25 °C (common practice, 0.15 %)', () => {
    const voltage = Math.sqrt(thermalCurrentPsd(1e3, 298.15)) * 1e3
    expect(Math.abs(voltage / 4.06e-9 - 1)).toBeLessThan(1.5e-3)
  })
  it('reaches the output of a follower from a 1 kΩ source resistance unchanged at low frequency (common practice, 0.15 %)', () => {
    const s = stageInput({
      topology: 'follower', rf: null, rg: null, rs: {value: 1e3, tolerance: 0, tempco: 0},
      opamp: testOpamp({cinCm: 0, cinDiff: 0, aol: 1e9}), cstray: 0, band: [10, 100]
    })
    const r = noiseAnalysis(s)
    const density = r.curves.noiseDensity['r:rs'][0]
    expect(Math.abs(density / 4.06e-9 - 1)).toBeLessThan(1.5e-3)
  })
})
