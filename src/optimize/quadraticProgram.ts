import { denseCholeskyInPlace as cholesky, denseCholeskySolveInPlace } from '../eigen/denseCholesky.ts';
import { solveByInteriorPoint } from './interiorPoint.ts';

/**
 * A small dense strictly convex quadratic program: minimise ½ xᵀ H x + gᵀ x subject to A x ≥ b,
 * with H symmetric positive definite (n × n, row-major) and A (m × n, row-major). Used by the
 * undercut designer (shape-parameter steps, where x = 0, a step that changes nothing, is always
 * feasible) and the cut planner (region depths, started from the current cut).
 */
export interface QuadraticProgram {
  readonly size: number;
  readonly hessian: Float64Array;
  readonly gradient: Float64Array;
  readonly constraintCount: number;
  readonly constraints: Float64Array;
  readonly lowerBounds: Float64Array;
  /** A feasible starting point (default x = 0). */
  readonly start?: Float64Array;
}

/** The solution of a QuadraticProgram, its multipliers and which constraints hold at it. */
export interface QuadraticProgramSolution {
  readonly x: Float64Array;
  /** Lagrange multiplier of each constraint (≥ 0; zero off the final working set). */
  readonly multipliers: Float64Array;
  /** Constraints that bind at x: in the final working set with a positive multiplier. */
  readonly active: number[];
  /**
   * `optimal`; `iteration-limit` (x is the last iterate, feasible but maybe not optimal);
   * `not-positive-definite` or `infeasible` (x is the start, nothing usable was found).
   */
  readonly status: 'optimal' | 'iteration-limit' | 'not-positive-definite' | 'infeasible';
  /** status === 'optimal'. */
  readonly converged: boolean;
  readonly iterations: number;
}

/** Feasibility slack of the active-set method (constraint units). */
const feasibilityTolerance = 1e-12;

/**
 * Solves a QuadraticProgram by the primal active-set method (Nocedal & Wright, Numerical
 * Optimization, 2nd ed., Algorithm 16.3) in range-space form: each equality-constrained
 * subproblem min ½pᵀHp + (Hx + g)ᵀp, A_W p = 0 is solved through the Cholesky factors of H and of
 * A_W H⁻¹ A_Wᵀ. Starts from `start` (default x = 0), which must be feasible; every iterate stays
 * feasible, so if the iteration cap (3·(n + m)) is reached the current, feasible point is returned
 * (converged = false). Exact at the solution (a vertex of the working set, no interior-point
 * slack), which keeps the designer's Gauss–Newton steps repeatable. Dependent active rows (a
 * duplicated constraint) make the working-set system singular: the newest row is dropped.
 */
function solveByActiveSet(program: QuadraticProgram): QuadraticProgramSolution {
  const n = program.size;
  const m = program.constraintCount;
  const A = program.constraints;
  const b = program.lowerBounds;
  const x = program.start ? Float64Array.from(program.start) : new Float64Array(n);
  const active: number[] = [];
  const result = (status: QuadraticProgramSolution['status'], iterations: number, multipliers?: Float64Array): QuadraticProgramSolution => {
    const all = new Float64Array(m);
    if (multipliers) active.forEach((k, r) => (all[k] = Math.max(0, multipliers[r]!)));
    const converged = status === 'optimal';
    let largest = 0;
    for (const value of all) largest = Math.max(largest, value);
    const binding = converged ? active.filter((k) => all[k]! > 1e-9 * Math.max(1, largest)) : [];
    return { x, multipliers: all, active: binding, status, converged, iterations };
  };
  const factor = Float64Array.from(program.hessian);
  if (!cholesky(factor, n)) return result('not-positive-definite', 0);
  for (let i = 0; i < m; i++) {
    let value = 0;
    for (let j = 0; j < n; j++) value += A[i * n + j]! * x[j]!;
    if (b[i]! - value > feasibilityTolerance * (1 + Math.abs(b[i]!))) return result('infeasible', 0);
  }
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
    denseCholeskySolveInPlace(factor, n, hInverseC);
    const hInverseA: Float64Array[] = active.map((k) => {
      const column = Float64Array.from(row(k));
      denseCholeskySolveInPlace(factor, n, column);
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
      denseCholeskySolveInPlace(schur, w, lambda);
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
      if (most < 0) return result('optimal', iteration, lambda);
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
  return result('iteration-limit', limit);
}

/**
 * Solves a QuadraticProgram: the primal active-set method first (exact vertex solutions, so the
 * designer's Gauss–Newton steps are repeatable), from `start` (default x = 0). When the start is
 * infeasible, or the working set cycles on a degenerate vertex (many nearly duplicated limit rows,
 * as the cut planner builds) until the iteration cap, the primal–dual interior-point method
 * (solveByInteriorPoint), which needs no feasible start and is indifferent to dependent rows,
 * solves the same program; its answer is taken when it converges (status `optimal`).
 */
export function solveQuadraticProgram(program: QuadraticProgram): QuadraticProgramSolution {
  const primal = solveByActiveSet(program);
  if (primal.status !== 'infeasible' && primal.status !== 'iteration-limit') return primal;
  const interior = solveByInteriorPoint(program);
  if (!interior.converged) return primal;
  return { x: interior.x, multipliers: interior.multipliers, active: interior.active, status: 'optimal', converged: true, iterations: primal.iterations + interior.iterations };
}
