/**
 * A symmetric sparse matrix stored by its lower envelope (profile, "skyline"): row i holds the
 * contiguous columns firstColumn[i] … i, at data[rowOffset[i] + j] for column j. Unlike
 * BandedMatrix, the rows have their own lengths, so memory follows the envelope and not the
 * widest row. LDLᵀ fill-in stays inside the envelope (George & Liu, Computer Solution of Large
 * Sparse Positive Definite Systems (1981), ch. 4), so the factor reuses the same layout.
 * A node order that keeps the envelope small (for a bar, the nodes numbered slice by slice along
 * its length) is the caller's job.
 */
export interface EnvelopeMatrix {
  readonly size: number;
  /** First stored column of each row (≤ the row itself). */
  readonly firstColumn: Int32Array;
  /** data index of entry (i, j) is rowOffset[i] + j (for firstColumn[i] ≤ j ≤ i). */
  readonly rowOffset: Int32Array;
  readonly data: Float64Array;
}

/** The layout (first columns and row offsets) of an envelope, shared by matrices of one mesh. */
export interface EnvelopeLayout {
  readonly size: number;
  readonly firstColumn: Int32Array;
  readonly rowOffset: Int32Array;
  /** Stored entries (the envelope's size, diagonal included). */
  readonly entries: number;
}

/**
 * The envelope layout of the given first columns. Throws (internal) when a first column lies
 * right of its row or below zero.
 */
export function envelopeLayout(firstColumn: Int32Array): EnvelopeLayout {
  const size = firstColumn.length;
  const rowOffset = new Int32Array(size);
  let entries = 0;
  for (let i = 0; i < size; i++) {
    const first = firstColumn[i]!;
    if (first < 0 || first > i) throw new Error(`internal: envelope row ${i} starts at column ${first}`);
    rowOffset[i] = entries - first;
    entries += i - first + 1;
  }
  return { size, firstColumn, rowOffset, entries };
}

/** A zero matrix with the given layout. */
export function createEnvelopeMatrix(layout: EnvelopeLayout): EnvelopeMatrix {
  return { size: layout.size, firstColumn: layout.firstColumn, rowOffset: layout.rowOffset, data: new Float64Array(layout.entries) };
}

/** Entry (i, j) (zero outside the envelope). */
export function envelopeGet(matrix: EnvelopeMatrix, i: number, j: number): number {
  const row = Math.max(i, j);
  const column = Math.min(i, j);
  if (column < matrix.firstColumn[row]!) return 0;
  return matrix.data[matrix.rowOffset[row]! + column]!;
}

/**
 * Adds the lower triangle of a dense symmetric element matrix (row-major, `dofs.length` square)
 * at the global dofs `dofs`; a dof of −1 is skipped (a constrained one).
 */
export function envelopeAddElement(matrix: EnvelopeMatrix, dofs: ArrayLike<number>, element: ArrayLike<number>): void {
  const n = dofs.length;
  const { data, rowOffset, firstColumn } = matrix;
  for (let a = 0; a < n; a++) {
    const i = dofs[a]!;
    if (i < 0) continue;
    const offset = rowOffset[i]!;
    const first = firstColumn[i]!;
    const row = a * n;
    for (let b = 0; b < n; b++) {
      const j = dofs[b]!;
      if (j < 0 || j > i) continue;
      if (j < first) throw new Error(`internal: element entry (${i}, ${j}) outside the envelope`);
      data[offset + j]! += element[row + b]!;
    }
  }
}

/**
 * Adds the lower triangle of a·A + b·B + c·C for dense symmetric element matrices (row-major,
 * `dofs.length` square) at the global dofs `dofs` (−1 skipped): three element parts combined and
 * assembled in one pass over the lower triangle.
 */
export function envelopeAddCombination(matrix: EnvelopeMatrix, dofs: ArrayLike<number>, a: number, first: ArrayLike<number>, b: number, second: ArrayLike<number>, c: number, third: ArrayLike<number>): void {
  const n = dofs.length;
  const { data, rowOffset, firstColumn } = matrix;
  for (let p = 0; p < n; p++) {
    const i = dofs[p]!;
    if (i < 0) continue;
    const offset = rowOffset[i]!;
    const start = firstColumn[i]!;
    const row = p * n;
    for (let q = 0; q < n; q++) {
      const j = dofs[q]!;
      if (j < 0 || j > i) continue;
      if (j < start) throw new Error(`internal: element entry (${i}, ${j}) outside the envelope`);
      data[offset + j]! += a * first[row + q]! + b * second[row + q]! + c * third[row + q]!;
    }
  }
}

/** y = A·x for a symmetric envelope matrix; writes into `out` (allocated when absent). */
export function envelopeMultiply(matrix: EnvelopeMatrix, x: ArrayLike<number>, out = new Float64Array(matrix.size)): Float64Array {
  const { size, firstColumn, rowOffset, data } = matrix;
  out.fill(0);
  for (let i = 0; i < size; i++) {
    const offset = rowOffset[i]!;
    const xi = x[i]!;
    let sum = data[offset + i]! * xi;
    // The row's strictly lower part: gathered into y_i, scattered into y_j by symmetry.
    for (let j = firstColumn[i]!; j < i; j++) {
      const value = data[offset + j]!;
      sum += value * x[j]!;
      out[j]! += value * xi;
    }
    out[i]! += sum;
  }
  return out;
}

/** A + c·B for two matrices of one layout (a new matrix). */
export function envelopeCombine(a: EnvelopeMatrix, c: number, b: EnvelopeMatrix): EnvelopeMatrix {
  if (a.size !== b.size || a.data.length !== b.data.length || a.firstColumn !== b.firstColumn) throw new Error('internal: envelope matrices differ in layout');
  const data = new Float64Array(a.data.length);
  const x = a.data;
  const y = b.data;
  for (let k = 0; k < data.length; k++) data[k] = x[k]! + c * y[k]!;
  return { size: a.size, firstColumn: a.firstColumn, rowOffset: a.rowOffset, data };
}

/** The dense matrix (array of rows): for tests and small checks only. */
export function envelopeToDense(matrix: EnvelopeMatrix): number[][] {
  const dense: number[][] = [];
  for (let i = 0; i < matrix.size; i++) {
    const row: number[] = [];
    for (let j = 0; j < matrix.size; j++) row.push(envelopeGet(matrix, i, j));
    dense.push(row);
  }
  return dense;
}
