/**
 * A report built to run past pages: a table row taller than a page, 150 lines of code, a
 * long quote, a callout longer than a page, 24 headed sections and four figures.
 */
import type {RootContent} from 'mdast'
import type {ReportDocument} from '../../src/report/types.js'
import {markdown, report} from './helpers.js'

const words = (prefix: string, n: number): string => Array.from({length: n}, (_, i) => `${prefix}${i + 1}`).join(' ')

export const range = (n: number): number[] => Array.from({length: n}, (_, i) => i + 1)

function figure(k: number): RootContent {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="420" height="260" viewBox="0 0 420 260">
<rect x="1" y="1" width="418" height="258" fill="none" stroke="#444444"/>
<text x="10" y="20" font-family="sans-serif" font-size="12">FigTop${k}</text>
<text x="10" y="250" font-family="sans-serif" font-size="12">FigEnd${k}</text></svg>`
  return {type: 'figure', number: k, caption: `Chart ${k}`, svg, width: 420, height: 260}
}

export function flowReport(): ReportDocument {
  const sections = range(24).map((k) => `## Section ${k}\n\nBodytext${k} ${'filler words in a paragraph '.repeat(k % 5 === 0 ? 30 : 4)}`).join('\n\n')
  const body = [
    '# Flow checks',
    `| Key | Long cell |\n|---|---|\n| tall | ${words('w', 2500)} |\n| after | short |`,
    '```\n' + range(150).map((i) => `line${i} = value`).join('\n') + '\n```',
    `> ${words('q', 700)}`,
    sections,
  ].join('\n\n')
  const nodes: RootContent[] = [
    {type: 'callout', severity: 'safety', label: 'SAFETY', children: markdown(words('c', 900)).children as never},
    ...range(4).map(figure),
  ]
  return report({body, bodyNodes: nodes})
}
