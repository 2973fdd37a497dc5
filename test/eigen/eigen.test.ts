// The banded eigensolver's parts against closed forms and a general-purpose library (numeric).
import numeric from 'numeric';
import { describe, expect, it } from 'vitest';
import {
  bandedAddElement,
  bandedLdlt,
  bandedLdltSolve,
  bandedMultiply,
  bandedToDense,
  createBandedMatrix,
  lowestModes,
  tridiagonalEigen,
  tridiagonalEigenvector,
  type BandedMatrix,
} from '../../src/index.ts';

/** A random symmetric positive definite banded matrix (diagonally dominant). */
function randomBanded(size: number, halfBandwidth: number, seed: number): BandedMatrix {
  const matrix = createBandedMatrix(size, halfBandwidth);
  let state = seed;
  const random = () => ((state = (state * 48271) % 2147483647) / 2147483647) - 0.5;
  for (let i = 0; i < size; i++) {
    for (let j = Math.max(0, i - halfBandwidth); j < i; j++) matrix.data[i * (halfBandwidth + 1) + i - j] = random();
    matrix.data[i * (halfBandwidth + 1)] = 2 * halfBandwidth + 1 + random();
  }
  return matrix;
}

/** Free–free chain: K = Neumann Laplacian (assembled from 2×2 springs), M = I. */
function chain(size: number): { stiffness: BandedMatrix; mass: BandedMatrix } {
  const stiffness = createBandedMatrix(size, 1);
  const mass = createBandedMatrix(size, 1);
  for (let e = 0; e + 1 < size; e++) bandedAddElement(stiffness, [e, e + 1], [1, -1, -1, 1]);
  for (let i = 0; i < size; i++) mass.data[i * 2] = 1;
  return { stiffness, mass };
}

describe('banded LDLᵀ', () => {
  it('solves like numeric.solve on random SPD banded systems (relative 1e-12)', () => {
    for (const [size, hb] of [
      [12, 1],
      [40, 3],
      [60, 8],
    ]) {
      const a = randomBanded(size!, hb!, size! * 31 + hb!);
      const b = Float64Array.from({ length: size! }, (_, i) => Math.sin(i + 1));
      const x = bandedLdltSolve(bandedLdlt(a), Float64Array.from(b));
      const reference = numeric.solve(bandedToDense(a), Array.from(b)) as number[];
      const scale = Math.max(...reference.map(Math.abs));
      x.forEach((value, i) => expect(Math.abs(value - reference[i]!)).toBeLessThan(1e-12 * scale));
    }
  });
  it('multiplies like the dense matrix', () => {
    const a = randomBanded(25, 4, 3);
    const x = Float64Array.from({ length: 25 }, (_, i) => i - 12);
    const y = bandedMultiply(a, x);
    const dense = numeric.dot(bandedToDense(a), Array.from(x)) as number[];
    y.forEach((value, i) => expect(value).toBeCloseTo(dense[i]!, 10));
  });
  it('refuses an indefinite matrix with a clear internal error', () => {
    const { stiffness } = chain(5); // singular: rigid mode
    expect(() => bandedLdlt(stiffness)).toThrow(/not positive definite/);
  });
});

describe('tridiagonal QL', () => {
  it('finds the closed-form spectrum a + 2b·cos(kπ/(n+1)) of a Toeplitz tridiagonal matrix (1e-13)', () => {
    // Closed form: eigenvalues of tridiag(b, a, b) of order n (e.g. Smith, Numerical Solution of PDEs).
    const n = 30;
    const a = 2.5;
    const b = -0.7;
    const { values, vectors } = tridiagonalEigen(new Float64Array(n).fill(a), new Float64Array(n - 1).fill(b));
    const expected = Array.from({ length: n }, (_, k) => a + 2 * b * Math.cos(((k + 1) * Math.PI) / (n + 1))).sort((x, y) => x - y);
    const found = Array.from(values).sort((x, y) => x - y);
    found.forEach((value, k) => expect(Math.abs(value - expected[k]!)).toBeLessThan(1e-13));
    // Eigenvectors orthonormal: ZᵀZ = I.
    for (let p = 0; p < n; p += 7) for (let q = 0; q < n; q += 5) {
      let dot = 0;
      for (let i = 0; i < n; i++) dot += vectors[i * n + p]! * vectors[i * n + q]!;
      expect(Math.abs(dot - (p === q ? 1 : 0))).toBeLessThan(1e-13);
    }
  });
  it('with lastRowOnly returns the last row of the full eigenvector matrix', () => {
    const d = [4, 1, 3, 2, 5, 0.5];
    const e = [0.3, -1, 0.8, 0.2, -0.6];
    const full = tridiagonalEigen(d, e);
    const last = tridiagonalEigen(d, e, true);
    for (let k = 0; k < d.length; k++) expect(Math.abs(last.vectors[k]!)).toBeCloseTo(Math.abs(full.vectors[(d.length - 1) * d.length + k]!), 13);
  });
});

