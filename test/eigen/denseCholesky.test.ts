// The one dense Cholesky (designer, cut planner, calibration) against its definition and an
// independent reference library (numeric 1.2.6's LU-based inverse).
import numeric from 'numeric';
import { describe, expect, it } from 'vitest';
import { denseCholeskyInPlace, denseCholeskySolveInPlace, symmetricPositiveInverse } from '../../src/eigen/index.ts';

/** Park–Miller minimal standard generator: repeatable random matrices. */
function generator(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647 - 0.5;
  };
}

/** BᵀB + n·I for a random B: symmetric positive definite, condition number of order 10. */
function randomSpd(random: () => number, n: number): Float64Array {
  const b = Array.from({ length: n * n }, random);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = i === j ? n * 0.1 : 0;
    for (let k = 0; k < n; k++) s += b[k * n + i]! * b[k * n + j]!;
    a[i * n + j] = s;
  }
  return a;
}

describe('dense Cholesky', () => {
  it('factors A = L·Lᵀ with L lower triangular (definition), to rounding', () => {
    const random = generator(7);
    for (const n of [1, 2, 5, 12]) {
      const a = randomSpd(random, n);
      const l = Float64Array.from(a);
      expect(denseCholeskyInPlace(l, n)).toBe(true);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        if (j > i) expect(l[i * n + j]).toBe(0);
        let s = 0;
        for (let k = 0; k < n; k++) s += l[i * n + k]! * l[j * n + k]!;
        // Backward-stable: |A − LLᵀ| ≤ c·n·ε·|A| (Golub & Van Loan §4.2.7); 1e-12 relative is ample.
        expect(Math.abs(s - a[i * n + j]!)).toBeLessThan(1e-12 * Math.max(1, Math.abs(a[i * n + i]!)));
      }
    }
  });
  it('solves and inverts like numeric.inv (reference library)', () => {
    const random = generator(11);
    const n = 8;
    const a = randomSpd(random, n);
    const rhs = Float64Array.from({ length: n }, random);
    const factor = Float64Array.from(a);
    denseCholeskyInPlace(factor, n);
    const x = Float64Array.from(rhs);
    denseCholeskySolveInPlace(factor, n, x);
    const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
    const reference = numeric.dot(numeric.inv(rows), Array.from(rhs)) as number[];
    x.forEach((v, i) => expect(v).toBeCloseTo(reference[i]!, 10));
    const inverse = symmetricPositiveInverse(a, n);
    const referenceInverse = numeric.inv(rows);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(inverse[i * n + j]).toBeCloseTo(referenceInverse[i]![j]!, 10);
  });
  it('refuses a matrix that is not positive definite', () => {
    // [[1, 2], [2, 1]] has eigenvalues 3 and −1 (closed form).
    expect(denseCholeskyInPlace(Float64Array.of(1, 2, 2, 1), 2)).toBe(false);
    expect(() => symmetricPositiveInverse(Float64Array.of(1, 2, 2, 1), 2)).toThrow(/positive definite/);
  });
});
