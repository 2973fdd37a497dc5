/** √(a² + b²) without overflow or underflow (Math.hypot is several times slower in V8). */
function hypotenuse(a: number, b: number): number {
  const x = Math.abs(a);
  const y = Math.abs(b);
  const big = x > y ? x : y;
  if (big === 0) return 0;
  const small = x > y ? y : x;
  const ratio = small / big;
  return big * Math.sqrt(1 + ratio * ratio);
}

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
        let r = hypotenuse(g, 1);
        g = d[m]! - d[l]! + e[l]! / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
        let s = 1;
        let c = 1;
        let p = 0;
        let i: number;
        let underflow = false;
        for (i = m - 1; i >= l; i--) {
          let f = s * e[i]!;
          const b = c * e[i]!;
          r = hypotenuse(f, g);
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

/**
 * The unit eigenvector of a symmetric tridiagonal matrix for an eigenvalue already known to
 * working accuracy (from tridiagonalEigen), by inverse iteration: two solves of (T − θI)·y = b
 * with Gaussian elimination and partial pivoting, the first from b = (1, …, 1) (Wilkinson, The
 * Algebraic Eigenvalue Problem (1965), §5.54–5.57; Golub & Van Loan, Matrix Computations, §8.2.2).
 * O(m) work where the full QL with vectors costs O(m²) per eigenvalue. For an eigenvalue closer
 * than ~1e-8 relative to another, the vectors from two calls need not be orthogonal: use the
 * full decomposition then.
 */
export function tridiagonalEigenvector(diagonal: ArrayLike<number>, offDiagonal: ArrayLike<number>, value: number): Float64Array {
  const m = diagonal.length;
  let scale = 0;
  for (let i = 0; i < m; i++) scale = Math.max(scale, Math.abs(diagonal[i]!) + (i > 0 ? Math.abs(offDiagonal[i - 1]!) : 0) + (i < m - 1 ? Math.abs(offDiagonal[i]!) : 0));
  const tiny = Number.EPSILON * (scale > 0 ? scale : 1);
  // LU of T − θI with row interchanges: U has three diagonals (u0 main, u1 and u2 above),
  // multipliers in `multiplier`, `swapped[i]` when rows i and i+1 were exchanged.
  const u0 = new Float64Array(m);
  const u1 = new Float64Array(m);
  const u2 = new Float64Array(m);
  const multiplier = new Float64Array(m);
  const swapped = new Uint8Array(m);
  let pivotRowMain = diagonal[0]! - value;
  let pivotRowNext = m > 1 ? offDiagonal[0]! : 0;
  for (let i = 0; i < m - 1; i++) {
    const below = offDiagonal[i]!;
    const belowMain = diagonal[i + 1]! - value;
    const belowNext = i + 1 < m - 1 ? offDiagonal[i + 1]! : 0;
    if (Math.abs(below) > Math.abs(pivotRowMain)) {
      // Row i + 1 becomes the pivot row.
      swapped[i] = 1;
      u0[i] = below;
      u1[i] = belowMain;
      u2[i] = belowNext;
      const factor = pivotRowMain / below;
      multiplier[i] = factor;
      pivotRowMain = pivotRowNext - factor * belowMain;
      pivotRowNext = -factor * belowNext;
    } else {
      if (pivotRowMain === 0) pivotRowMain = tiny;
      u0[i] = pivotRowMain;
      u1[i] = pivotRowNext;
      u2[i] = 0;
      const factor = below / pivotRowMain;
      multiplier[i] = factor;
      pivotRowMain = belowMain - factor * pivotRowNext;
      pivotRowNext = belowNext;
    }
  }
  u0[m - 1] = pivotRowMain === 0 ? tiny : pivotRowMain;
  for (let i = 0; i < m; i++) if (Math.abs(u0[i]!) < tiny) u0[i] = u0[i]! < 0 ? -tiny : tiny;
  const y = new Float64Array(m).fill(1);
  for (let iteration = 0; iteration < 2; iteration++) {
    if (iteration > 0) {
      // Apply the row operations of the elimination to the new right-hand side.
      for (let i = 0; i < m - 1; i++) {
        if (swapped[i]) {
          const top = y[i]!;
          y[i] = y[i + 1]!;
          y[i + 1] = top - multiplier[i]! * y[i]!;
        } else {
          y[i + 1]! -= multiplier[i]! * y[i]!;
        }
      }
    }
    // The first solve takes b as already eliminated (any b rich in the eigenvector will do).
    for (let i = m - 1; i >= 0; i--) {
      let sum = y[i]!;
      if (i + 1 < m) sum -= u1[i]! * y[i + 1]!;
      if (i + 2 < m) sum -= u2[i]! * y[i + 2]!;
      y[i] = sum / u0[i]!;
    }
    let norm = 0;
    for (let i = 0; i < m; i++) norm = Math.max(norm, Math.abs(y[i]!));
    for (let i = 0; i < m; i++) y[i]! /= norm;
  }
  let norm = 0;
  for (let i = 0; i < m; i++) norm += y[i]! * y[i]!;
  norm = Math.sqrt(norm);
  for (let i = 0; i < m; i++) y[i]! /= norm;
  return y;
}
