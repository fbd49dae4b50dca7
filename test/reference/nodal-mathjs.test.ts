/**
 * The engine's nodal solver against an independent modified-nodal solve written with mathjs
 * (complex matrices, `lusolve`): signal gains, every noise source's transfer, and the DC
 * bias-current offsets, for every topology and a stage with the full load of §8.3, and the
 * reference (vref) term of the DC budget (DESIGN §4.2, §4.3, §7, §8).
 */
import {describe, expect, it} from 'vitest'
import {closedLoopGain, dcBudget, idealOutput, noiseTransfers, nominalResistors, type StageInput} from '../../src/engine/index.js'
import {loadedFixture, res, stageInput, testOpamp, topologyFixtures} from '../engine/helpers.js'
import {mag, referenceCircuit, referenceOutput, type Excitation} from './mathjs-nodal.js'

const FREQUENCIES = [0, 3, 1e3, 4e4, 1.5e6]
// Tolerance: both are double-precision direct solves of the same equations; 1e-8 relative
// leaves room for rounding in ill-conditioned low-frequency systems (Aol = 10⁶ against µS).
const REL = 1e-8

const close = (actual: number, expected: number, scale: number): void => {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(REL * scale + 1e-300)
}

const signal = (s: StageInput): Excitation => (s.topology === 'transimpedance' ? {currents: [['m', 'gnd', 1]]} : {vsrc: 1})

describe('engine nodal solve vs mathjs reference (Source: independent MNA with mathjs lusolve)', () => {
  for (const s of [...topologyFixtures(), loadedFixture()]) {
    describe(`${s.topology}${s.cload > 0 && s.topology === 'noninverting' ? ' with a load' : ''}`, () => {
      it.each(FREQUENCIES)('signal gain H(f) agrees at %d Hz', (f) => {
        const h = closedLoopGain(s, f)
        const ref = referenceOutput(s, f, signal(s))
        close(h.re, ref.re, mag(ref))
        close(h.im, ref.im, mag(ref))
      })

      it.each(FREQUENCIES.filter((f) => f > 0))('every noise transfer agrees at %d Hz', (f) => {
        const circ = referenceCircuit(s)
        for (const {key, transfer, parts} of noiseTransfers(s, f)) {
          let ex: Excitation
          let complexCompare = true
          if (key === 'en') ex = {en: 1}
          else if (key === 'in+') ex = {currents: [['p', 'gnd', 1]]}
          else if (key === 'in-' || key === 'shot' || key === 'shot-signal') ex = {currents: [['m', 'gnd', 1]]}
          else {
            // Every resistor of that label (the two rs legs of a difference stage), part by part.
            const rs = circ.r.filter((e) => e[3] === key.slice(2))
            const got = parts.map((p) => Math.hypot(p.re, p.im)).sort((x, y) => x - y)
            const want = rs.length === 0 ? [0] : rs.map((e) => mag(referenceOutput(s, f, {currents: [[e[0], e[1], 1]]}))).sort((x, y) => x - y)
            expect(got.length).toBe(want.length)
            // The Norton current's orientation is a convention: magnitudes only.
            got.forEach((g, i) => close(g, want[i] as number, Math.max(want[i] as number, 1e-30)))
            continue
          }
          const ref = referenceOutput(s, f, ex)
          const scale = Math.max(mag(ref), 1e-30)
          if (complexCompare) {
            close(transfer.re, ref.re, scale)
            close(transfer.im, ref.im, scale)
          } else close(Math.hypot(transfer.re, transfer.im), mag(ref), scale)
        }
      })
    })
  }
})

