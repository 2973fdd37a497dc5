import { denseCholeskyInPlace, denseCholeskySolveInPlace } from '../eigen/denseCholesky.ts';
import type { QuadraticProgram } from './quadraticProgram.ts';

/** What the interior-point iteration returns (see solveByInteriorPoint). */
export interface InteriorPointSolution {
  readonly x: Float64Array;
  readonly multipliers: Float64Array;
  /** Constraints with slack below 1e-7 of their scale and a positive multiplier. */
  readonly active: number[];
  readonly converged: boolean;
  readonly iterations: number;
}

const maxIterations = 80;
/** Relative dual residual and complementarity at which the iteration stops. */
const tolerance = 1e-10;
/** Absolute primal residual at which the iteration stops (constraint units). */
const primalTolerance = 1e-9;

/** Σ_j row_j v_j over one row of a row-major matrix. */
function rowDot(matrix: Float64Array, row: number, n: number, v: Float64Array): number {
  let sum = 0;
  const start = row * n;
  for (let j = 0; j < n; j++) sum += matrix[start + j]! * v[j]!;
  return sum;
}

/** Largest α ≤ 1 with values + α·deltas ≥ 0 (fraction-to-the-boundary). */
function stepTo(values: Float64Array, deltas: Float64Array): number {
  let alpha = 1;
  for (let i = 0; i < values.length; i++) if (deltas[i]! < 0) alpha = Math.min(alpha, -values[i]! / deltas[i]!);
  return alpha;
}

/**
 * Solves a QuadraticProgram by a primal–dual interior-point method with Mehrotra's
 * predictor–corrector (Nocedal & Wright, Numerical Optimization, 2nd ed., §16.6, algorithm 16.4):
 * slacks s = Ax − b ≥ 0, the normal-equations reduction (H + Aᵀ S⁻¹Λ A) Δx = … factored once per
 * iteration by dense Cholesky and used for both the predictor and the corrector. Needs no
 * feasible start and is indifferent to duplicated or nearly dependent constraints (which make
 * active-set methods stall). Zero entries of A are skipped when forming the normal matrix, so
 * sparse constraint rows (a slope between two stations) cost little. Returns converged = false
 * when H is not positive definite or the program is infeasible.
 */
