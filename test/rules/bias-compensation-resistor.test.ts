import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {ARCHETYPES} from '../../src/engine/archetypes.js'
import {evaluateStage} from '../../src/engine/index.js'
import type {StageInput} from '../../src/engine/types.js'
import rule, {bypassCapacitor} from '../../src/rules/bias-compensation-resistor.js'
import {formatQuantity} from '../../src/units/format.js'
import {opamp, resistor, ruleContext, stageInput} from './helpers.js'

const checkWithEngine = (input: StageInput) => rule.check(ruleContext(input, evaluateStage(input)))

// Invented stages. Inverting ×10 with a 9.09 kΩ rcomp ≈ 100 kΩ ∥ 10 kΩ.
const inverting = (over: Partial<StageInput> = {}): StageInput =>
  stageInput({topology: 'inverting', rf: resistor(100e3), rg: resistor(10e3), rcomp: resistor(9.09e3), band: [10, 1000], ...over})

// IB 250 nA, IOS 50 nA (IOS/IB = 0.2): the resistor removes ~IB·Rn·NG ≈ 25 mV and adds µV of noise.
// Band from 100 Hz: the bypass for a corner at 10 Hz is 1.75 µF → 2.2 µF, a film part.
const earns = inverting({opamp: ARCHETYPES['general-bipolar'], band: [100, 1000]})
// The same stage from 10 Hz would need 17.5 µF → 22 µF: beyond film, so no bypass is suggested.
const earnsLowBand = inverting({opamp: ARCHETYPES['general-bipolar']})
// JFET input: pA bias currents.
const jfet = inverting({opamp: ARCHETYPES['precision-jfet']})
// IB 2.5 nA, IOS 2 nA (IOS/IB = 0.8).
const highRatio = inverting({opamp: ARCHETYPES['precision-bipolar']})
// IB 2 nA, IOS 0.2 nA, en 1 nV/√Hz, ×2 with 1 kΩ / 1 kΩ and a 499 Ω rcomp, band to 100 kHz:
// it removes about 2 µV of DC error and adds about 5 µV p-p of noise (hand estimate).
const noisy = stageInput({
  opamp: opamp({ib: 2e-9, ios: 0.2e-9, en: 1e-9, enCorner: 0, in: 0.1e-12, inCorner: 0, gbw: 20e6}),
  rf: resistor(1e3), rg: resistor(1e3), rcomp: resistor(499), band: [10, 100e3]
})
// Follower from 100 kΩ with a matching 100 kΩ rf, IB 250 nA.
const follower = stageInput({
  topology: 'follower', opamp: ARCHETYPES['general-bipolar'], rf: resistor(100e3), rg: null, rs: resistor(100e3), band: [0.1, 10]
})

