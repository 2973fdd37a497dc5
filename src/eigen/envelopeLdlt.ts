import type { EnvelopeMatrix } from './EnvelopeMatrix.ts';

/** An envelope LDLᵀ factor: unit lower L in the matrix's envelope layout, D on its diagonal. */
export type EnvelopeFactor = EnvelopeMatrix;

/**
 * Factors a symmetric envelope matrix as L·D·Lᵀ, without pivoting, overwriting its storage (for
 * a matrix built only to be factored, such as K − σM). Row by row ("bordering", George & Liu,
 * Computer Solution of Large Sparse Positive Definite Systems (1981), §4.2): with g_ik = L_ik·D_k
 * kept in row i while it is formed,
 *   g_ij = a_ij − Σ_{k = max(f_i, f_j)}^{j−1} g_ik·L_jk,   L_ij = g_ij / D_j,   D_i = a_ii − Σ_j g_ij·L_ij,
 * where f_i is row i's first column: every inner product runs over two contiguous row segments.
 * Cost Σ_i Σ_j (j − max(f_i, f_j)) multiply-adds ≈ n·w²/2 for a mean row width w.
 * Throws (internal) when a pivot is not positive relative to its diagonal entry: the matrix is
 * not positive definite (for K − σM: the shift was not below the spectrum).
 */
export function envelopeLdltInPlace(matrix: EnvelopeMatrix): EnvelopeFactor {
  const { size: n, firstColumn: first, rowOffset: offsets, data } = matrix;
  for (let i = 0; i < n; i++) {
    const fi = first[i]!;
    const oi = offsets[i]!;
    for (let j = fi; j < i; j++) {
      const fj = first[j]!;
      const oj = offsets[j]!;
      let k = fi > fj ? fi : fj;
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      for (; k + 3 < j; k += 4) {
        s0 += data[oi + k]! * data[oj + k]!;
        s1 += data[oi + k + 1]! * data[oj + k + 1]!;
        s2 += data[oi + k + 2]! * data[oj + k + 2]!;
        s3 += data[oi + k + 3]! * data[oj + k + 3]!;
      }
      for (; k < j; k++) s0 += data[oi + k]! * data[oj + k]!;
      data[oi + j] = data[oi + j]! - (s0 + s1 + (s2 + s3));
    }
    const diagonal = data[oi + i]!;
    let d = diagonal;
    for (let j = fi; j < i; j++) {
      const g = data[oi + j]!;
      const l = g / data[offsets[j]! + j]!;
      d -= l * g;
      data[oi + j] = l;
    }
    if (!(d > 1e-14 * Math.abs(diagonal))) throw new Error(`internal: envelope LDLᵀ pivot ${i} is ${d} (matrix not positive definite)`);
    data[oi + i] = d;
  }
  return matrix;
}

/** envelopeLdltInPlace on a copy (the matrix is left as it was). */
export function envelopeLdlt(matrix: EnvelopeMatrix): EnvelopeFactor {
  return envelopeLdltInPlace({ ...matrix, data: matrix.data.slice() });
}

/** Solves (L·D·Lᵀ)·x = b in place of `x` (which holds b on entry); returns x. */
export function envelopeLdltSolve(factor: EnvelopeFactor, x: Float64Array): Float64Array {
  const { size: n, firstColumn: first, rowOffset: offsets, data } = factor;
  // L·y = b by rows (each row of L contiguous).
  for (let i = 1; i < n; i++) {
    const oi = offsets[i]!;
    let j = first[i]!;
    let s0 = 0;
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    for (; j + 3 < i; j += 4) {
      s0 += data[oi + j]! * x[j]!;
      s1 += data[oi + j + 1]! * x[j + 1]!;
      s2 += data[oi + j + 2]! * x[j + 2]!;
      s3 += data[oi + j + 3]! * x[j + 3]!;
    }
    for (; j < i; j++) s0 += data[oi + j]! * x[j]!;
    x[i] = x[i]! - (s0 + s1 + (s2 + s3));
  }
  for (let i = 0; i < n; i++) x[i]! /= data[offsets[i]! + i]!;
  // Lᵀ·x = y by columns of Lᵀ (rows of L): once x_i is final, remove its share from the rows above.
  for (let i = n - 1; i > 0; i--) {
    const oi = offsets[i]!;
    const value = x[i]!;
    if (value === 0) continue;
    for (let j = first[i]!; j < i; j++) x[j]! -= data[oi + j]! * value;
  }
  return x;
}
