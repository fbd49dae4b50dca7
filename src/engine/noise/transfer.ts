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

/** Sources resolved to rows of the closed-mode system, one entry per part. */
export interface CompiledSources {
  sources: NoiseSource[]
  /** Parts of source i are partStart[i] … partStart[i + 1] − 1. */
  partStart: Int32Array
  /** Row of the injection node, −1 for none. */
  rowInto: Int32Array
  /** Row of the return node, −1 for none. */
  rowFrom: Int32Array
  /** White density of each part. */
  white: Float64Array
}

/** Resolve each source's nodes to closed-mode rows. */
export function compileSources(ws: NodalWorkspace, sources: NoiseSource[]): CompiledSources {
  const out = ws.net.out
  const row = (node: number): number => (node === out ? -1 : ws.closed.index[node])
  const into: number[] = []
  const from: number[] = []
  const white: number[] = []
  const start: number[] = [0]
  for (const s of sources) {
    for (const p of s.parts) {
      into.push(s.kind === 'voltage' ? ws.closed.index[out] : row(p.into))
      from.push(s.kind === 'voltage' ? -1 : row(p.from))
      white.push(p.white)
    }
    start.push(into.length)
  }
  return {sources, partStart: Int32Array.from(start), rowInto: Int32Array.from(into), rowFrom: Int32Array.from(from), white: Float64Array.from(white)}
}

/** |y_a − y_b|² of one compiled part after a closed solve. */
function partGain2(ws: NodalWorkspace, a: number, b: number): number {
  const hr = (a >= 0 ? ws.yre[a] : 0) - (b >= 0 ? ws.yre[b] : 0)
  const hi = (a >= 0 ? ws.yim[a] : 0) - (b >= 0 ? ws.yim[b] : 0)
  return hr * hr + hi * hi
}

/**
 * After `solveClosed(ws, f)`: write each source's output density Σ|H|²·psd (V²/Hz) into
 * out[offset + i], in source order.
 */
export function outputPsdInto(ws: NodalWorkspace, c: CompiledSources, f: number, out: Float64Array, offset: number): void {
  for (let i = 0; i < c.sources.length; i++) {
    let sum = 0
    for (let p = c.partStart[i]; p < c.partStart[i + 1]; p++) sum += partGain2(ws, c.rowInto[p], c.rowFrom[p]) * c.white[p]
    out[offset + i] = sum * (1 + c.sources[i].corner / f)
  }
}

/**
 * Transfer of each applicable noise source to the output at f (V/V for en, V/A for currents),
 * for tests and reports; a source of several parts gives the transfer of its first part
 * (`parts` lists every part's).
 */
export function noiseTransfers(input: StageInput, f: number): {key: NoiseKey; transfer: Complex; parts: Complex[]}[] {
  const ws = createWorkspace(stageNetlist(input))
  const c = compileSources(ws, noiseSources(input, ws.net))
  solveClosed(ws, f)
  return c.sources.map((s, i) => {
    const parts: Complex[] = []
    for (let p = c.partStart[i]; p < c.partStart[i + 1]; p++) {
      const a = c.rowInto[p]
      const b = c.rowFrom[p]
      parts.push({re: (a >= 0 ? ws.yre[a] : 0) - (b >= 0 ? ws.yre[b] : 0), im: (a >= 0 ? ws.yim[a] : 0) - (b >= 0 ? ws.yim[b] : 0)})
    }
    return {key: s.key, transfer: parts[0], parts}
  })
}
