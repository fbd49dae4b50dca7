/**
 * Bracketed one-dimensional searches used by the stability analysis: a root by the Illinois
 * variant of regula falsi (Dowell & Jarratt, BIT 11, 1971; superlinear, never leaves the
 * bracket) and a maximum by golden-section search (Kiefer, 1953; common practice).
 */

/**
 * A root of fn in [a, b] where fa = fn(a) and fb = fn(b) have opposite signs (or one is 0).
 * Stops when the bracket is narrower than `tol` or fn is exactly 0.
 * @returns
 *   The end of the final bracket on the side of `b`'s sign (so fn(x) has fb's sign or is 0).
 */
export function illinois(fn: (x: number) => number, a: number, fa: number, b: number, fb: number, tol: number, maxIter = 60): number {
  if (fa === 0) return a
  if (fb === 0) return b
  let side = 0
  for (let i = 0; i < maxIter && Math.abs(b - a) > tol; i++) {
    let x = (a * fb - b * fa) / (fb - fa)
    // Guard against a step landing on an end through rounding: bisect instead.
    if (!(x > Math.min(a, b) && x < Math.max(a, b))) x = (a + b) / 2
    const fx = fn(x)
    if (fx === 0) return x
    if (Math.sign(fx) === Math.sign(fb)) {
      b = x
      fb = fx
      if (side === 1) fa /= 2
      side = 1
    } else {
      a = x
      fa = fx
      if (side === -1) fb /= 2
      side = -1
    }
  }
  return b
}

/** The maximum of fn on [a, b] by golden-section search; returns [x, fn(x)]. */
export function goldenMax(fn: (x: number) => number, a: number, b: number, iterations = 40): [number, number] {
  const r = (Math.sqrt(5) - 1) / 2
  let c = b - r * (b - a)
  let d = a + r * (b - a)
  let fc = fn(c)
  let fd = fn(d)
  for (let i = 0; i < iterations; i++) {
    if (fc > fd) {
      b = d
      d = c
      fd = fc
      c = b - r * (b - a)
      fc = fn(c)
    } else {
      a = c
      c = d
      fc = fd
      d = a + r * (b - a)
      fd = fn(d)
    }
  }
  return fc > fd ? [c, fc] : [d, fd]
}
