/** A dense square matrix as rows. */
export type DenseMatrix = readonly (readonly number[])[];

/** Eigenpairs of K x = λ M x, ascending λ; each vector is M-orthonormal (xᵀ M x = 1). */
export interface DenseEigenResult {
  values: number[];
  vectors: number[][];
}

/**
 * All eigenpairs of the symmetric-definite problem K x = λ M x (K symmetric, M symmetric
 * positive definite), the textbook dense route: Cholesky M = L Lᵀ, C = L⁻¹ K L⁻ᵀ, Householder
 * tridiagonalisation of C and implicit QL with eigenvectors (the EISPACK tred2 / tql2
 * algorithms, Wilkinson & Reinsch, *Handbook for Automatic Computation* vol. II, 1971), then
 * x = L⁻ᵀ y. O(n³): for tests and baselines on small matrices only.
 */
export function denseGeneralizedEigen(stiffness: DenseMatrix, mass: DenseMatrix): DenseEigenResult {
  const n = stiffness.length;
  const lower = choleskyLower(mass);
  // Y = L⁻¹ K (forward substitution, column by column), then C = L⁻¹ Yᵀ = L⁻¹ K L⁻ᵀ.
  const y = forwardSubstituteColumns(lower, stiffness);
  const yTransposed = transpose(y);
  const c = forwardSubstituteColumns(lower, yTransposed);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      const mean = 0.5 * (c[i]![j]! + c[j]![i]!);
      c[i]![j] = mean;
      c[j]![i] = mean;
    }
  }
  const { values, vectors: z } = symmetricEigen(c);
  // Back-transform each eigenvector: x = L⁻ᵀ z (back substitution with Lᵀ).
  const vectors: number[][] = [];
  for (let k = 0; k < n; k++) {
    const x = new Array<number>(n).fill(0);
    for (let i = n - 1; i >= 0; i--) {
      let sum = z[i]![k]!;
      for (let j = i + 1; j < n; j++) sum -= lower[j]![i]! * x[j]!;
      x[i] = sum / lower[i]![i]!;
    }
    vectors.push(x);
  }
  return { values, vectors };
}

/** Cholesky factor L (lower, rows) of a symmetric positive definite matrix; throws otherwise. */
export function choleskyLower(matrix: DenseMatrix): number[][] {
  const n = matrix.length;
  const lower = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    let diagonal = matrix[j]![j]!;
    for (let k = 0; k < j; k++) diagonal -= lower[j]![k]! ** 2;
    if (!(diagonal > 0)) throw new Error(`choleskyLower: matrix not positive definite at row ${j}`);
    const pivot = Math.sqrt(diagonal);
    lower[j]![j] = pivot;
    for (let i = j + 1; i < n; i++) {
      let sum = matrix[i]![j]!;
      for (let k = 0; k < j; k++) sum -= lower[i]![k]! * lower[j]![k]!;
      lower[i]![j] = sum / pivot;
    }
  }
  return lower;
}

function forwardSubstituteColumns(lower: DenseMatrix, right: DenseMatrix): number[][] {
  const n = lower.length;
  const result = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let column = 0; column < n; column++) {
    for (let i = 0; i < n; i++) {
      let sum = right[i]![column]!;
      for (let k = 0; k < i; k++) sum -= lower[i]![k]! * result[k]![column]!;
      result[i]![column] = sum / lower[i]![i]!;
    }
  }
  return result;
}

function transpose(matrix: DenseMatrix): number[][] {
  return matrix.map((row, i) => row.map((_, j) => matrix[j]![i]!));
}

/**
 * Eigen-decomposition of a dense symmetric matrix: Householder reduction to tridiagonal form
 * with the transformations accumulated (tred2), then the implicit QL algorithm with Wilkinson
 * shifts on the tridiagonal matrix, rotating the accumulated vectors (tql2). Returns ascending
 * eigenvalues and the orthonormal eigenvectors as the columns of `vectors`.
 */
export function symmetricEigen(matrix: DenseMatrix): { values: number[]; vectors: number[][] } {
  const n = matrix.length;
  const v = matrix.map((row) => [...row]);
  const d = new Array<number>(n).fill(0);
  const e = new Array<number>(n).fill(0);
  householderTridiagonalise(v, d, e);
  implicitQl(v, d, e);
  const order = d.map((_, i) => i).sort((a, b) => d[a]! - d[b]!);
  return {
    values: order.map((i) => d[i]!),
    vectors: v.map((row) => order.map((i) => row[i]!)),
  };
}

