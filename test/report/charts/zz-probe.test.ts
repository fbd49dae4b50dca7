import {it} from 'vitest'
import {writeFileSync} from 'node:fs'
import {dcBarsSpec, noiseDensitySpec, cumulativeRmsSpec, loopGainSpec} from '../../../src/report/charts/index.js'
import {renderChartSvg} from '../../../src/report/vega.js'
import {FONTS, stageCurves, stability, dcBudget, svgTexts} from './helpers.js'
import {DC_LABELS, NOISE_LABELS} from '../../../src/report/labels.js'
it('probe', async () => {
  const c = stageCurves()
  const nd = noiseDensitySpec(c, {labels: NOISE_LABELS})
  const specs = {dc: dcBarsSpec(dcBudget(), {labels: DC_LABELS}), nd: nd.spec, cum: cumulativeRmsSpec(c), loop: loopGainSpec(c, stability()), loopnone: loopGainSpec(c, {...stability(), crossover: null, phaseMargin: null})}
  console.log('omitted', nd.omitted)
  for (const [k, s] of Object.entries(specs)) {
    const r = await renderChartSvg(s, FONTS)
    writeFileSync(`/tmp/probe/${k}.svg`, r.svg)
    console.log(k, r.width, r.height, r.warnings, svgTexts(r.svg).map(t => t.text).join(' | '))
  }
})
