import type { EnvelopeMatrix } from './EnvelopeMatrix.ts';

/**
 * A symmetric sparse matrix in compressed rows holding only the strictly lower non-zeros and
 * the diagonal apart: what a multiply needs and nothing else. A consistent mass matrix of the
 * solid couples only equal displacement components, so most of its envelope is zero; compressed,
 * one multiply by it reads about a fifth of the entries (counted on the bench bar).
 */
export interface SparseSymmetricMatrix {
  readonly size: number;
  readonly diagonal: Float64Array;
  /** Row i's lower entries are columns[rowStart[i] … rowStart[i + 1] − 1] with values alike. */
  readonly rowStart: Int32Array;
  readonly columns: Int32Array;
  readonly values: Float64Array;
}

/** The non-zeros of an envelope matrix, compressed (exact zeros dropped). */
export function compressEnvelope(matrix: EnvelopeMatrix): SparseSymmetricMatrix {
  const { size, firstColumn, rowOffset, data } = matrix;
  const rowStart = new Int32Array(size + 1);
  let count = 0;
  for (let i = 0; i < size; i++) {
    const offset = rowOffset[i]!;
    for (let j = firstColumn[i]!; j < i; j++) if (data[offset + j] !== 0) count++;
    rowStart[i + 1] = count;
  }
  const columns = new Int32Array(count);
  const values = new Float64Array(count);
  const diagonal = new Float64Array(size);
  let k = 0;
  for (let i = 0; i < size; i++) {
    const offset = rowOffset[i]!;
    diagonal[i] = data[offset + i]!;
    for (let j = firstColumn[i]!; j < i; j++) {
      const value = data[offset + j]!;
      if (value === 0) continue;
      columns[k] = j;
      values[k++] = value;
    }
  }
  return { size, diagonal, rowStart, columns, values };
}

/** y = A·x; writes into `out` (allocated when absent) and returns it. */
export function sparseSymmetricMultiply(matrix: SparseSymmetricMatrix, x: ArrayLike<number>, out = new Float64Array(matrix.size)): Float64Array {
  const { size, diagonal, rowStart, columns, values } = matrix;
  for (let i = 0; i < size; i++) out[i] = diagonal[i]! * x[i]!;
  for (let i = 0; i < size; i++) {
    const xi = x[i]!;
    let sum = 0;
    const end = rowStart[i + 1]!;
    for (let k = rowStart[i]!; k < end; k++) {
      const j = columns[k]!;
      const value = values[k]!;
      sum += value * x[j]!;
      out[j]! += value * xi;
    }
    out[i]! += sum;
  }
  return out;
}

/** target ← target + c·A for a sparse symmetric A inside the target's envelope (in place). */
export function envelopeAddSparse(target: EnvelopeMatrix, c: number, matrix: SparseSymmetricMatrix): EnvelopeMatrix {
  const { firstColumn, rowOffset, data } = target;
  if (target.size !== matrix.size) throw new Error('internal: matrices differ in size');
  for (let i = 0; i < matrix.size; i++) {
    const offset = rowOffset[i]!;
    data[offset + i]! += c * matrix.diagonal[i]!;
    const end = matrix.rowStart[i + 1]!;
    for (let k = matrix.rowStart[i]!; k < end; k++) {
      const j = matrix.columns[k]!;
      if (j < firstColumn[i]!) throw new Error(`internal: sparse entry (${i}, ${j}) outside the envelope`);
      data[offset + j]! += c * matrix.values[k]!;
    }
  }
  return target;
}

/** The dense matrix (array of rows): for tests and small checks only. */
export function sparseSymmetricToDense(matrix: SparseSymmetricMatrix): number[][] {
  const dense = Array.from({ length: matrix.size }, () => new Array<number>(matrix.size).fill(0));
  for (let i = 0; i < matrix.size; i++) {
    dense[i]![i] = matrix.diagonal[i]!;
    for (let k = matrix.rowStart[i]!; k < matrix.rowStart[i + 1]!; k++) {
      const j = matrix.columns[k]!;
      dense[i]![j] = matrix.values[k]!;
      dense[j]![i] = matrix.values[k]!;
    }
  }
  return dense;
}