describe('tridiagonal inverse iteration', () => {
  it('gives the QL eigenvector (up to sign, 1e-9) for every well-separated eigenvalue of 200 random matrices', () => {
    // Independent method: the implicit QL vectors above. Matrices of order 2–26, entries O(1) or
    // O(1e-6) (the scale of shift-invert Ritz values), some with a zero off-diagonal (split
    // blocks). Eigenvalues closer than 1e-6 of the spread to another are skipped: inverse
    // iteration is not meant for clusters (lowestModes falls back to QL vectors there).
    let seed = 7;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    let checked = 0;
    for (let trial = 0; trial < 200; trial++) {
      const m = 2 + Math.floor(random() * 25);
      const size = trial % 2 ? 1 : 1e-6;
      const d = Array.from({ length: m }, () => (random() * size) / (1 + 10 * random()));
      const e = Array.from({ length: m - 1 }, () => (random() - 0.5) * size * (trial % 7 === 0 && random() < 0.2 ? 0 : 1));
      const full = tridiagonalEigen(d, e);
      const spread = Math.max(...Array.from(full.values, Math.abs));
      for (let k = 0; k < m; k++) {
        const value = full.values[k]!;
        let gap = Infinity;
        for (let l = 0; l < m; l++) if (l !== k) gap = Math.min(gap, Math.abs(full.values[l]! - value));
        if (gap < 1e-6 * spread) continue;
        const y = tridiagonalEigenvector(d, e, value);
        let dot = 0;
        for (let i = 0; i < m; i++) dot += y[i]! * full.vectors[i * m + k]!;
        expect(Math.abs(Math.abs(dot) - 1)).toBeLessThan(1e-9);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(1000);
  });
});

describe('shift-invert Lanczos', () => {
  it('returns the lowest flexible modes of a free–free chain, rigid mode deflated (closed form 2 − 2cos(kπ/n))', () => {
    // Neumann Laplacian eigenvalues 2 − 2cos(kπ/n), k = 0 … n−1; k = 0 is the rigid mode.
    const n = 80;
    const { stiffness, mass } = chain(n);
    const result = lowestModes(stiffness, mass, 6, { shift: -0.001, rigidModes: [new Float64Array(n).fill(1)] });
    result.eigenvalues.forEach((value, i) => expect(Math.abs(value - (2 - 2 * Math.cos(((i + 1) * Math.PI) / n)))).toBeLessThan(1e-12));
    // Vectors M-orthonormal and orthogonal to the rigid mode.
    for (let p = 0; p < 6; p++) {
      const sum = result.vectors[p]!.reduce((s, v) => s + v, 0);
      expect(Math.abs(sum)).toBeLessThan(1e-9);
      for (let q = 0; q < 6; q++) {
        const dot = result.vectors[p]!.reduce((s, v, i) => s + v * result.vectors[q]![i]!, 0);
        expect(Math.abs(dot - (p === q ? 1 : 0))).toBeLessThan(1e-9);
      }
    }
  });
  it('with upTo returns every mode below the bound, in one run (closed form 2 − 2cos(kπ/n))', () => {
    const n = 60;
    const { stiffness, mass } = chain(n);
    const exact = (k: number) => 2 - 2 * Math.cos((k * Math.PI) / n);
    for (const [bound, count] of [
      [(exact(7) + exact(8)) / 2, 7],
      // Just below mode 8 (0.1 % of the gap): the run must still tell 8 apart from the bound.
      [exact(8) - 1e-3 * (exact(8) - exact(7)), 7],
      [(exact(1) + exact(2)) / 2, 1],
      // Below the first mode: the `count` lowest still come back.
      [exact(1) / 2, 1],
    ] as const) {
      const result = lowestModes(stiffness, mass, 1, { shift: -0.001, rigidModes: [new Float64Array(n).fill(1)], upTo: bound });
      expect(result.eigenvalues).toHaveLength(count);
      result.eigenvalues.forEach((value, i) => expect(Math.abs(value - exact(i + 1))).toBeLessThan(1e-12));
    }
  });
  it('agrees with numeric.eig on a small generalized problem (relative 1e-10)', () => {
    const size = 10;
    const k = randomBanded(size, 2, 11);
    const m = randomBanded(size, 1, 5);
    const result = lowestModes(k, m, 3, { shift: 0 });
    // Reference: eigenvalues of M⁻¹K via numeric (a general-purpose library), tiny so eig is usable.
    const reference = numeric.eig(numeric.dot(numeric.inv(bandedToDense(m)), bandedToDense(k)) as number[][]);
    const values = (reference.lambda.x as number[]).slice().sort((a, b) => a - b);
    for (let i = 0; i < 3; i++) expect(Math.abs(result.eigenvalues[i]! - values[i]!) / values[i]!).toBeLessThan(1e-10);
  });
});
