/**
 * A sample report for the render tests: prose with every inline style, lists, a quote,
 * code with a long line, a 60-row table, a figure with text in its SVG, callouts, a
 * caption, a footnote and an appendix. All parts and values are invented.
 */
import type {RootContent} from 'mdast'
import type {ReportDocument} from '../../src/report/types.js'
import {markdown, report} from './helpers.js'

export const SYMBOLS = '2.5 µV, 49.9 kΩ, 8 nV/√Hz, −40 °C, ±15 V, Rf ∥ Rg, ≤ 3 mV'

const rows = Array.from({length: 60}, (_, i) => {
  const n = i + 1
  return `| R${n} | ${(n * 1.37).toFixed(2)} kΩ | ${n % 3 === 0 ? 'matched pair with the gain resistor of the next stage' : 'E96'} |`
}).join('\n')

export const SAMPLE_BODY = `# Front end of the invented bridge amplifier

The stage uses a *precision* **bipolar** input with \`rf = 49.9 kΩ\`, replacing ~~a 47 kΩ part~~,
as the [component note](https://example.com/parts/wx7) explains.${'  '}
A hard break precedes this line. Symbols: ${SYMBOLS}.[^src]

## Noise and drift

- First point about drift
  - Nested point about tempco
- [x] Bias current checked
- [ ] Layout guard ring reviewed

1. Measure the offset.
2. Measure the noise.

> The compensation resistor earns its place only when the offset current is small
> against the bias current.

\`\`\`text
gain = 1 + rf/rg   # a long line follows: ${Array.from({length: 40}, (_, i) => `tok${i + 1}`).join(' ')}
    indented line
\`\`\`

<span class="raw">inline html shown as text</span>

---

### Resistor table

| Designator | Value | Note |
|:--|--:|:-:|
${rows}

#### Closing remarks

The end of the body.

[^src]: Values are invented for this test.
`

export const FIGURE_SVG = `<svg xmlns="http://www.w3.org/2000/svg" width="400" height="200" viewBox="0 0 400 200">
  <rect x="0" y="0" width="400" height="200" fill="#ffffff" stroke="#333333"/>
  <path d="M20 180 L120 60 L380 40" stroke="#1d4fa8" fill="none" stroke-width="2"/>
  <text x="20" y="24" font-family="Helvetica, sans-serif" font-size="14">Gain</text>
  <text x="300" y="190" font-family="monospace" font-size="12" font-weight="bold">−2µ</text>
</svg>`

export function sampleNodes(): RootContent[] {
  return [
    {type: 'caption', text: 'Figure source: invented loop-gain plot'},
    {type: 'figure', number: 1, caption: 'Loop gain of the bridge stage', svg: FIGURE_SVG, width: 400, height: 200},
    {type: 'callout', severity: 'caution', label: 'CAUTION', children: markdown('The bias current at −40 °C was **not entered**.').children as never},
    {type: 'callout', severity: 'not-met', label: 'NOT MET', children: markdown('Output error 3.4 mV exceeds the 3 mV limit.').children as never},
    {type: 'pageBreak'},
    ...markdown('## After the break\n\nText after an explicit page break.').children,
  ]
}

export function sampleReport(): ReportDocument {
  return report({
    body: SAMPLE_BODY,
    bodyNodes: sampleNodes(),
    appendix: '# Appendix A — Method\n\nThe method text.\n\n## Inputs\n\nNote SHA-256 and tool version.',
    verdicts: [
      {stage: 'bridge-amp', requirement: 'output-error', value: '3.4 mV', limit: '≤ 3 mV', verdict: 'not-met', counted: true},
      {stage: 'bridge-amp', requirement: 'noise-rms', value: '21 µV', limit: '≤ 30 µV', verdict: 'met', counted: true},
      {stage: 'bridge-amp', requirement: 'phase-margin', value: '—', limit: '≥ 50°', verdict: 'not-evaluated', counted: true},
    ],
    overall: 'not-met',
  })
}
