/**
 * Engine benchmark: full evaluations per second (DC + noise + stability, and the Cf
 * suggestion for transimpedance) for one typical stage of each topology, band 0.1 Hz–10 kHz,
 * on one core. Reads the compiled engine from dist/ (build first: `npx tsc -p
 * tsconfig.build.json`). Usage: `node scripts/bench-engine.mjs [seconds per topology]`.
 */
import {ARCHETYPES, evaluateStage} from '../dist/engine/index.js'

const seconds = Number(process.argv[2] ?? 2)
const r = (value, tolerance = 0.001, tempco = 25e-6) => ({value, tolerance, tempco})
const base = {
  id: 'bench', title: 'bench', opamp: ARCHETYPES['precision-bipolar'], rf: r(49.9e3), rg: r(1e3), rs: r(350, 0, 0),
  rcomp: null, ccomp: 0, cf: 0, cstray: 2e-12, rshunt: null, csource: 0, idark: 0, vref: 0, input: [-0.01, 0.01],
  supply: [-15, 15], supplyTolerance: 0.05, temperature: [-40, 85], band: [0.1, 1e4], noiseTemperature: 25,
  require: {'noise-rms': 30e-6, 'phase-margin': 45}
}
const stages = {
  noninverting: base,
  inverting: {...base, topology: 'inverting', rcomp: r(976)},
  follower: {...base, topology: 'follower', rf: null, rg: null, rs: r(10e3, 0, 0)},
  transimpedance: {
    ...base, topology: 'transimpedance', opamp: ARCHETYPES['precision-jfet'], rf: r(10e6, 0.01, 50e-6), rg: null, rs: null,
    rshunt: 1e9, csource: 50e-12, cf: 1e-12, input: [0, 1e-7]
  }
}
stages.noninverting = {...base, topology: 'noninverting'}

for (const [name, stage] of Object.entries(stages)) {
  for (let i = 0; i < 300; i++) evaluateStage(stage)
  let n = 0
  const t0 = performance.now()
  while (performance.now() - t0 < seconds * 1000) {
    evaluateStage(stage)
    n++
  }
  const rate = n / ((performance.now() - t0) / 1000)
  console.log(`${name.padEnd(15)} ${rate.toFixed(0).padStart(6)} evaluations/s`)
}