/** tred2: on exit d is the diagonal, e the sub-diagonal (e[0] = 0), v the accumulated transform. */
function householderTridiagonalise(v: number[][], d: number[], e: number[]): void {
  const n = v.length;
  for (let j = 0; j < n; j++) d[j] = v[n - 1]![j]!;
  for (let i = n - 1; i > 0; i--) {
    let scale = 0;
    let h = 0;
    for (let k = 0; k < i; k++) scale += Math.abs(d[k]!);
    if (scale === 0) {
      e[i] = d[i - 1]!;
      for (let j = 0; j < i; j++) {
        d[j] = v[i - 1]![j]!;
        v[i]![j] = 0;
        v[j]![i] = 0;
      }
    } else {
      for (let k = 0; k < i; k++) {
        d[k] = d[k]! / scale;
        h += d[k]! * d[k]!;
      }
      let f = d[i - 1]!;
      let g = Math.sqrt(h);
      if (f > 0) g = -g;
      e[i] = scale * g;
      h -= f * g;
      d[i - 1] = f - g;
      for (let j = 0; j < i; j++) e[j] = 0;
      for (let j = 0; j < i; j++) {
        f = d[j]!;
        v[j]![i] = f;
        g = e[j]! + v[j]![j]! * f;
        for (let k = j + 1; k <= i - 1; k++) {
          g += v[k]![j]! * d[k]!;
          e[k] = e[k]! + v[k]![j]! * f;
        }
        e[j] = g;
      }
      f = 0;
      for (let j = 0; j < i; j++) {
        e[j] = e[j]! / h;
        f += e[j]! * d[j]!;
      }
      const hh = f / (h + h);
      for (let j = 0; j < i; j++) e[j] = e[j]! - hh * d[j]!;
      for (let j = 0; j < i; j++) {
        f = d[j]!;
        g = e[j]!;
        for (let k = j; k <= i - 1; k++) v[k]![j] = v[k]![j]! - (f * e[k]! + g * d[k]!);
        d[j] = v[i - 1]![j]!;
        v[i]![j] = 0;
      }
    }
    d[i] = h;
  }
  for (let i = 0; i < n - 1; i++) {
    v[n - 1]![i] = v[i]![i]!;
    v[i]![i] = 1;
    const h = d[i + 1]!;
    if (h !== 0) {
      for (let k = 0; k <= i; k++) d[k] = v[k]![i + 1]! / h;
      for (let j = 0; j <= i; j++) {
        let g = 0;
        for (let k = 0; k <= i; k++) g += v[k]![i + 1]! * v[k]![j]!;
        for (let k = 0; k <= i; k++) v[k]![j] = v[k]![j]! - g * d[k]!;
      }
    }
    for (let k = 0; k <= i; k++) v[k]![i + 1] = 0;
  }
  for (let j = 0; j < n; j++) {
    d[j] = v[n - 1]![j]!;
    v[n - 1]![j] = 0;
  }
  v[n - 1]![n - 1] = 1;
  e[0] = 0;
}

/** tql2: eigenvalues into d, eigenvectors rotated into the columns of v. */
function implicitQl(v: number[][], d: number[], e: number[]): void {
  const n = v.length;
  for (let i = 1; i < n; i++) e[i - 1] = e[i]!;
  e[n - 1] = 0;
  let f = 0;
  let tst1 = 0;
  const eps = Number.EPSILON;
  for (let l = 0; l < n; l++) {
    tst1 = Math.max(tst1, Math.abs(d[l]!) + Math.abs(e[l]!));
    let m = l;
    while (m < n - 1 && Math.abs(e[m]!) > eps * tst1) m++;
    if (m > l) {
      let iterations = 0;
      do {
        if (++iterations > 60) throw new Error('symmetricEigen: QL iteration did not converge');
        let g = d[l]!;
        let p = (d[l + 1]! - g) / (2 * e[l]!);
        let r = Math.hypot(p, 1);
        if (p < 0) r = -r;
        d[l] = e[l]! / (p + r);
        d[l + 1] = e[l]! * (p + r);
        const dl1 = d[l + 1]!;
        let h = g - d[l]!;
        for (let i = l + 2; i < n; i++) d[i] = d[i]! - h;
        f += h;
        p = d[m]!;
        let c = 1;
        let c2 = c;
        let c3 = c;
        const el1 = e[l + 1]!;
        let s = 0;
        let s2 = 0;
        for (let i = m - 1; i >= l; i--) {
          c3 = c2;
          c2 = c;
          s2 = s;
          g = c * e[i]!;
          h = c * p;
          r = Math.hypot(p, e[i]!);
          e[i + 1] = s * r;
          s = e[i]! / r;
          c = p / r;
          p = c * d[i]! - s * g;
          d[i + 1] = h + s * (c * g + s * d[i]!);
          for (let k = 0; k < n; k++) {
            const vk = v[k]!;
            h = vk[i + 1]!;
            vk[i + 1] = s * vk[i]! + c * h;
            vk[i] = c * vk[i]! - s * h;
          }
        }
        p = (-s * s2 * c3 * el1 * e[l]!) / dl1;
        e[l] = s * p;
        d[l] = c * p;
      } while (Math.abs(e[l]!) > eps * tst1);
    }
    d[l] = d[l]! + f;
    e[l] = 0;
  }
}
