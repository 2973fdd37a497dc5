import { createBandedMatrix, type BandedMatrix } from '../eigen/BandedMatrix.ts';

/**
 * Removes the given degrees of freedom (held at zero: supports) from a banded matrix, returning
 * the reduced matrix (same half-bandwidth) and the map from kept to original dofs.
 */
export function constrainDofs(matrix: BandedMatrix, fixed: readonly number[]): { matrix: BandedMatrix; kept: Int32Array } {
  const isFixed = new Uint8Array(matrix.size);
  for (const dof of fixed) isFixed[dof] = 1;
  const kept: number[] = [];
  for (let i = 0; i < matrix.size; i++) if (!isFixed[i]) kept.push(i);
  const reduced = createBandedMatrix(kept.length, matrix.halfBandwidth);
  const width = matrix.halfBandwidth + 1;
  for (let a = 0; a < kept.length; a++) {
    for (let b = Math.max(0, a - matrix.halfBandwidth); b <= a; b++) {
      const i = kept[a]!;
      const j = kept[b]!;
      if (i - j > matrix.halfBandwidth) continue;
      reduced.data[a * width + (a - b)] = matrix.data[i * width + (i - j)]!;
    }
  }
  return { matrix: reduced, kept: Int32Array.from(kept) };
}
