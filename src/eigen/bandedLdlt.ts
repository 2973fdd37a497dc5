import type { BandedMatrix } from './BandedMatrix.ts';

/** A banded LDLᵀ factorisation: unit lower L in the band layout (diagonal slots hold D). */
export interface BandedFactor {
  readonly size: number;
  readonly halfBandwidth: number;
  readonly data: Float64Array;
}

/**
 * Factors a symmetric banded matrix as L·D·Lᵀ without pivoting (Golub & Van Loan, Matrix
 * Computations, §4.1 and §4.3, band version). Meant for the positive definite K − σM (σ < 0)
 * of the eigensolver. Throws when a pivot is not positive relative to the diagonal, which means
 * the matrix is not positive definite (the shift was not below the spectrum).
 */
export function bandedLdlt(matrix: BandedMatrix): BandedFactor {
  const { size: n, halfBandwidth: hb } = matrix;
  const width = hb + 1;
  const data = matrix.data.slice();
  const scratch = new Float64Array(width);
  for (let j = 0; j < n; j++) {
    const rowJ = j * width;
    const start = Math.max(0, j - hb);
    // scratch[k - start] = L_jk · D_k for k < j
    let d = data[rowJ]!;
    for (let k = start; k < j; k++) {
      const ljk = data[rowJ + j - k]!;
      const lkdk = ljk * data[k * width]!;
      scratch[k - start] = lkdk;
      d -= ljk * lkdk;
    }
    if (!(d > 1e-14 * Math.abs(matrix.data[rowJ]!))) throw new Error(`internal: banded LDLᵀ pivot ${j} is ${d} (matrix not positive definite)`);
    data[rowJ] = d;
    const end = Math.min(n - 1, j + hb);
    for (let i = j + 1; i <= end; i++) {
      const rowI = i * width;
      let value = data[rowI + i - j]!;
      const kStart = Math.max(start, i - hb);
      for (let k = kStart; k < j; k++) value -= data[rowI + i - k]! * scratch[k - start]!;
      data[rowI + i - j] = value / d;
    }
  }
  return { size: n, halfBandwidth: hb, data };
}

/** Solves (L·D·Lᵀ)·x = b in place of `x` (which holds b on entry). */
export function bandedLdltSolve(factor: BandedFactor, x: Float64Array): Float64Array {
  const { size: n, halfBandwidth: hb, data } = factor;
  const width = hb + 1;
  for (let i = 0; i < n; i++) {
    const row = i * width;
    let value = x[i]!;
    for (let k = Math.max(0, i - hb); k < i; k++) value -= data[row + i - k]! * x[k]!;
    x[i] = value;
  }
  for (let i = 0; i < n; i++) x[i]! /= data[i * width]!;
  for (let i = n - 1; i >= 0; i--) {
    let value = x[i]!;
    const end = Math.min(n - 1, i + hb);
    for (let k = i + 1; k <= end; k++) value -= data[k * width + k - i]! * x[k]!;
    x[i] = value;
  }
  return x;
}
