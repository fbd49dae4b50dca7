/**
 * Transfer of every noise source to the output, from the one adjoint solve per frequency of
 * `nodal.ts` (DESIGN §4.3): a current injected into node a and returning from node b reaches
 * the output as y_a − y_b (V/A); en, which sits in the op-amp's source equation, as y_out
 * (V/V). A fixed node, or the output node (whose current the ideal source absorbs), has no
 * adjoint entry.
 */
import type {Complex} from '../complex.js'
import {createWorkspace, solveClosed, type NodalWorkspace} from '../nodal.js'
import {stageNetlist} from '../topology/index.js'
import type {NoiseKey, StageInput} from '../types.js'
import {noiseSources, type NoiseSource} from './sources.js'

/** Sources resolved to rows of the closed-mode system. */
export interface CompiledSources {
  sources: NoiseSource[]
  /** Row of the injection node, −1 for none. */
  rowInto: Int32Array
  /** Row of the return node, −1 for none. */
  rowFrom: Int32Array
}

/** Resolve each source's nodes to closed-mode rows. */
export function compileSources(ws: NodalWorkspace, sources: NoiseSource[]): CompiledSources {
  const out = ws.net.out
  const row = (node: number): number => (node === out ? -1 : ws.closed.index[node])
  return {
    sources,
    rowInto: Int32Array.from(sources, (s) => (s.kind === 'voltage' ? ws.closed.index[out] : row(s.into))),
    rowFrom: Int32Array.from(sources, (s) => (s.kind === 'voltage' ? -1 : row(s.from)))
  }
}

/**
 * After `solveClosed(ws, f)`: write each source's output density |H|²·psd (V²/Hz) into
 * out[offset + i], in source order.
 */
export function outputPsdInto(ws: NodalWorkspace, c: CompiledSources, f: number, out: Float64Array, offset: number): void {
  const {yre, yim} = ws
  for (let i = 0; i < c.sources.length; i++) {
    const s = c.sources[i]
    const a = c.rowInto[i]
    const b = c.rowFrom[i]
    const hr = (a >= 0 ? yre[a] : 0) - (b >= 0 ? yre[b] : 0)
    const hi = (a >= 0 ? yim[a] : 0) - (b >= 0 ? yim[b] : 0)
    out[offset + i] = (hr * hr + hi * hi) * s.white * (1 + s.corner / f)
  }
}

/**
 * Transfer of each applicable noise source to the output at f (V/V for en, V/A for currents),
 * for tests and reports.
 */
export function noiseTransfers(input: StageInput, f: number): {key: NoiseKey; transfer: Complex}[] {
  const ws = createWorkspace(stageNetlist(input))
  const c = compileSources(ws, noiseSources(input, ws.net))
  solveClosed(ws, f)
  return c.sources.map((s, i) => {
    const a = c.rowInto[i]
    const b = c.rowFrom[i]
    return {
      key: s.key,
      transfer: {re: (a >= 0 ? ws.yre[a] : 0) - (b >= 0 ? ws.yre[b] : 0), im: (a >= 0 ? ws.yim[a] : 0) - (b >= 0 ? ws.yim[b] : 0)}
    }
  })
}
