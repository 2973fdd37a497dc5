/**
 * Dense Cholesky factorisation A = L·Lᵀ of a small symmetric positive-definite matrix (n × n,
 * row-major Float64Array), in place: the lower triangle becomes L and the strict upper triangle is
 * zeroed. Returns false (leaving the matrix partly overwritten) when a pivot is not positive, i.e.
 * the matrix is not positive definite to working precision. Golub & Van Loan, Matrix
 * Computations, 4th ed., algorithm 4.2.2 (the jik "gaxpy" form). For the few-unknown systems of
 * the designer, the cut planner and the calibration; the finite-element systems use the banded
 * and sparse LDLᵀ factorisations.
 */
export function denseCholeskyInPlace(matrix: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let diagonal = matrix[j * n + j]!;
    for (let k = 0; k < j; k++) diagonal -= matrix[j * n + k]! ** 2;
    if (!(diagonal > 0)) return false;
    const root = Math.sqrt(diagonal);
    matrix[j * n + j] = root;
    for (let i = j + 1; i < n; i++) {
      let value = matrix[i * n + j]!;
      for (let k = 0; k < j; k++) value -= matrix[i * n + k]! * matrix[j * n + k]!;
      matrix[i * n + j] = value / root;
    }
    for (let k = j + 1; k < n; k++) matrix[j * n + k] = 0;
  }
  return true;
}

/** Solves L·Lᵀ·y = rhs in place, L the factor from denseCholeskyInPlace (n × n, row-major). */
export function denseCholeskySolveInPlace(factor: Float64Array, n: number, rhs: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let value = rhs[i]!;
    for (let k = 0; k < i; k++) value -= factor[i * n + k]! * rhs[k]!;
    rhs[i] = value / factor[i * n + i]!;
  }
  for (let i = n - 1; i >= 0; i--) {
    let value = rhs[i]!;
    for (let k = i + 1; k < n; k++) value -= factor[k * n + i]! * rhs[k]!;
    rhs[i] = value / factor[i * n + i]!;
  }
}

/**
 * The inverse of a small symmetric positive-definite matrix (n × n, row-major), by Cholesky and
 * n solves, symmetrised. Throws when the matrix is not positive definite (callers build matrices
 * that are, e.g. normal equations with priors).
 */
export function symmetricPositiveInverse(matrix: Float64Array, n: number): Float64Array {
  const factor = Float64Array.from(matrix);
  if (!denseCholeskyInPlace(factor, n)) throw new Error('internal: matrix is not positive definite');
  const inverse = new Float64Array(n * n);
  const column = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    column.fill(0);
    column[j] = 1;
    denseCholeskySolveInPlace(factor, n, column);
    for (let i = 0; i < n; i++) inverse[i * n + j] = column[i]!;
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      const mean = 0.5 * (inverse[i * n + j]! + inverse[j * n + i]!);
      inverse[i * n + j] = mean;
      inverse[j * n + i] = mean;
    }
  }
  return inverse;
}
