/** A quadrature rule on [0, 1]: points and weights (the weights sum to 1). */
export interface QuadratureRule {
  readonly points: Float64Array;
  readonly weights: Float64Array;
}

/**
 * The n-point Gauss–Legendre rule mapped to [0, 1], exact for polynomials of degree ≤ 2n − 1.
 * Nodes by Newton's method on the Legendre polynomial P_n from the usual cosine starting guesses,
 * weights 2/((1 − x²)·P_n′(x)²) (Abramowitz & Stegun, Handbook of Mathematical Functions, 25.4.29;
 * tabulated in their table 25.4, which the tests check).
 */
export function gaussLegendre(n: number): QuadratureRule {
  const points = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      const pn = n === 0 ? 1 : n === 1 ? x : p1;
      const pPrevious = n === 1 ? 1 : p0;
      derivative = (n * (x * pn - pPrevious)) / (x * x - 1);
      const step = pn / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    // Map from [−1, 1] to [0, 1], ascending.
    points[n - 1 - i] = (x + 1) / 2;
    weights[n - 1 - i] = 1 / ((1 - x * x) * derivative * derivative);
  }
  return { points, weights };
}
