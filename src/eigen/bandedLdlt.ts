import { rowStarts, type BandedMatrix } from './BandedMatrix.ts';

/** A banded LDLᵀ factorisation: unit lower L in the band layout (diagonal slots hold D), inside the matrix's envelope if it had one. */
export interface BandedFactor {
  readonly size: number;
  readonly halfBandwidth: number;
  readonly data: Float64Array;
  readonly firstColumn?: Int32Array;
}

/**
 * Factors a symmetric banded matrix as L·D·Lᵀ without pivoting (Golub & Van Loan, Matrix
 * Computations, §4.1 and §4.3, band version). Meant for the positive definite K − σM (σ < 0)
 * of the eigensolver. Throws when a pivot is not positive relative to the diagonal, which means
 * the matrix is not positive definite (the shift was not below the spectrum).
 */
export function bandedLdlt(matrix: BandedMatrix): BandedFactor {
  return bandedLdltInPlace({ ...matrix, data: matrix.data.slice() });
}

/**
 * bandedLdlt overwriting the matrix's own storage with the factor (for a matrix built only to be
 * factored, such as K − σM): no copy.
 */
export function bandedLdltInPlace(matrix: BandedMatrix): BandedFactor {
  const { size: n, halfBandwidth: hb, data, firstColumn } = matrix;
  const width = hb + 1;
  const first = rowStarts(matrix);
  const scratch = new Float64Array(width);
  for (let j = 0; j < n; j++) {
    const rowJ = j * width;
    const start = first[j]!;
    // scratch[k - start] = L_jk · D_k for k < j
    let d = data[rowJ]!;
    for (let k = start; k < j; k++) {
      const ljk = data[rowJ + j - k]!;
      const lkdk = ljk * data[k * width]!;
      scratch[k - start] = lkdk;
      d -= ljk * lkdk;
    }
    if (!(d > 1e-14 * Math.abs(data[rowJ]!))) throw new Error(`internal: banded LDLᵀ pivot ${j} is ${d} (matrix not positive definite)`);
    data[rowJ] = d;
    const end = Math.min(n - 1, j + hb);
    for (let i = j + 1; i <= end; i++) {
      const firstI = first[i]!;
      if (firstI > j) break; // the envelope's first columns do not decrease: no later row reaches column j
      const rowI = i * width;
      let value = data[rowI + i - j]!;
      const kStart = firstI > start ? firstI : start;
      for (let k = kStart; k < j; k++) value -= data[rowI + i - k]! * scratch[k - start]!;
      data[rowI + i - j] = value / d;
    }
  }
  return { size: n, halfBandwidth: hb, data, ...(firstColumn ? { firstColumn } : {}) };
}

/** Solves (L·D·Lᵀ)·x = b in place of `x` (which holds b on entry). */
export function bandedLdltSolve(factor: BandedFactor, x: Float64Array): Float64Array {
  const { size: n, halfBandwidth: hb, data } = factor;
  const width = hb + 1;
  const first = rowStarts(factor);
  // L·y = b by rows: row i of L is contiguous, data[i·width + 1 …] holding L_{i,i−1}, L_{i,i−2}, ….
  for (let i = 1; i < n; i++) {
    const start = first[i]!;
    let value = x[i]!;
    for (let k = i - 1, o = i * width + 1; k >= start; k--, o++) value -= data[o]! * x[k]!;
    x[i] = value;
  }
  for (let i = 0; i < n; i++) x[i]! /= data[i * width]!;
  // Lᵀ·x = y by columns of Lᵀ (rows of L again): once x_k is final, remove its share from the
  // rows above it.
  for (let k = n - 1; k > 0; k--) {
    const value = x[k]!;
    const start = first[k]!;
    for (let i = k - 1, o = k * width + 1; i >= start; i--, o++) x[i]! -= data[o]! * value;
  }
  return x;
}
