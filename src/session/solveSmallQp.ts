import { choleskyFactor, choleskySolve } from './denseLinearAlgebra.ts';

/** A small dense convex quadratic programme: minimise ½xᵀHx − dᵀx subject to rows·x ≥ bounds. */
export interface SmallQp {
  /** Symmetric positive-definite n×n matrix H. */
  readonly hessian: readonly (readonly number[])[];
  /** The linear term d (the objective is ½xᵀHx − dᵀx). */
  readonly linear: readonly number[];
  /** Constraint rows a_i (each of length n): a_i·x ≥ b_i. */
  readonly rows: readonly (readonly number[])[];
  readonly bounds: readonly number[];
}

/** The solution and which constraints are active at it. */
export interface SmallQpSolution {
  readonly x: number[];
  /** Lagrange multiplier of each constraint (≥ 0; zero where the constraint is slack). */
  readonly multipliers: number[];
  /** Indices of constraints holding with equality (slack below 1e-7 of their scale, multiplier positive). */
  readonly active: number[];
  readonly converged: boolean;
  readonly iterations: number;
}

const maxIterations = 80;
const tolerance = 1e-10;

/**
 * Solves a small convex QP by a primal–dual interior-point method with Mehrotra's
 * predictor–corrector (Nocedal & Wright, Numerical Optimization, 2nd ed., §16.6, algorithm 16.4),
 * slacks s = Ax − b ≥ 0 and the normal-equations reduction (H + Aᵀ S⁻¹Λ A)Δx = … solved by
 * Cholesky. Needs no feasible start and is indifferent to duplicated or nearly dependent
 * constraints (which make active-set methods fail). Dense; meant for a handful of unknowns and a
 * few hundred constraints.
 */
export function solveSmallQp(problem: SmallQp): SmallQpSolution {
  const n = problem.linear.length;
  const m = problem.rows.length;
  const H = problem.hessian;
  const A = problem.rows;
  const b = problem.bounds;
  const c = problem.linear.map((v) => -v);
  const x = new Array<number>(n).fill(0);
  const s = new Array<number>(m);
  const lambda = new Array<number>(m).fill(1);
  const dot = (row: readonly number[], v: readonly number[]): number => row.reduce((sum, a, i) => sum + a * v[i]!, 0);
  for (let i = 0; i < m; i++) s[i] = Math.max(1, dot(A[i]!, x) - b[i]!);
  let scale = 1;
  for (const v of c) scale = Math.max(scale, Math.abs(v));
  let iterations = 0;
  let converged = false;
  const solveDirection = (rd: number[], rp: number[], rc: number[]): { dx: number[]; ds: number[]; dl: number[] } => {
    // (H + Aᵀ W A) dx = −rd − Aᵀ(W rp + S⁻¹ rc), W = Λ S⁻¹.
    const matrix = H.map((row) => [...row]);
    const rhs = rd.map((v) => -v);
    for (let i = 0; i < m; i++) {
      const w = lambda[i]! / s[i]!;
      const row = A[i]!;
      const extra = w * rp[i]! + rc[i]! / s[i]!;
      for (let j = 0; j < n; j++) {
        rhs[j]! -= row[j]! * extra;
        if (row[j] === 0) continue;
        for (let k = 0; k < n; k++) matrix[j]![k]! += w * row[j]! * row[k]!;
      }
    }
    const dx = choleskySolve(choleskyFactor(matrix), rhs);
    const dl = new Array<number>(m);
    const ds = new Array<number>(m);
    for (let i = 0; i < m; i++) {
      const adx = dot(A[i]!, dx);
      dl[i] = -(lambda[i]! / s[i]!) * (rp[i]! + adx) - rc[i]! / s[i]!;
      ds[i] = (-rc[i]! - s[i]! * dl[i]!) / lambda[i]!;
    }
    return { dx, ds, dl };
  };
  const stepTo = (values: number[], deltas: number[]): number => {
    let alpha = 1;
    for (let i = 0; i < values.length; i++) if (deltas[i]! < 0) alpha = Math.min(alpha, -values[i]! / deltas[i]!);
    return alpha;
  };
  for (; iterations < maxIterations; iterations++) {
    const rd = H.map((row, j) => dot(row, x) + c[j]! - A.reduce((sum, a, i) => sum + a[j]! * lambda[i]!, 0));
    const rp = A.map((row, i) => dot(row, x) - s[i]! - b[i]!);
    const mu = m > 0 ? s.reduce((sum, v, i) => sum + v * lambda[i]!, 0) / m : 0;
    const dual = Math.max(...rd.map(Math.abs), 0);
    const primal = Math.max(...rp.map(Math.abs), 0);
    if (dual <= tolerance * scale && primal <= 1e-9 && mu <= tolerance * scale) {
      converged = true;
      break;
    }
    if (m === 0) {
      const dx = choleskySolve(choleskyFactor(H), rd.map((v) => -v));
      for (let j = 0; j < n; j++) x[j]! += dx[j]!;
      continue;
    }
    const affine = solveDirection(rd, rp, s.map((v, i) => v * lambda[i]!));
    const alphaAffine = Math.min(stepTo(s, affine.ds), stepTo(lambda, affine.dl));
    const muAffine = s.reduce((sum, v, i) => sum + (v + alphaAffine * affine.ds[i]!) * (lambda[i]! + alphaAffine * affine.dl[i]!), 0) / m;
    const sigma = (muAffine / mu) ** 3;
    const corrected = solveDirection(rd, rp, s.map((v, i) => v * lambda[i]! + affine.ds[i]! * affine.dl[i]! - sigma * mu));
    const alpha = Math.min(1, 0.995 * Math.min(stepTo(s, corrected.ds), stepTo(lambda, corrected.dl)));
    for (let j = 0; j < n; j++) x[j]! += alpha * corrected.dx[j]!;
    for (let i = 0; i < m; i++) {
      s[i] = Math.max(1e-300, s[i]! + alpha * corrected.ds[i]!);
      lambda[i] = Math.max(1e-300, lambda[i]! + alpha * corrected.dl[i]!);
    }
  }
  const active: number[] = [];
  for (let i = 0; i < m; i++) {
    const rowScale = Math.max(1, Math.abs(b[i]!));
    if (dot(A[i]!, x) - b[i]! <= 1e-7 * rowScale && lambda[i]! > 1e-9 * scale) active.push(i);
  }
  return { x, multipliers: lambda, active, converged, iterations };
}
