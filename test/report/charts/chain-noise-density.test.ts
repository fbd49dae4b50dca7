/**
 * The chain's noise-density chart: each stage a line style of its own, and the stages whose
 * part is the total named (their line lies under the total's).
 */
import {describe, expect, it} from 'vitest'
import {stagesUnderTotal, stageStyle} from '../../../src/report/charts/index.js'

describe('chain noise density', () => {
  it('gives the first ten stages ten different colours and dashes', () => {
    const styles = Array.from({length: 10}, (_, k) => stageStyle(k))
    expect(new Set(styles.map((s) => s.colour)).size).toBe(10)
    expect(new Set(styles.map((s) => JSON.stringify(s.dash))).size).toBe(10)
  })

  it('names a stage within 2 % of the total everywhere, and not one that falls 3 % short anywhere', () => {
    const total = [10, 8, 6]
    const curves = {frequency: [1, 2, 3], total, cumulativeRms: [0, 1, 2], stageDensity: [[9.9, 7.9, 5.9], [1, 1, 1], [10, 8, 5.8]]}
    expect(stagesUnderTotal(curves, ['a', 'b', 'c'])).toEqual(['a'])
  })
})
