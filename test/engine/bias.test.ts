/**
 * Bias currents over temperature (DESIGN §4.2) and the FET/CMOS current-noise scaling (§4.3).
 */
import {describe, expect, it} from 'vitest'
import {biasOverTemperature, currentNoiseScale} from '../../src/engine/index.js'
import {stageInput, testOpamp} from './helpers.js'

describe('biasOverTemperature()', () => {
  // Common practice: FET/CMOS input bias current doubles about every 10 K.
  it('doubles a jfet bias current every 10 K above 25 °C by default (common practice)', () => {
    const op = testOpamp({inputType: 'jfet', ib: 5e-12, ios: 1e-12})
    expect(biasOverTemperature(op, [25, 35]).ibMax).toBeCloseTo(10e-12, 20)
    expect(biasOverTemperature(op, [25, 85]).ibMax / 5e-12).toBeCloseTo(64, 10)
    expect(biasOverTemperature(op, [25, 85]).iosMax / 1e-12).toBeCloseTo(64, 10)
  })
  it('uses a cmos part’s own ib-doubling interval', () => {
    const op = testOpamp({inputType: 'cmos', ib: 1e-12, ibDoubling: 8})
    expect(biasOverTemperature(op, [-40, 49]).ibMax / 1e-12).toBeCloseTo(8, 10)
  })
  it('ignores the cold end for FET inputs (leakage falls when cold)', () => {
    const op = testOpamp({inputType: 'jfet', ib: 5e-12})
    const b = biasOverTemperature(op, [-40, 25])
    expect(b.ibMax).toBe(5e-12)
    expect(b.ibSource).toBe('doubling')
    expect(b.overTemperatureMissing).toBe(false)
  })
  it('keeps a bipolar 25 °C value and flags it when the range leaves 25 °C', () => {
    const b = biasOverTemperature(testOpamp({ib: 3e-9}), [-20, 70])
    expect(b.ibMax).toBe(3e-9)
    expect(b.ibSource).toBe('datasheet-25C')
    expect(b.overTemperatureMissing).toBe(true)
  })
  it('does not flag a bipolar part at 25 °C only', () => {
    expect(biasOverTemperature(testOpamp(), [25, 25]).overTemperatureMissing).toBe(false)
  })
  it('flags a bias-cancelled bipolar part like a bipolar one', () => {
    expect(biasOverTemperature(testOpamp({inputType: 'bipolar-cancelled'}), [0, 50]).overTemperatureMissing).toBe(true)
  })
  it('applies doubling to a zero-drift part only when ib-doubling is given', () => {
    const without = biasOverTemperature(testOpamp({inputType: 'zero-drift', ib: 100e-12}), [25, 45])
    const withRule = biasOverTemperature(testOpamp({inputType: 'zero-drift', ib: 100e-12, ibDoubling: 20}), [25, 45])
    expect(without.ibMax).toBe(100e-12)
    expect(without.overTemperatureMissing).toBe(true)
    expect(withRule.ibMax).toBeCloseTo(200e-12, 20)
    expect(withRule.overTemperatureMissing).toBe(false)
  })
  it('prefers entered ib-max and ios-max', () => {
    const b = biasOverTemperature(testOpamp({inputType: 'jfet', ibMax: 1e-9, iosMax: 0.2e-9}), [-40, 125])
    expect(b).toMatchObject({ibMax: 1e-9, iosMax: 0.2e-9, ibSource: 'ib-max', iosSource: 'ios-max', overTemperatureMissing: false})
  })
})

describe('currentNoiseScale()', () => {
  // DESIGN §4.3: in scales by √(IB(T)/IB(25 °C)); shot noise of the leakage, i² = 2q·IB.
  it('scales FET current noise by √2 at 10 K above 25 °C', () => {
    const s = stageInput({opamp: testOpamp({inputType: 'jfet', ib: 5e-12})})
    expect(currentNoiseScale(s, 35)).toBeCloseTo(Math.SQRT2, 12)
    expect(currentNoiseScale(s, 15)).toBeCloseTo(Math.SQRT1_2, 12)
  })
  it('leaves bipolar current noise unscaled', () => {
    expect(currentNoiseScale(stageInput(), 85)).toBe(1)
  })
})