describe('DC bias-current offsets vs mathjs reference (Source: independent MNA at f = 0)', () => {
  // Exact resistors, 25 °C, a very large Aol so the reference's finite-gain factor
  // Aol/(Aol + NG) differs from 1 by < 1e-8: tolerance 1e-6 relative to IB·(Rn + Rp)·NG.
  const exact = (s: StageInput): StageInput => {
    const strip = (r: StageInput['rf']): StageInput['rf'] => (r ? res(r.value) : null)
    return {...s, rf: strip(s.rf), rg: strip(s.rg), rs: strip(s.rs), rcomp: strip(s.rcomp), rp: strip(s.rp), rref: strip(s.rref), riso: null, rload: null, temperature: [25, 25], opamp: testOpamp({aol: 1e10, ib: 2e-9, ios: 0.8e-9})}
  }
  const cases = [...topologyFixtures(), stageInput({rs: null}), stageInput({topology: 'follower', rf: null, rg: null, rs: res(47e3)})].map(exact)
  it.each(cases.map((s) => [s.topology, s] as const))('%s: ib and ios terms equal the solved output offsets', (_, s) => {
    const ib = s.opamp.ib
    const ios = s.opamp.ios
    const dc = dcBudget(s)
    const term = (key: string): number => dc.contributors.find((c) => c.key === key)?.output ?? NaN
    // Bias currents flow into both pins (out of the circuit's nodes into the op-amp).
    const vIb = referenceOutput(s, 0, {currents: [['gnd', 'p', ib], ['gnd', 'm', ib]]})
    const vIos = referenceOutput(s, 0, {currents: [['gnd', 'p', ios / 2], ['m', 'gnd', ios / 2]]})
    const scale = ib * 1e6 * 100
    expect(Math.abs(term('ib') - mag(vIb))).toBeLessThanOrEqual(1e-6 * scale)
    expect(Math.abs(term('ios') - mag(vIos))).toBeLessThanOrEqual(1e-6 * Math.max(mag(vIos), 1e-12))
  })
})

describe('DC reference term vs mathjs reference (Source: independent MNA at f = 0, vref as a source at the + pin\'s return)', () => {
  // Aol = 1e10: the reference's finite-gain factor differs from the ideal op-amp by < 1e-8.
  const withVref = topologyFixtures().filter((s) => s.topology === 'inverting' || s.topology === 'transimpedance')
    .map((s) => ({...s, opamp: testOpamp({aol: 1e10})}))
  const refOut = (s: StageInput, vin: number): number => {
    const ex = s.topology === 'transimpedance' ? {vref: s.vref, currents: [['m', 'gnd', vin]] as [string, string, number][]} : {vref: s.vref, vsrc: vin}
    return referenceOutput(s, 0, ex).re
  }
  it.each(withVref.map((s) => [s.topology, s] as const))('%s: Vout,ideal at both input ends and fullScaleOutput', (_, s) => {
    const r = nominalResistors(s)
    for (const vin of s.input) {
      const ref = refOut(s, vin)
      expect(Math.abs(idealOutput(s, vin, r) - ref)).toBeLessThanOrEqual(1e-7 * Math.max(1, Math.abs(ref)))
    }
    const vfs = Math.max(...s.input.map((v) => Math.abs(refOut(s, v))))
    expect(Math.abs(dcBudget(s).fullScaleOutput - vfs)).toBeLessThanOrEqual(1e-7 * vfs)
  })
  it.each(withVref.map((s) => [s.topology, s] as const))('%s: resistor-tolerance equals the worst corner of the reference solve', (_, s) => {
    const keys = (['rf', 'rg', 'rs', 'rcomp'] as const).filter((k) => (s[k]?.tolerance ?? 0) > 0)
    let worst = 0
    for (let c = 0; c < 1 << keys.length; c++) {
      const moved: StageInput = {...s}
      keys.forEach((k, bit) => {
        const r = s[k]!
        moved[k] = {...r, value: r.value * ((c >> bit) & 1 ? 1 + r.tolerance : 1 - r.tolerance)}
      })
      for (const vin of s.input) worst = Math.max(worst, Math.abs(refOut(moved, vin) - refOut(s, vin)))
    }
    const term = dcBudget(s).contributors.find((k) => k.key === 'resistor-tolerance')!.output
    // The vref part is present: with vref 0 the term differs.
    const without = dcBudget({...s, vref: 0}).contributors.find((k) => k.key === 'resistor-tolerance')!.output
    expect(Math.abs(term - without)).toBeGreaterThan(1e-3 * worst)
    expect(Math.abs(term - worst)).toBeLessThanOrEqual(1e-6 * worst)
  })
})
