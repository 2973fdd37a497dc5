/**
 * Brent's method (R. P. Brent, *Algorithms for Minimization without Derivatives*, 1973, ch. 4):
 * finds a root of `f` in the bracket [a, b] where f(a) and f(b) have opposite signs, combining
 * bisection, secant and inverse quadratic interpolation. Stops when the bracket is narrower than
 * `absoluteTolerance + 4·ε·|x|` or f is exactly zero. Throws if the end values do not bracket.
 */
export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  { absoluteTolerance = 0, valueAtA = f(a), valueAtB = f(b), maxIterations = 200 }: {
    absoluteTolerance?: number;
    valueAtA?: number;
    valueAtB?: number;
    maxIterations?: number;
  } = {},
): number {
  let fa = valueAtA;
  let fb = valueAtB;
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) throw new Error(`brentRoot: [${a}, ${b}] does not bracket a root`);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tolerance = 2 * Number.EPSILON * Math.abs(b) + 0.5 * absoluteTolerance;
    const half = 0.5 * (c - b);
    if (Math.abs(half) <= tolerance || fb === 0) return b;
    if (Math.abs(e) >= tolerance && Math.abs(fa) > Math.abs(fb)) {
      // Interpolation step: secant when only two distinct points, inverse quadratic otherwise.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * half * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * half * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * half * q - Math.abs(tolerance * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = half;
        e = d;
      }
    } else {
      d = half;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tolerance ? d : half > 0 ? tolerance : -tolerance;
    fb = f(b);
  }
  throw new Error('brentRoot: no convergence');
}
