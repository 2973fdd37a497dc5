/**
 * Small dense symmetric positive-definite systems (the normal equations of a calibration, a few
 * unknowns): Cholesky factorisation A = L·Lᵀ, solve and inverse. Row-major number[][] inputs,
 * never modified. Throws when A is not positive definite (a programming error: priors make every
 * calibration system positive definite).
 */
export function choleskyFactor(matrix: readonly (readonly number[])[]): number[][] {
  const n = matrix.length;
  const lower: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = matrix[i]![j]!;
      for (let k = 0; k < j; k++) sum -= lower[i]![k]! * lower[j]![k]!;
      if (i === j) {
        if (!(sum > 0)) throw new Error(`internal: matrix not positive definite at row ${i}`);
        lower[i]![i] = Math.sqrt(sum);
      } else lower[i]![j] = sum / lower[j]![j]!;
    }
  }
  return lower;
}

/** Solves A x = b given the Cholesky factor L of A. */
export function choleskySolve(lower: readonly (readonly number[])[], rhs: readonly number[]): number[] {
  const n = lower.length;
  const y = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    let sum = rhs[i]!;
    for (let k = 0; k < i; k++) sum -= lower[i]![k]! * y[k]!;
    y[i] = sum / lower[i]![i]!;
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let sum = y[i]!;
    for (let k = i + 1; k < n; k++) sum -= lower[k]![i]! * x[k]!;
    x[i] = sum / lower[i]![i]!;
  }
  return x;
}

/** The inverse of a symmetric positive-definite matrix (by Cholesky). */
export function symmetricInverse(matrix: readonly (readonly number[])[]): number[][] {
  const lower = choleskyFactor(matrix);
  const n = matrix.length;
  const columns = Array.from({ length: n }, (_, j) => choleskySolve(lower, Array.from({ length: n }, (_, i) => (i === j ? 1 : 0))));
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => 0.5 * (columns[j]![i]! + columns[i]![j]!)));
}

/** v·M·vᵀ for a row vector v and a square matrix M. */
export function quadraticForm(vector: readonly number[], matrix: readonly (readonly number[])[]): number {
  let sum = 0;
  for (let i = 0; i < vector.length; i++) {
    let row = 0;
    for (let j = 0; j < vector.length; j++) row += matrix[i]![j]! * vector[j]!;
    sum += vector[i]! * row;
  }
  return sum;
}
