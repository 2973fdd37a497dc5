/**
 * Eigen-decomposition of a symmetric tridiagonal matrix by the implicit QL method with Wilkinson
 * shifts (Wilkinson & Reinsch, Handbook for Automatic Computation II (1971), procedure tql2;
 * the same algorithm as Press et al., Numerical Recipes, §11.3 "tqli").
 * `diagonal` (length m) and `offDiagonal` (length m − 1, entry (i, i+1)) are not modified.
 * Returns eigenvalues (unsorted) and eigenvectors as columns of a row-major m×m array; with
 * `lastRowOnly` only the last row of that array is accumulated (all a Lanczos convergence test
 * needs: O(m) work per rotation instead of O(m²)), returned as a 1×m array.
 */
export function tridiagonalEigen(diagonal: ArrayLike<number>, offDiagonal: ArrayLike<number>, lastRowOnly = false): { values: Float64Array; vectors: Float64Array } {
  const n = diagonal.length;
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) d[i] = diagonal[i]!;
  const e = new Float64Array(n);
  for (let i = 0; i < n - 1; i++) e[i] = offDiagonal[i]!;
  const rows = lastRowOnly ? 1 : n;
  const z = new Float64Array(rows * n);
  if (lastRowOnly) z[n - 1] = 1;
  else for (let i = 0; i < n; i++) z[i * n + i] = 1;
  for (let l = 0; l < n; l++) {
    let iterations = 0;
    let m: number;
    do {
      for (m = l; m < n - 1; m++) {
        const dd = Math.abs(d[m]!) + Math.abs(d[m + 1]!);
        if (Math.abs(e[m]!) <= Number.EPSILON * dd) break;
      }
      if (m !== l) {
        if (iterations++ > 60) throw new Error('internal: tridiagonal QL did not converge');
        let g = (d[l + 1]! - d[l]!) / (2 * e[l]!);
        let r = Math.hypot(g, 1);
        g = d[m]! - d[l]! + e[l]! / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
        let s = 1;
        let c = 1;
        let p = 0;
        let i: number;
        let underflow = false;
        for (i = m - 1; i >= l; i--) {
          let f = s * e[i]!;
          const b = c * e[i]!;
          r = Math.hypot(f, g);
          e[i + 1] = r;
          if (r === 0) {
            d[i + 1]! -= p;
            e[m] = 0;
            underflow = true;
            break;
          }
          s = f / r;
          c = g / r;
          g = d[i + 1]! - p;
          r = (d[i]! - g) * s + 2 * c * b;
          p = s * r;
          d[i + 1] = g + p;
          g = c * r - b;
          for (let k = 0; k < rows; k++) {
            const row = k * n;
            f = z[row + i + 1]!;
            z[row + i + 1] = s * z[row + i]! + c * f;
            z[row + i] = c * z[row + i]! - s * f;
          }
        }
        if (underflow) continue;
        d[l]! -= p;
        e[l] = g;
        e[m] = 0;
      }
    } while (m !== l);
  }
  return { values: d, vectors: z };
}
