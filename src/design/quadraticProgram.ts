/**
 * A dense strictly convex quadratic program: minimise ½ xᵀ H x + gᵀ x subject to A x ≥ b, with H
 * symmetric positive definite (n × n, row-major) and A (m × n, row-major). The designer always
 * builds programs for which x = 0 is feasible (a step that changes nothing).
 */
export interface QuadraticProgram {
  readonly size: number;
  readonly hessian: Float64Array;
  readonly gradient: Float64Array;
  readonly constraintCount: number;
  readonly constraints: Float64Array;
  readonly lowerBounds: Float64Array;
}

/** In-place Cholesky factor (lower, row-major) of an n × n SPD matrix; false if not positive definite. */
function cholesky(matrix: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let diagonal = matrix[j * n + j]!;
    for (let k = 0; k < j; k++) diagonal -= matrix[j * n + k]! ** 2;
    if (!(diagonal > 0)) return false;
    const root = Math.sqrt(diagonal);
    matrix[j * n + j] = root;
    for (let i = j + 1; i < n; i++) {
      let value = matrix[i * n + j]!;
      for (let k = 0; k < j; k++) value -= matrix[i * n + k]! * matrix[j * n + k]!;
      matrix[i * n + j] = value / root;
    }
    for (let k = j + 1; k < n; k++) matrix[j * n + k] = 0;
  }
  return true;
}

/** Solves L Lᵀ y = rhs in place for a Cholesky factor L (row-major lower). */
function choleskySolve(factor: Float64Array, n: number, rhs: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let value = rhs[i]!;
    for (let k = 0; k < i; k++) value -= factor[i * n + k]! * rhs[k]!;
    rhs[i] = value / factor[i * n + i]!;
  }
  for (let i = n - 1; i >= 0; i--) {
    let value = rhs[i]!;
    for (let k = i + 1; k < n; k++) value -= factor[k * n + i]! * rhs[k]!;
    rhs[i] = value / factor[i * n + i]!;
  }
}

/** Feasibility slack of the active-set method (constraint units). */
const feasibilityTolerance = 1e-12;

/**
 * Solves a QuadraticProgram by the primal active-set method (Nocedal & Wright, Numerical
 * Optimization, 2nd ed., Algorithm 16.3) in range-space form: each equality-constrained
 * subproblem min ½pᵀHp + (Hx + g)ᵀp, A_W p = 0 is solved through the Cholesky factors of H and of
 * A_W H⁻¹ A_Wᵀ. Starts from x = 0, which must be feasible; every iterate stays feasible, so if the
 * iteration cap (3·(n + m)) is reached the current, feasible point is returned. Returns null when
 * H is not positive definite or x = 0 is infeasible.
 */
export function solveQuadraticProgram(program: QuadraticProgram): Float64Array | null {
  const n = program.size;
  const m = program.constraintCount;
  const A = program.constraints;
  const b = program.lowerBounds;
  const factor = Float64Array.from(program.hessian);
  if (!cholesky(factor, n)) return null;
  for (let i = 0; i < m; i++) if (b[i]! > feasibilityTolerance * (1 + Math.abs(b[i]!))) return null;
  const x = new Float64Array(n);
  const active: number[] = [];
  const isActive = new Uint8Array(m);
  const c = new Float64Array(n);
  const p = new Float64Array(n);
  const row = (i: number): Float64Array => A.subarray(i * n, i * n + n);
  const limit = 3 * (n + m) + 10;
  for (let iteration = 0; iteration < limit; iteration++) {
    // c = H x + g
    for (let i = 0; i < n; i++) {
      let value = program.gradient[i]!;
      for (let j = 0; j < n; j++) value += program.hessian[i * n + j]! * x[j]!;
      c[i] = value;
    }
    // Multipliers: (A_W H⁻¹ A_Wᵀ) λ = A_W H⁻¹ c; step p = −H⁻¹(c − A_Wᵀ λ).
    const w = active.length;
    const hInverseC = Float64Array.from(c);
    choleskySolve(factor, n, hInverseC);
    const hInverseA: Float64Array[] = active.map((k) => {
      const column = Float64Array.from(row(k));
      choleskySolve(factor, n, column);
      return column;
    });
    const lambda = new Float64Array(w);
    if (w > 0) {
      const schur = new Float64Array(w * w);
      for (let r = 0; r < w; r++) {
        const ar = row(active[r]!);
        let rhs = 0;
        for (let i = 0; i < n; i++) rhs += ar[i]! * hInverseC[i]!;
        lambda[r] = rhs;
        for (let s = 0; s < w; s++) {
          const column = hInverseA[s]!;
          let value = 0;
          for (let i = 0; i < n; i++) value += ar[i]! * column[i]!;
          schur[r * w + s] = value;
        }
      }
      if (!cholesky(schur, w)) {
        // Dependent active rows (cannot arise in exact arithmetic): drop the newest and go on.
        isActive[active.pop()!] = 0;
        continue;
      }
      choleskySolve(schur, w, lambda);
    }
    let stepSize = 0;
    for (let i = 0; i < n; i++) {
      let value = -hInverseC[i]!;
      for (let r = 0; r < w; r++) value += hInverseA[r]![i]! * lambda[r]!;
      p[i] = value;
      stepSize = Math.max(stepSize, Math.abs(value));
    }
    let scale = 0;
    for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(x[i]!));
    if (stepSize <= 1e-13 * (1 + scale)) {
      // Stationary on the working set: optimal if every multiplier is ≥ 0, else release the most negative.
      let most = -1;
      let value = -1e-12;
      for (let r = 0; r < w; r++) {
        if (lambda[r]! < value) {
          value = lambda[r]!;
          most = r;
        }
      }
      if (most < 0) return x;
      isActive[active[most]!] = 0;
      active.splice(most, 1);
      continue;
    }
    // Longest feasible step along p, up to 1; the first blocking constraint joins the working set.
    let alpha = 1;
    let blocking = -1;
    for (let k = 0; k < m; k++) {
      if (isActive[k]) continue;
      const ak = row(k);
      let slope = 0;
      let value = 0;
      for (let i = 0; i < n; i++) {
        slope += ak[i]! * p[i]!;
        value += ak[i]! * x[i]!;
      }
      if (slope >= -1e-15) continue;
      const reach = Math.max(0, (b[k]! - value) / slope);
      if (reach < alpha) {
        alpha = reach;
        blocking = k;
      }
    }
    for (let i = 0; i < n; i++) x[i]! += alpha * p[i]!;
    if (blocking >= 0) {
      isActive[blocking] = 1;
      active.push(blocking);
    }
  }
  return x;
}
