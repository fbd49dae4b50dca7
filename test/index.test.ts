import {describe, expect, it} from 'vitest'
import * as root from '../src/index.js'
import * as engine from '../src/engine/index.js'

describe('ampreview (package root)', () => {
  it('exposes the pipeline phases and the engine', () => {
    for (const name of ['parseNote', 'evaluateNote', 'runRules', 'buildReport', 'jsonStage', 'renderPdf', 'evaluateStage']) {
      expect(typeof (root as Record<string, unknown>)[name]).toBe('function')
    }
  })

  it('re-exports every export of ampreview/engine unchanged', () => {
    for (const [name, value] of Object.entries(engine)) expect((root as Record<string, unknown>)[name]).toBe(value)
  })
})
