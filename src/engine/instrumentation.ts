/**
 * An integrated instrumentation amplifier stage (DESIGN §8.2). The part is a compensated
 * block with its own internal feedback, described by its datasheet values, so this stage
 * has no netlist of ours: its DC terms, noise and bandwidth are the ones §8.2 defines for the
 * block, and there is no loop-gain analysis (phase margin null; the report says why).
 *
 * DC (output-referred): vos = vos-in·G + vos-out, vos-drift likewise × ΔT; ib = IB,max·|ΔRs|max·G
 * with each leg's rs moved by ±(tol + tempco·ΔT); ios = IOS,max·Rs·G; cmrr = G·max|Vcm − Vcm,ref|/CMRR;
 * psrr = G·(supply span · supply-tolerance)/PSRR; gain-error = Vfs,d·gain-error; resistor-tolerance =
 * Vfs,d·max|G(corner)/G − 1| over rg's corners; resistor-tempco the same for rg's tempco plus
 * gain-drift·ΔT; nonlinearity = nonlinearity·|G|·(vd,max − vd,min). Vfs,d = max|G·vd|.
 * Noise, input-referred density e² = en-in²(1 + fce/f) + en-out²(1 + fce/f)/G² +
 * in²(1 + fci/f)·Rs² (each leg) + 4kT·Rs (each leg) + 4kT·rg·((G − 1)/G)²; output = e·|H(f)|,
 * H = G/(1 + jf/(gbw/G)).
 */
import {BOLTZMANN, DATASHEET_TEMPERATURE, PEAK_TO_PEAK_FACTOR} from './constants.js'
import {biasOverTemperature} from './dc/bias.js'
import {checkLimitsAt, swingOf} from './limits.js'
import {integrateBand} from './noise/integrate.js'
import {noiseKelvin} from './noise/sources.js'
import {checkRequirements} from './requirements.js'
import {runInstrumentationYield} from './yield/chain.js'
import type {TrialSpread} from './yield/spread.js'
import {yieldOptionsOf} from './yield/run.js'
import {inaAsOpamp, inaGain} from './ina-archetypes.js'
import {NOISE_KEYS, type DcKey, type InaParams, type NoiseKey, type StageInput, type StageResult} from './types.js'

/** DC contributor keys of an instrumentation stage (DESIGN §8.2). */
export const INA_DC_KEYS: readonly DcKey[] = ['vos', 'vos-drift', 'ib', 'ios', 'cmrr', 'psrr', 'gain-error', 'resistor-tolerance', 'resistor-tempco', 'nonlinearity']
/** Noise contributor keys of an instrumentation stage (DESIGN §8.2). */
export const INA_NOISE_KEYS: readonly NoiseKey[] = ['en-in', 'en-out', 'in+', 'in-', 'r:rs', 'r:rg']

export {inaGain}

const endsOf = (r: readonly [number, number]): number[] => (r[0] === r[1] ? [r[0]] : [...r])

function inaOf(input: StageInput): InaParams {
  if (input.ina === null || input.rg === null) throw new RangeError(`Unexpected instrumentation stage \`${input.id}\` without \`ina\` or \`rg\`, expected both`)
  return input.ina
}

/** H(f) = G/(1 + jf/fb), fb = gbw/G (DESIGN §8.2): [Re, Im]. */
export function inaTransfer(input: StageInput, f: number): [number, number] {
  const ina = inaOf(input)
  const g = inaGain(ina, (input.rg as {value: number}).value)
  const x = f / (ina.gbw / g)
  const d = 1 + x * x
  return [g / d, (-g * x) / d]
}

