/**
 * Dense complex linear solves on split real/imaginary Float64Arrays, in place and without
 * allocation: the elimination under the nodal solver (`nodal.ts`).
 */

/** Swap entries a and b of a split complex array (hot path: V8 inlines it). */
function swap(re: Float64Array, im: Float64Array, a: number, b: number): void {
  let t = re[a]
  re[a] = re[b]
  re[b] = t
  t = im[a]
  im[a] = im[b]
  im[b] = t
}

/** Transpose an n×n split complex matrix in place. */
export function transposeInPlace(n: number, re: Float64Array, im: Float64Array): void {
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) swap(re, im, i * n + j, j * n + i)
  }
}

/**
 * Solve M·x = b in place (Gaussian elimination with scaled partial pivoting; Golub & Van
 * Loan, Matrix Computations, §3.4). M is destroyed; the solution replaces b.
 * A singular matrix yields non-finite values, which the callers never produce: every node of
 * a topology has a resistive path to a fixed node.
 */
export function solveInPlace(n: number, re: Float64Array, im: Float64Array, bre: Float64Array, bim: Float64Array, scale: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = 0
    for (let j = 0; j < n; j++) s = Math.max(s, Math.abs(re[i * n + j]) + Math.abs(im[i * n + j]))
    scale[i] = s > 0 ? 1 / s : 1
  }
  for (let k = 0; k < n; k++) {
    let p = k
    let best = -1
    for (let i = k; i < n; i++) {
      const v = (Math.abs(re[i * n + k]) + Math.abs(im[i * n + k])) * scale[i]
      if (v > best) {
        best = v
        p = i
      }
    }
    if (p !== k) {
      for (let j = k; j < n; j++) swap(re, im, k * n + j, p * n + j)
      swap(bre, bim, k, p)
      const t = scale[k]
      scale[k] = scale[p]
      scale[p] = t
    }
    const pr = re[k * n + k]
    const pi = im[k * n + k]
    const pd = pr * pr + pi * pi
    for (let i = k + 1; i < n; i++) {
      const xr = re[i * n + k]
      const xi = im[i * n + k]
      if (xr === 0 && xi === 0) continue
      // factor = M[i][k] / M[k][k]
      const fr = (xr * pr + xi * pi) / pd
      const fi = (xi * pr - xr * pi) / pd
      for (let j = k + 1; j < n; j++) {
        const ur = re[k * n + j]
        const ui = im[k * n + j]
        re[i * n + j] -= fr * ur - fi * ui
        im[i * n + j] -= fr * ui + fi * ur
      }
      bre[i] -= fr * bre[k] - fi * bim[k]
      bim[i] -= fr * bim[k] + fi * bre[k]
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    let sr = bre[k]
    let si = bim[k]
    for (let j = k + 1; j < n; j++) {
      const ur = re[k * n + j]
      const ui = im[k * n + j]
      sr -= ur * bre[j] - ui * bim[j]
      si -= ur * bim[j] + ui * bre[j]
    }
    const pr = re[k * n + k]
    const pi = im[k * n + k]
    const pd = pr * pr + pi * pi
    bre[k] = (sr * pr + si * pi) / pd
    bim[k] = (si * pr - sr * pi) / pd
  }
}
