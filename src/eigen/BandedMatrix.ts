/**
 * A symmetric banded matrix stored by its lower band: entry (i, j) with 0 ≤ i − j ≤
 * halfBandwidth lives at data[i·(halfBandwidth+1) + (i − j)]. Entries outside the band are zero.
 * `firstColumn`, when present, narrows the band row by row to an envelope (profile): row i has
 * no non-zero left of column firstColumn[i] (≥ i − halfBandwidth, non-decreasing). LDLᵀ fill-in
 * stays inside the envelope (George & Liu, Computer Solution of Large Sparse Positive Definite
 * Systems (1981), ch. 4), so every operation here skips the structural zeros outside it: for
 * beam elements with interior dofs that is 40 % of the band (counted for the quartic/quintic
 * Timoshenko element: 54 of 90 band slots per element are inside the envelope).
 */
export interface BandedMatrix {
  readonly size: number;
  readonly halfBandwidth: number;
  readonly data: Float64Array;
  readonly firstColumn?: Int32Array;
}

/** A zero symmetric banded matrix of the given size and half-bandwidth (and envelope, if given). */
export function createBandedMatrix(size: number, halfBandwidth: number, firstColumn?: Int32Array): BandedMatrix {
  if (firstColumn) {
    if (firstColumn.length !== size) throw new Error('internal: envelope length differs from the matrix size');
    for (let i = 0; i < size; i++) {
      const start = firstColumn[i]!;
      if (start > i || start < i - halfBandwidth || start < 0 || (i > 0 && start < firstColumn[i - 1]!)) throw new Error(`internal: envelope row ${i} starts at column ${start}`);
    }
  }
  return { size, halfBandwidth, data: new Float64Array(size * (halfBandwidth + 1)), ...(firstColumn ? { firstColumn } : {}) };
}

/** Leftmost stored column of row i: the envelope's, or the band's. */
export function rowStart(matrix: { readonly halfBandwidth: number; readonly firstColumn?: Int32Array }, i: number): number {
  return matrix.firstColumn ? matrix.firstColumn[i]! : i > matrix.halfBandwidth ? i - matrix.halfBandwidth : 0;
}

/** rowStart of every row (the envelope itself when there is one): what the loops below read. */
export function rowStarts(matrix: { readonly size: number; readonly halfBandwidth: number; readonly firstColumn?: Int32Array }): Int32Array {
  return matrix.firstColumn ?? Int32Array.from({ length: matrix.size }, (_, i) => rowStart(matrix, i));
}

/** Entry (i, j) of a symmetric banded matrix (zero outside the band). */
export function bandedGet(matrix: BandedMatrix, i: number, j: number): number {
  const row = Math.max(i, j);
  const offset = Math.abs(i - j);
  if (offset > matrix.halfBandwidth || Math.min(i, j) < rowStart(matrix, row)) return 0;
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
      if (offset > matrix.halfBandwidth || j < rowStart(matrix, i)) throw new Error(`internal: element entry (${i}, ${j}) outside the band or envelope`);
      matrix.data[i * width + offset]! += element[a * n + b]!;
    }
  }
}

/**
 * Adds the lower triangle of a dense symmetric element matrix (row-major, `count` square) whose
 * local dofs are the consecutive global dofs first … first + count − 1 (the layout of a beam
 * line): the assembly hot path, without index lookups.
 */
export function bandedAddBlock(matrix: BandedMatrix, first: number, count: number, element: ArrayLike<number>): void {
  const width = matrix.halfBandwidth + 1;
  if (count > width) throw new Error(`internal: a ${count}-dof block does not fit half-bandwidth ${matrix.halfBandwidth}`);
  const data = matrix.data;
  if (matrix.firstColumn && matrix.firstColumn[first + count - 1]! > first) throw new Error(`internal: a block at dof ${first} reaches outside the envelope`);
  for (let a = 0; a < count; a++) {
    const base = (first + a) * width + a;
    const row = a * count;
    for (let b = 0; b <= a; b++) data[base - b]! += element[row + b]!;
  }
}

/** y = A·x for a symmetric banded A. Writes into `out` (allocated when absent) and returns it. */
export function bandedMultiply(matrix: BandedMatrix, x: ArrayLike<number>, out = new Float64Array(matrix.size)): Float64Array {
  const { size, halfBandwidth: hb, data } = matrix;
  const width = hb + 1;
  const first = rowStarts(matrix);
  out.fill(0);
  for (let i = 0; i < size; i++) {
    const row = i * width;
    const xi = x[i]!;
    let sum = data[row]! * xi;
    const start = first[i]!;
    // Row i's lower band, A_{i,i−1}, A_{i,i−2}, … at data[row + 1 …]: gathered into y_i and
    // scattered into the rows above by symmetry.
    for (let j = i - 1, o = row + 1; j >= start; j--, o++) {
      const value = data[o]!;
      sum += value * x[j]!;
      out[j]! += value * xi;
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
  // The sum keeps an envelope only if both share it (as K and M of one assembly do).
  const firstColumn = a.firstColumn && a.firstColumn === b.firstColumn ? a.firstColumn : undefined;
  return { size: a.size, halfBandwidth: a.halfBandwidth, data, ...(firstColumn ? { firstColumn } : {}) };
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