/** Output noise densities (V²/Hz) per INA_NOISE_KEYS at f (the stage's budget and the chain's view). */
export function inaDensitiesInto(input: StageInput, f: number, out: Float64Array, offset: number): void {
  const ina = inaOf(input)
  const rg = (input.rg as {value: number}).value
  const g = inaGain(ina, rg)
  const rs = input.rs?.value ?? 0
  const fourKT = 4 * BOLTZMANN * noiseKelvin(input)
  const h2 = (g * g) / (1 + (f / (ina.gbw / g)) ** 2)
  const v1f = 1 + ina.enCorner / f
  const i1f = 1 + ina.inCorner / f
  out[offset] = ina.enIn ** 2 * v1f * h2
  out[offset + 1] = ((ina.enOut ** 2 * v1f) / (g * g)) * h2
  out[offset + 2] = ina.in ** 2 * i1f * rs * rs * h2
  out[offset + 3] = ina.in ** 2 * i1f * rs * rs * h2
  out[offset + 4] = 2 * fourKT * rs * h2
  out[offset + 5] = fourKT * rg * ((g - 1) / g) ** 2 * h2
}

/** Evaluate an instrumentation stage (see module header). */
export function evaluateInstrumentation(input: StageInput, spread?: TrialSpread): StageResult {
  const ina = inaOf(input)
  const rgR = input.rg as NonNullable<StageInput['rg']>
  const g = inaGain(ina, rgR.value)
  const [tmin, tmax] = input.temperature
  const dT = Math.max(tmax - DATASHEET_TEMPERATURE, DATASHEET_TEMPERATURE - tmin, 0)
  const bias = biasOverTemperature(inaAsOpamp(ina), input.temperature, input)
  const vd = endsOf(input.input)
  const vcm = endsOf(input.inputCm)
  const vfsd = Math.max(...vd.map((v) => Math.abs(g * v)))
  const rs = input.rs?.value ?? 0
  const rsSpread = (input.rs?.tolerance ?? 0) + (input.rs?.tempco ?? 0) * dT
  const gainMove = (spread: number): number => Math.max(...[1 - spread, 1 + spread].map((k) => Math.abs(inaGain(ina, rgR.value * k) / g - 1)))
  const vcmRef = ina.vcmRef ?? (input.supply[0] + input.supply[1]) / 2
  const terms: Record<string, number> = {
    vos: ina.vosIn * g + ina.vosOut,
    'vos-drift': (ina.vosInDrift * g + ina.vosOutDrift) * dT,
    // The two legs move independently: |ΔRs|max = 2·rs·spread.
    ib: bias.ibMax * 2 * rs * rsSpread * g,
    ios: bias.iosMax * rs * g,
    cmrr: (g * Math.max(...vcm.map((v) => Math.abs(v - vcmRef)))) / ina.cmrr,
    psrr: (g * (input.supply[1] - input.supply[0]) * input.supplyTolerance) / ina.psrr,
    'gain-error': vfsd * ina.gainError,
    'resistor-tolerance': vfsd * gainMove(rgR.tolerance),
    'resistor-tempco': vfsd * (gainMove(rgR.tempco * dT) + ina.gainDrift * dT),
    nonlinearity: ina.nonlinearity * Math.abs(g) * (Math.max(...vd) - Math.min(...vd))
  }
  const contributors = INA_DC_KEYS.map((key) => ({key, output: terms[key] as number}))
  const totals = (rows: {output: number}[]) => {
    const worst = rows.reduce((s, c) => s + c.output, 0)
    const rss = Math.hypot(...rows.map((c) => c.output))
    return {worstCaseOutput: worst, rssOutput: rss, worstCaseInput: worst / g, rssInput: rss / g}
  }
  let calibrated: StageResult['dc']['calibrated'] = null
  if (input.calibration !== 'none') {
    const removed: readonly DcKey[] = input.calibration === 'offset' ? ['vos'] : ['vos', 'gain-error', 'resistor-tolerance', 'cmrr']
    const residual: Partial<Record<DcKey, number>> = {
      ib: Math.max(0, bias.ibMax - ina.ib) * 2 * rs * rsSpread * g,
      ios: Math.max(0, bias.iosMax - ina.ios) * rs * g
    }
    const rows = contributors.map(({key, output}) => ({key, output: removed.includes(key) ? 0 : residual[key] ?? output}))
    calibrated = {calibration: input.calibration, contributors: rows, ...totals(rows)}
  }
  const outputs = vd.map((v) => g * v + input.vref)
  const dc: StageResult['dc'] = {
    temperatureSpan: dT, fullScaleOutput: Math.max(...outputs.map(Math.abs)), contributors, ...totals(contributors), calibrated, networkCmrr: null
  }

  const [fL, fH] = input.band
  const k = INA_NOISE_KEYS.length
  const band = integrateBand(fL, fH, k, (f, out, offset) => inaDensitiesInto(input, f, out, offset))
  const noiseContributors = INA_NOISE_KEYS.map((key, i) => ({key, outputRms: Math.sqrt(Math.max(0, band.integral[i] as number))}))
  const total = band.integral.reduce((a, b) => a + b, 0)
  const outputRms = Math.sqrt(Math.max(0, total))
  const nodes = band.frequency.length
  const noiseDensity = Object.fromEntries(NOISE_KEYS.map((key) => [key, [] as number[]])) as Record<NoiseKey, number[]>
  INA_NOISE_KEYS.forEach((key, j) => {
    noiseDensity[key] = Array.from({length: nodes}, (_, i) => Math.sqrt(band.density[i * k + j] as number))
  })
  const noiseTotal = Array.from({length: nodes}, (_, i) => {
    let s = 0
    for (let j = 0; j < k; j++) s += band.density[i * k + j] as number
    return Math.sqrt(s)
  })
  const noise: StageResult['noise'] = {
    band: [fL, fH], temperature: noiseKelvin(input), outputRms, zeroSignalOutputRms: outputRms,
    outputPeakToPeak: PEAK_TO_PEAK_FACTOR * outputRms, inputRms: outputRms / g, contributors: noiseContributors
  }

  // The closed-loop response H = G/(1 + jf/fb) for the report's curves; no loop gain.
  const fb = ina.gbw / g
  const f0 = Math.min(fL, 1) / 10
  const f1 = 10 * ina.gbw
  const n = 120
  const frequency = Array.from({length: n + 1}, (_, i) => f0 * (f1 / f0) ** (i / n))
  const stability: StageResult['stability'] = {phaseMargin: null, crossover: null, bandwidth: fb, peaking: 0, suggestedCf: null}
  const figures = {dc, noise, stability}

  const ld = vd.flatMap((v) => vcm.map((cm) => ({v, cm})))
  const points = ld.map(({v, cm}) => {
    const vout = g * v + input.vref
    return {vout, vpin: vout, vplus: cm + v / 2, vminus: cm - v / 2, iout: input.rload === null ? 0 : vout / input.rload}
  })
  const limits = checkLimitsAt(input, points)
  // No closed form for this topology: the Monte Carlo runs on the block model, as a chain of this one stage.
  const options = yieldOptionsOf(input)
  const yieldResult = options === null ? null : runInstrumentationYield(input, options, dc, g, spread)
  return {
    id: input.id,
    topology: input.topology,
    opamp: ina.name,
    gain: g,
    noiseGain: g,
    ...figures,
    filter: null,
    requirements: [...checkRequirements(input, {...figures, yield: yieldResult}), ...limits],
    curves: {
      noiseFrequency: Array.from(band.frequency), noiseDensity, noiseTotal, noiseTotalZeroSignal: noiseTotal,
      cumulativeRms: Array.from(band.cumulative, (c) => Math.sqrt(Math.max(0, c))),
      frequency, loopGainMagnitude: [], loopGainPhase: [],
      closedLoopMagnitude: frequency.map((f) => g / Math.hypot(1, f / fb)),
      closedLoopPhase: frequency.map((f) => (-Math.atan(f / fb) * 180) / Math.PI)
    },
    swing: swingOf(input, limits),
    bias,
    yield: yieldResult
  }
}