export function solveByInteriorPoint(program: QuadraticProgram): InteriorPointSolution {
  const n = program.size;
  const m = program.constraintCount;
  const H = program.hessian;
  const A = program.constraints;
  const b = program.lowerBounds;
  const g = program.gradient;
  const x = new Float64Array(n);
  const s = new Float64Array(m);
  const lambda = new Float64Array(m).fill(1);
  for (let i = 0; i < m; i++) s[i] = Math.max(1, rowDot(A, i, n, x) - b[i]!);
  let scale = 1;
  for (let j = 0; j < n; j++) scale = Math.max(scale, Math.abs(g[j]!));
  const rd = new Float64Array(n);
  const rp = new Float64Array(m);
  const normal = new Float64Array(n * n);
  const w = new Float64Array(m);
  const rhs = new Float64Array(n);
  const dx = new Float64Array(n);
  const ds = new Float64Array(m);
  const dl = new Float64Array(m);
  const affineDs = new Float64Array(m);
  const affineDl = new Float64Array(m);
  const rc = new Float64Array(m);
  const fail = (iterations: number): InteriorPointSolution => ({ x, multipliers: lambda, active: [], converged: false, iterations });

  /** Factors H + Aᵀ W A into `normal` (W = Λ S⁻¹); false if not positive definite. */
  const factorNormal = (): boolean => {
    normal.set(H);
    for (let i = 0; i < m; i++) {
      w[i] = lambda[i]! / s[i]!;
      const weight = w[i]!;
      const start = i * n;
      for (let j = 0; j < n; j++) {
        const aij = A[start + j]!;
        if (aij === 0) continue;
        const scaled = weight * aij;
        for (let k = 0; k < n; k++) {
          const aik = A[start + k]!;
          if (aik !== 0) normal[j * n + k]! += scaled * aik;
        }
      }
    }
    return denseCholeskyInPlace(normal, n);
  };
  /** Direction for the complementarity residual rc (into dx, ds, dl), with the factored normal matrix. */
  const direction = (): void => {
    // (H + Aᵀ W A) dx = −rd − Aᵀ(W rp + S⁻¹ rc)
    for (let j = 0; j < n; j++) rhs[j] = -rd[j]!;
    for (let i = 0; i < m; i++) {
      const extra = w[i]! * rp[i]! + rc[i]! / s[i]!;
      if (extra === 0) continue;
      const start = i * n;
      for (let j = 0; j < n; j++) rhs[j]! -= A[start + j]! * extra;
    }
    dx.set(rhs);
    denseCholeskySolveInPlace(normal, n, dx);
    for (let i = 0; i < m; i++) {
      const adx = rowDot(A, i, n, dx);
      dl[i] = -w[i]! * (rp[i]! + adx) - rc[i]! / s[i]!;
      ds[i] = (-rc[i]! - s[i]! * dl[i]!) / lambda[i]!;
    }
  };

  // H itself must be positive definite (the normal matrix adds only positive semidefinite terms).
  normal.set(H);
  if (!denseCholeskyInPlace(normal, n)) return fail(0);
  let iterations = 0;
  let converged = false;
  for (; iterations < maxIterations; iterations++) {
    // Residuals: rd = Hx + g − Aᵀλ, rp = Ax − s − b, μ = sᵀλ / m.
    for (let j = 0; j < n; j++) rd[j] = rowDot(H, j, n, x) + g[j]!;
    for (let i = 0; i < m; i++) {
      const start = i * n;
      const li = lambda[i]!;
      for (let j = 0; j < n; j++) rd[j]! -= A[start + j]! * li;
      rp[i] = rowDot(A, i, n, x) - s[i]! - b[i]!;
    }
    let mu = 0;
    for (let i = 0; i < m; i++) mu += s[i]! * lambda[i]!;
    mu = m > 0 ? mu / m : 0;
    let dual = 0;
    for (let j = 0; j < n; j++) dual = Math.max(dual, Math.abs(rd[j]!));
    let primal = 0;
    for (let i = 0; i < m; i++) primal = Math.max(primal, Math.abs(rp[i]!));
    if (dual <= tolerance * scale && primal <= primalTolerance && mu <= tolerance * scale) {
      converged = true;
      break;
    }
    if (!factorNormal()) return fail(iterations);
    if (m === 0) {
      rc.fill(0);
      direction();
      for (let j = 0; j < n; j++) x[j]! += dx[j]!;
      continue;
    }
    // Predictor (affine scaling): rc = SΛe.
    for (let i = 0; i < m; i++) rc[i] = s[i]! * lambda[i]!;
    direction();
    affineDs.set(ds);
    affineDl.set(dl);
    const alphaAffine = Math.min(stepTo(s, affineDs), stepTo(lambda, affineDl));
    let muAffine = 0;
    for (let i = 0; i < m; i++) muAffine += (s[i]! + alphaAffine * affineDs[i]!) * (lambda[i]! + alphaAffine * affineDl[i]!);
    muAffine /= m;
    const sigma = (muAffine / mu) ** 3;
    // Corrector: rc = SΛe + ΔS_aff ΔΛ_aff e − σμe.
    for (let i = 0; i < m; i++) rc[i] = s[i]! * lambda[i]! + affineDs[i]! * affineDl[i]! - sigma * mu;
    direction();
    const alpha = Math.min(1, 0.995 * Math.min(stepTo(s, ds), stepTo(lambda, dl)));
    for (let j = 0; j < n; j++) x[j]! += alpha * dx[j]!;
    for (let i = 0; i < m; i++) {
      s[i] = Math.max(1e-300, s[i]! + alpha * ds[i]!);
      lambda[i] = Math.max(1e-300, lambda[i]! + alpha * dl[i]!);
    }
  }
  const active: number[] = [];
  for (let i = 0; i < m; i++) {
    const rowScale = Math.max(1, Math.abs(b[i]!));
    if (rowDot(A, i, n, x) - b[i]! <= 1e-7 * rowScale && lambda[i]! > 1e-9 * scale) active.push(i);
  }
  return { x, multipliers: lambda, active, converged, iterations };
}
