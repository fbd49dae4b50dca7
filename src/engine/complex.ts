/**
 * Complex numbers for the engine's public results and small scalar helpers.
 *
 * The solvers (`nodal.ts`) work on split real/imaginary `Float64Array`s and inline their
 * arithmetic, so nothing here is called per matrix entry; these helpers serve results and
 * tests. Angles are in degrees where the name says so.
 */

/** A complex value. */
export interface Complex {
  re: number
  im: number
}

/** Build a complex value. */
export const complex = (re: number, im = 0): Complex => ({re, im})

/** |z|. */
export const cabs = (z: Complex): number => Math.hypot(z.re, z.im)

/** ∠z, degrees in (−180, 180]. */
export const cargDeg = (z: Complex): number => (Math.atan2(z.im, z.re) * 180) / Math.PI

/** a · b. */
export const cmul = (a: Complex, b: Complex): Complex => ({re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re})

/** a / b. */
export const cdiv = (a: Complex, b: Complex): Complex => {
  const d = b.re * b.re + b.im * b.im
  return {re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d}
}

/**
 * Wrap an angle difference into (−180, 180], degrees; used to unwrap a phase along a grid
 * (common practice: consecutive samples must differ by less than half a turn).
 */
export const wrapDeg = (d: number): number => {
  let x = d % 360
  if (x > 180) x -= 360
  else if (x <= -180) x += 360
  return x
}
