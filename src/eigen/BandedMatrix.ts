/**
 * A symmetric banded matrix stored by its lower band: entry (i, j) with 0 ≤ i − j ≤
 * halfBandwidth lives at data[i·(halfBandwidth+1) + (i − j)]. Entries outside the band are zero.
 */
export interface BandedMatrix {
  readonly size: number;
  readonly halfBandwidth: number;
  readonly data: Float64Array;
}

/** A zero symmetric banded matrix of the given size and half-bandwidth. */
export function createBandedMatrix(size: number, halfBandwidth: number): BandedMatrix {
  return { size, halfBandwidth, data: new Float64Array(size * (halfBandwidth + 1)) };
}

/** Entry (i, j) of a symmetric banded matrix (zero outside the band). */
export function bandedGet(matrix: BandedMatrix, i: number, j: number): number {
  const row = Math.max(i, j);
  const offset = Math.abs(i - j);
  if (offset > matrix.halfBandwidth) return 0;
  return matrix.data[row * (matrix.halfBandwidth + 1) + offset]!;
}

/**
 * Adds the lower triangle of a dense symmetric element matrix (row-major, `dofs.length` square)
 * into the banded matrix at the global degrees of freedom `dofs`.
 */
export function bandedAddElement(matrix: BandedMatrix, dofs: ArrayLike<number>, element: ArrayLike<number>): void {
  const width = matrix.halfBandwidth + 1;
  const n = dofs.length;
  for (let a = 0; a < n; a++) {
    const i = dofs[a]!;
    for (let b = 0; b < n; b++) {
      const j = dofs[b]!;
      if (j > i) continue;
      const offset = i - j;
      if (offset > matrix.halfBandwidth) throw new Error(`internal: element entry (${i}, ${j}) outside half-bandwidth ${matrix.halfBandwidth}`);
      matrix.data[i * width + offset]! += element[a * n + b]!;
    }
  }
}

/** y = A·x for a symmetric banded A. Writes into `out` (allocated when absent) and returns it. */
export function bandedMultiply(matrix: BandedMatrix, x: ArrayLike<number>, out = new Float64Array(matrix.size)): Float64Array {
  const { size, halfBandwidth: hb, data } = matrix;
  const width = hb + 1;
  out.fill(0);
  for (let i = 0; i < size; i++) {
    const row = i * width;
    let sum = data[row]! * x[i]!;
    const start = Math.max(0, i - hb);
    for (let j = start; j < i; j++) {
      const value = data[row + i - j]!;
      sum += value * x[j]!;
      out[j]! += value * x[i]!;
    }
    out[i]! += sum;
  }
  return out;
}

/** A + c·B for two banded matrices of the same size and bandwidth (new matrix). */
export function bandedCombine(a: BandedMatrix, c: number, b: BandedMatrix): BandedMatrix {
  if (a.size !== b.size || a.halfBandwidth !== b.halfBandwidth) throw new Error('internal: banded matrices differ in shape');
  const data = new Float64Array(a.data.length);
  for (let k = 0; k < data.length; k++) data[k] = a.data[k]! + c * b.data[k]!;
  return { size: a.size, halfBandwidth: a.halfBandwidth, data };
}

/** The full dense matrix (array of rows) of a banded one: for tests and small checks only. */
export function bandedToDense(matrix: BandedMatrix): number[][] {
  const dense: number[][] = [];
  for (let i = 0; i < matrix.size; i++) {
    const row: number[] = [];
    for (let j = 0; j < matrix.size; j++) row.push(bandedGet(matrix, i, j));
    dense.push(row);
  }
  return dense;
}
