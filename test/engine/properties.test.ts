/**
 * Property tests (fast-check) over invented stages of every topology.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {closedLoopGain, dcBudget, noiseAnalysis, topologyTerms, type StageInput, type Topology} from '../../src/engine/index.js'
import {res, stageInput, testOpamp} from './helpers.js'

const ohms = fc.double({min: 10, max: 1e6, noNaN: true})
const frac = fc.double({min: 0, max: 0.02, noNaN: true})
const topology = fc.constantFrom<Extract<Topology, 'noninverting' | 'inverting' | 'follower' | 'transimpedance'>>('noninverting', 'inverting', 'follower', 'transimpedance')

/** An arbitrary valid stage. */
const anyStage = fc
  .record({topology, rf: ohms, rg: ohms, rs: ohms, rcomp: fc.option(ohms, {nil: null}), tol: frac, cf: fc.double({min: 0, max: 100e-12, noNaN: true}),
    rshunt: fc.option(fc.double({min: 1e4, max: 1e10, noNaN: true}), {nil: null}), idark: fc.double({min: 0, max: 1e-9, noNaN: true}),
    pm: fc.double({min: 20, max: 90, noNaN: true}), enCorner: fc.double({min: 0, max: 100, noNaN: true})})
  .map((p): StageInput => {
    const common = {opamp: testOpamp({pmUnity: p.pm, enCorner: p.enCorner}), cf: p.cf, rcomp: p.rcomp === null ? null : res(p.rcomp, p.tol)}
    switch (p.topology) {
      case 'noninverting':
      case 'inverting':
        return stageInput({...common, topology: p.topology, rf: res(p.rf, p.tol), rg: res(p.rg, p.tol), rs: res(p.rs, p.tol)})
      case 'follower':
        return stageInput({...common, topology: 'follower', rf: res(p.rf), rg: null, rs: res(p.rs), cf: 0})
      case 'transimpedance':
        return stageInput({...common, topology: 'transimpedance', rf: res(p.rf, p.tol), rg: null, rs: null, rshunt: p.rshunt, idark: p.idark, csource: 10e-12, input: [0, 1e-6]})
    }
  })

const RUNS = {numRuns: 40}

describe('noise properties', () => {
  it('total² = Σ contributor² (same quadrature for all)', () => {
    fc.assert(fc.property(anyStage, (s) => {
      const b = noiseAnalysis(s).budget
      const sum = b.contributors.reduce((a, c) => a + c.outputRms ** 2, 0)
      expect(Math.abs(b.outputRms ** 2 - sum)).toBeLessThanOrEqual(1e-12 * sum)
    }), RUNS)
  })
  it('total ≥ largest contributor', () => {
    fc.assert(fc.property(anyStage, (s) => {
      const b = noiseAnalysis(s).budget
      expect(b.outputRms).toBeGreaterThanOrEqual(Math.max(...b.contributors.map((c) => c.outputRms)) * (1 - 1e-12))
    }), RUNS)
  })
  // Johnson–Nyquist: each resistor's white contribution scales as √R when every resistor
  // scales by s (gains are ratios and unchanged). Capacitances zero, band far below the
  // closed-loop corner; tolerance 1e-6 (the residual frequency dependence of |H|).
  it('scaling every resistor by s scales each resistor’s low-frequency thermal contribution by √s (noninverting)', () => {
    const op = testOpamp({cinCm: 0, cinDiff: 0, aol: 1e9, gbw: 1e9})
    fc.assert(fc.property(ohms, ohms, ohms, ohms, fc.double({min: 0.01, max: 100, noNaN: true}), (rf, rg, rs, rc, k) => {
      const make = (m: number): StageInput => stageInput({opamp: op, cstray: 0, band: [1, 10], rf: res(rf * m), rg: res(rg * m), rs: res(rs * m), rcomp: res(rc * m)})
      const a = noiseAnalysis(make(1)).budget.contributors
      const b = noiseAnalysis(make(k)).budget.contributors
      for (const key of ['r:rf', 'r:rg', 'r:rs', 'r:rcomp']) {
        const x = a.find((c) => c.key === key)?.outputRms as number
        const y = b.find((c) => c.key === key)?.outputRms as number
        expect(Math.abs(y / x / Math.sqrt(k) - 1)).toBeLessThan(1e-6)
      }
    }), RUNS)
  })
})

describe('DC properties', () => {
  it('worst case ≥ RSS, and input-referred = output ÷ |G|', () => {
    fc.assert(fc.property(anyStage, (s) => {
      const b = dcBudget(s)
      expect(b.worstCaseOutput).toBeGreaterThanOrEqual(b.rssOutput * (1 - 1e-12))
      // |G| here is the §4.1 formula, the budget's from the DC solve: equal to rounding.
      expect(Math.abs(b.worstCaseInput * Math.abs(topologyTerms(s).gain) / b.worstCaseOutput - 1)).toBeLessThan(1e-9)
    }), RUNS)
  })
})

describe('gain signs by topology', () => {
  // Common practice: noninverting and follower stages keep the sign, inverting and
  // transimpedance stages invert (DESIGN §3.3: current into the − input moves the output negative).
  it('G and the solved DC gain agree in sign and size', () => {
    fc.assert(fc.property(anyStage, (s) => {
      const g = topologyTerms(s).gain
      const h = closedLoopGain(s, 0)
      const sign = s.topology === 'noninverting' || s.topology === 'follower' ? 1 : -1
      expect(Math.sign(g)).toBe(sign)
      expect(Math.sign(h.re)).toBe(sign)
      expect(Math.abs(h.im)).toBe(0)
      if (s.topology === 'follower') expect(g).toBe(1)
      // Feedback theory (common practice): H(0) = G·Aβ/(1 + Aβ) with β = 1/NG at DC, i.e.
      // G·Aol/(Aol + NG). Tolerance 1e-9 (rounding).
      const aol = s.opamp.aol
      expect(Math.abs(h.re / g / (aol / (aol + topologyTerms(s).noiseGain)) - 1)).toBeLessThan(1e-9)
    }), RUNS)
  })
})
