import { describe, expect, it } from 'vitest';
import numeric from 'numeric';
import { choleskyLower, denseGeneralizedEigen, symmetricEigen } from './denseGeneralizedEigen.ts';

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32) so the cases are reproducible. */
function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A random symmetric matrix (entries in [−1, 1)) and, with `shift` > 0, an SPD one B Bᵀ + shift·I. */
function randomSymmetric(n: number, random: () => number, shift = 0): number[][] {
  const b = Array.from({ length: n }, () => Array.from({ length: n }, () => 2 * random() - 1));
  const a = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (shift > 0) {
        let sum = i === j ? shift : 0;
        for (let k = 0; k < n; k++) sum += b[i]![k]! * b[j]![k]!;
        a[i]![j] = sum;
      } else {
        a[i]![j] = 0.5 * (b[i]![j]! + b[j]![i]!);
      }
    }
  }
  return a;
}

function multiply(a: number[][], x: number[]): number[] {
  return a.map((row) => row.reduce((sum, value, j) => sum + value * x[j]!, 0));
}

function dot(x: number[], y: number[]): number {
  return x.reduce((sum, value, i) => sum + value * y[i]!, 0);
}

describe('denseGeneralizedEigen (test reference)', () => {
  it('matches numeric.eig of M⁻¹K on random SPD pairs up to 8×8', () => {
    // Source: general-purpose reference library (numeric 1.2.6, unsymmetric QR eigenvalues of
    // M⁻¹K, which has the same real spectrum). Tolerance 1e-9 relative to the largest
    // eigenvalue: both are backward-stable O(n³) methods on well-conditioned matrices (M has
    // eigenvalues ≥ 0.5), so they agree to ~1e-13; 1e-9 leaves room for numeric's looser QR stop.
    for (const [seed, n] of [[1, 2], [2, 3], [3, 5], [4, 6], [5, 8]] as const) {
      const random = seededRandom(seed);
      const stiffness = randomSymmetric(n, random);
      const mass = randomSymmetric(n, random, 0.5);
      const ours = denseGeneralizedEigen(stiffness, mass).values;
      const library = numeric.eig(numeric.dot(numeric.inv(mass), stiffness) as number[][]);
      const real = [...(library.lambda.x as number[])].sort((a, b) => a - b);
      const imaginary = (library.lambda.y as number[] | undefined) ?? [];
      for (const value of imaginary) expect(Math.abs(value)).toBeLessThan(1e-9);
      const scale = Math.max(...real.map(Math.abs));
      expect(ours).toHaveLength(n);
      ours.forEach((value, i) => expect(Math.abs(value - real[i]!)).toBeLessThan(1e-9 * scale));
    }
  });

  it('returns M-orthonormal eigenvectors with small residuals', () => {
    // Definition of the generalized eigenproblem; tolerance 1e-11 (backward error of a dense
    // symmetric solver is O(n·ε·‖K‖) ≈ 1e-14 here, with margin for the Cholesky back-transform).
    const random = seededRandom(42);
    const n = 8;
    const stiffness = randomSymmetric(n, random, 0.1);
    const mass = randomSymmetric(n, random, 1);
    const { values, vectors } = denseGeneralizedEigen(stiffness, mass);
    for (let a = 0; a < n; a++) {
      const kx = multiply(stiffness, vectors[a]!);
      const mx = multiply(mass, vectors[a]!);
      const residual = Math.hypot(...kx.map((value, i) => value - values[a]! * mx[i]!));
      expect(residual).toBeLessThan(1e-11 * Math.max(...values.map(Math.abs)));
      for (let b = 0; b < n; b++) expect(dot(vectors[b]!, mx)).toBeCloseTo(a === b ? 1 : 0, 11);
    }
    for (let i = 1; i < n; i++) expect(values[i]!).toBeGreaterThanOrEqual(values[i - 1]!);
  });

  it('solves a 2×2 pair exactly as the closed form det(K − λM) = 0', () => {
    // Closed form: det(K − λM) = (m11 m22 − m12²) λ² − (k11 m22 + k22 m11 − 2 k12 m12) λ
    // + (k11 k22 − k12²) = 0, solved by the quadratic formula. Tolerance 1e-13 relative
    // (a few ulps of cancellation in each route).
    const stiffness = [[3, -1.5], [-1.5, 2]];
    const mass = [[2, 0.4], [0.4, 1]];
    const a = mass[0]![0]! * mass[1]![1]! - mass[0]![1]! ** 2;
    const b = -(stiffness[0]![0]! * mass[1]![1]! + stiffness[1]![1]! * mass[0]![0]! - 2 * stiffness[0]![1]! * mass[0]![1]!);
    const c = stiffness[0]![0]! * stiffness[1]![1]! - stiffness[0]![1]! ** 2;
    const root = Math.sqrt(b * b - 4 * a * c);
    const expected = [(-b - root) / (2 * a), (-b + root) / (2 * a)];
    const { values } = denseGeneralizedEigen(stiffness, mass);
    values.forEach((value, i) => expect(Math.abs(value / expected[i]! - 1)).toBeLessThan(1e-13));
  });

  it('keeps the zero eigenvalues of a singular (free–free-like) stiffness', () => {
    // Closed form: K = v vᵀ has eigenvalues 0 (n − 1 times) and vᵀ M⁻¹ v; with M = I the
    // nonzero one is |v|². Tolerance 1e-13 absolute on the zeros (rounding of O(|v|²) entries).
    const v = [1, 2, -1, 0.5];
    const stiffness = v.map((vi) => v.map((vj) => vi * vj));
    const identity = v.map((_, i) => v.map((__, j) => (i === j ? 1 : 0)));
    const { values } = denseGeneralizedEigen(stiffness, identity);
    for (const value of values.slice(0, 3)) expect(Math.abs(value)).toBeLessThan(1e-13);
    expect(values[3]).toBeCloseTo(dot(v, v), 12);
  });

  it('rejects a mass matrix that is not positive definite', () => {
    expect(() => choleskyLower([[1, 2], [2, 1]])).toThrow(/positive definite/);
  });

  it('diagonalises a tridiagonal matrix with the known spectrum 2 − 2cos(kπ/(n+1))', () => {
    // Closed form: eigenvalues of tridiag(−1, 2, −1) of order n are 2 − 2 cos(kπ/(n+1)).
    // Tolerance 1e-13 absolute (entries of order 1).
    const n = 7;
    const matrix = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (__, j) => (i === j ? 2 : Math.abs(i - j) === 1 ? -1 : 0)));
    const { values } = symmetricEigen(matrix);
    values.forEach((value, k) => expect(Math.abs(value - (2 - 2 * Math.cos(((k + 1) * Math.PI) / (n + 1))))).toBeLessThan(1e-13));
  });
});
