// The envelope (skyline) storage, its LDLᵀ and the Lanczos on it, against a general-purpose
// library (numeric) and closed forms.
import numeric from 'numeric';
import { describe, expect, it } from 'vitest';
import {
  compressEnvelope,
  createEnvelopeMatrix,
  envelopeAddElement,
  envelopeEigenproblem,
  envelopeLayout,
  envelopeLdlt,
  envelopeLdltSolve,
  envelopeMultiply,
  envelopeToDense,
  lowestModesOf,
  type EnvelopeMatrix,
} from '../../src/index.ts';

/**
 * A random symmetric positive definite matrix with a ragged envelope (diagonally dominant): row
 * widths up to `widest`, first columns non-decreasing or, with `monotone` false, in any order
 * (as an assembled mesh may give them).
 */
function randomEnvelope(size: number, seed: number, widest = 9, monotone = true): EnvelopeMatrix {
  let state = seed;
  const random = () => (state = (state * 48271) % 2147483647) / 2147483647;
  const first = new Int32Array(size);
  for (let i = 1; i < size; i++) {
    const start = Math.max(0, i - Math.floor(random() * widest));
    first[i] = monotone ? Math.max(first[i - 1]!, start) : start;
  }
  const matrix = createEnvelopeMatrix(envelopeLayout(first));
  for (let i = 0; i < size; i++) {
    for (let j = first[i]!; j < i; j++) {
      // Some entries inside the envelope left zero, as in assembled finite-element matrices.
      const value = random() < 0.3 ? 0 : random() - 0.5;
      matrix.data[matrix.rowOffset[i]! + j] = value;
    }
    matrix.data[matrix.rowOffset[i]! + i] = 2 * widest + random();
  }
  return matrix;
}

describe('envelope matrix', () => {
  it('LDLᵀ solves like numeric.solve on random SPD matrices with ragged envelopes, first columns in order or not (relative 1e-12)', () => {
    for (const [size, seed, widest, monotone] of [
      [7, 3, 9, true],
      [40, 11, 9, true],
      [120, 5, 9, true],
      // Wide rows (the four-column blocks of the factor, the paired rows of the solve) and first columns in any order.
      [150, 23, 40, false],
      [151, 29, 17, false],
    ] as const) {
      const a = randomEnvelope(size, seed, widest, monotone);
      const b = Float64Array.from({ length: size! }, (_, i) => Math.cos(0.3 * i) + 0.1 * i);
      const x = envelopeLdltSolve(envelopeLdlt(a), Float64Array.from(b));
      const reference = numeric.solve(envelopeToDense(a), Array.from(b)) as number[];
      const scale = Math.max(...reference.map(Math.abs));
      x.forEach((value, i) => expect(Math.abs(value - reference[i]!)).toBeLessThan(1e-12 * scale));
    }
  });
  it('leaves the matrix unchanged when factoring a copy, and multiplies like the dense matrix', () => {
    const a = randomEnvelope(30, 17);
    const before = a.data.slice();
    envelopeLdlt(a);
    expect(Array.from(a.data)).toEqual(Array.from(before));
    const x = Float64Array.from({ length: 30 }, (_, i) => i - 14.5);
    const y = envelopeMultiply(a, x);
    const dense = numeric.dot(envelopeToDense(a), Array.from(x)) as number[];
    y.forEach((value, i) => expect(Math.abs(value - dense[i]!)).toBeLessThan(1e-12 * Math.max(...dense.map(Math.abs))));
  });
  it('assembles element matrices into the envelope, skipping constrained dofs (−1), and refuses an entry outside it', () => {
    const matrix = createEnvelopeMatrix(envelopeLayout(Int32Array.of(0, 0, 1, 2)));
    envelopeAddElement(matrix, [0, 1, -1], [2, -1, 5, -1, 2, 5, 5, 5, 5]);
    envelopeAddElement(matrix, [1, 2], [1, -1, -1, 1]);
    expect(envelopeToDense(matrix)).toEqual([
      [2, -1, 0, 0],
      [-1, 3, -1, 0],
      [0, -1, 1, 0],
      [0, 0, 0, 0],
    ]);
    expect(() => envelopeAddElement(matrix, [0, 3], [1, 1, 1, 1])).toThrow(/outside the envelope/);
  });
  it('refuses a singular matrix with an internal error naming the pivot', () => {
    const matrix = createEnvelopeMatrix(envelopeLayout(Int32Array.of(0, 0, 1)));
    for (let e = 0; e < 2; e++) envelopeAddElement(matrix, [e, e + 1], [1, -1, -1, 1]);
    expect(() => envelopeLdlt(matrix)).toThrow(/pivot 2 .*not positive definite/);
  });
});

describe('Lanczos on envelope storage', () => {
  it('returns the flexible modes of a free–free chain with a ragged envelope (closed form 2 − 2cos(kπ/n), 1e-12)', () => {
    // The Neumann Laplacian of a chain, assembled into an envelope with extra (zero) columns.
    const n = 70;
    const first = Int32Array.from({ length: n }, (_, i) => Math.max(0, i - 1 - (i % 3)));
    const layout = envelopeLayout(first);
    const stiffness = createEnvelopeMatrix(layout);
    const mass = createEnvelopeMatrix(layout);
    for (let e = 0; e + 1 < n; e++) envelopeAddElement(stiffness, [e, e + 1], [1, -1, -1, 1]);
    for (let i = 0; i < n; i++) mass.data[mass.rowOffset[i]! + i] = 1;
    const result = lowestModesOf(envelopeEigenproblem(stiffness, compressEnvelope(mass)), 5, { shift: -0.001, rigidModes: [new Float64Array(n).fill(1)] });
    result.eigenvalues.forEach((value, k) => expect(Math.abs(value - (2 - 2 * Math.cos(((k + 1) * Math.PI) / n)))).toBeLessThan(1e-12));
  });
});