describe('rules/bias-compensation-resistor', () => {
  it('bypassCapacitor(9.09 kΩ, 10 Hz) is 22 µF (needs 17.5 µF)', () => {
    expect(bypassCapacitor(9.09e3, 10)).toBe(22e-6)
  })

  it('bypassCapacitor puts the corner at or below fL/10, and the E3 value below it would not', () => {
    fc.assert(fc.property(fc.double({min: 1, max: 1e7, noNaN: true}), fc.double({min: 0.01, max: 1e4, noNaN: true}), (r, fL) => {
      const c = bypassCapacitor(r, fL)
      const corner = (cap: number) => 1 / (2 * Math.PI * r * cap)
      const k = Math.floor(Math.log10(c) + 1e-9)
      const m = Number((c / 10 ** k).toPrecision(3))
      const below = m === 1 ? 0.47 * 10 ** k : m === 2.2 ? 10 ** k : m === 4.7 ? 2.2 * 10 ** k : NaN
      return corner(c) <= (fL / 10) * (1 + 1e-8) && corner(below) > fL / 10
    }), {numRuns: 1000})
  })

  it('says it earns its place (info) when IOS/IB is 0.2 and the saving outweighs the noise', () => {
    const notes = checkWithEngine(earns)
    expect(notes.map((n) => n.severity)).toEqual(['info'])
    expect(notes[0]!.text).toContain('earns its place')
    expect(notes[0]!.text).toContain(`${formatQuantity(2.2e-6, 'F')} of film`)
  })

  it('suggests no bypass above 10 µF (film) and advises removing or rethinking instead', () => {
    const [note] = checkWithEngine(earnsLowBand)
    expect(note!.text).toContain(`takes ${formatQuantity(22e-6, 'F')}, beyond the 10 µF a film capacitor reaches`)
    expect(note!.text).toContain('Remove rcomp, or rethink the impedances')
    expect(note!.text).not.toMatch(/Bypassing rcomp with/)
    expect(note!.table!.rows.map((r) => r[0])).toEqual(['As drawn', 'Without rcomp'])
  })

  it('tabulates as drawn, without and bypassed with the engine’s own figures', () => {
    const [note] = checkWithEngine(earns)
    const drawn = evaluateStage(earns)
    const without = evaluateStage({...earns, rcomp: null, ccomp: 0})
    const bypassed = evaluateStage({...earns, ccomp: 2.2e-6})
    const row = (label: string, r: typeof drawn) =>
      [label, formatQuantity(r.dc.worstCaseOutput, 'V'), formatQuantity(r.dc.rssOutput, 'V'), formatQuantity(r.noise.outputRms, 'V')]
    expect(note!.table).toEqual({
      header: ['Variant', 'DC worst case', 'DC RSS', 'Noise rms over band'],
      rows: [row('As drawn', drawn), row('Without rcomp', without), row(`rcomp bypassed by ${formatQuantity(2.2e-6, 'F')}`, bypassed)]
    })
  })

  it('says so when rcomp is already bypassed by a large enough capacitor', () => {
    const notes = checkWithEngine({...earns, ccomp: 47e-6})
    expect(notes[0]!.text).toContain(`already bypassed by ${formatQuantity(47e-6, 'F')}`)
    expect(notes[0]!.table!.rows[2]![0]).toBe(`rcomp bypassed by ${formatQuantity(47e-6, 'F')}`)
  })

  it('finds the bypassed stage quieter than as drawn and no better at DC than without', () => {
    const drawn = evaluateStage(earns)
    const bypassed = evaluateStage({...earns, ccomp: 2.2e-6})
    expect(bypassed.noise.outputRms).toBeLessThan(drawn.noise.outputRms)
    expect(bypassed.dc.worstCaseOutput).toBeCloseTo(drawn.dc.worstCaseOutput, 12)
  })

  it.each([
    ['a JFET input', jfet, 'JFET'],
    ['IOS/IB = 0.8', highRatio, 'IOS/IB is 0.8'],
    ['noise that costs more than the DC it removes', noisy, 'p-p, is at least the']
  ])('says it does not earn its place (caution) with %s', (_name, input, reason) => {
    const notes = checkWithEngine(input)
    expect(notes.map((n) => n.severity)).toEqual(['caution'])
    expect(notes[0]!.text).toContain('does not earn its place')
    expect(notes[0]!.text).toContain(reason)
  })

  it('treats a follower’s rf as the compensation resistor', () => {
    const [note] = checkWithEngine(follower)
    expect(note!.text).toContain('rf = 100 kΩ of this follower')
    // From 0.1 Hz through 100 kΩ the bypass would be 220 µF: not suggested.
    expect(note!.table!.rows.map((r) => r[0])).toEqual(['As drawn', 'Without rf'])
  })

  it.each([
    ['a stage without rcomp', stageInput()],
    ['a follower without rf', stageInput({topology: 'follower', rf: null, rg: null})]
  ])('stays silent with %s', (_name, input) => {
    expect(checkWithEngine(input)).toEqual([])
  })
})
