import { evaluateShape, type DesignProblem, type ShapeEvaluation } from './evaluateShape.ts';
import { solveQuadraticProgram } from '../optimize/quadraticProgram.ts';
import type { ShapeFamily } from './ShapeFamily.ts';
import { surfaceConstraints, worstViolation, type SurfaceConstraints } from './surfaceConstraints.ts';

/** Counts solver calls across a design and carries the cancellation check. */
export interface SolveBudget {
  solves: number;
  readonly maxSolves: number;
  /** True once the caller asked to stop (progress callback returned false, or the signal aborted). */
  cancelled: () => boolean;
}

/** Options of fitShape. */
export interface FitOptions {
  readonly maxIterations: number;
  /** Stop as soon as every |cents_k| ≤ goal·tolerance_k. */
  readonly goal: number;
  /** Smoothness penalty for the free form: weight·(second differences of q − base). */
  readonly smoothness?: { readonly weight: number; readonly base: Float64Array };
  readonly budget: SolveBudget;
}

/** A shape with its constraints, as fitShape hands it back. */
export interface FittedShape {
  readonly evaluation: ShapeEvaluation;
  readonly constraints: SurfaceConstraints;
  /** ½ Σ (cents_k / tolerance_k)² (the cents part of the objective). */
  readonly cost: number;
  readonly iterations: number;
  /** Every partial within goal·tolerance. */
  readonly reachedGoal: boolean;
}

/**
 * A trial step may leave a slope or radius limit broken by up to this much (m, 5 µm) — the limits
 * are linearised, so a curved boundary is overshot slightly — the final projection removes it.
 */
const acceptSlack = 5e-6;
/** Linearised limits are asked to hold with this margin (m, 10 µm) so iterates stay just inside. */
const constraintMargin = 1e-5;

/** ½ Σ (cents_k / tolerance_k)². */
export function centsCost(problem: DesignProblem, evaluation: ShapeEvaluation): number {
  let cost = 0;
  evaluation.cents.forEach((c, k) => (cost += 0.5 * (c / problem.target.toleranceCents[k]!) ** 2));
  return cost;
}

function withinGoal(problem: DesignProblem, evaluation: ShapeEvaluation, goal: number): boolean {
  return evaluation.cents.every((c, k) => Math.abs(c) <= goal * problem.target.toleranceCents[k]!);
}

/** Residuals and Jacobian (row-major) of the least-squares objective. */
function residuals(problem: DesignProblem, evaluation: ShapeEvaluation, m: number, options: FitOptions): { r: Float64Array; J: Float64Array } {
  const partials = evaluation.cents.length;
  const smooth = options.smoothness;
  const smoothRows = smooth ? m - 1 : 0;
  const r = new Float64Array(partials + smoothRows);
  const J = new Float64Array((partials + smoothRows) * m);
  for (let k = 0; k < partials; k++) {
    const tolerance = problem.target.toleranceCents[k]!;
    r[k] = evaluation.cents[k]! / tolerance;
    for (let p = 0; p < m; p++) J[k * m + p] = evaluation.centsJacobian[k * m + p]! / tolerance;
  }
  if (smooth) {
    // Second differences of the change, mirrored at the centre (q₋₁ = q₁) and 0 beyond the edge.
    const change = (k: number): number => (k < 0 ? change(-k) : k >= m ? 0 : evaluation.q[k]! - smooth.base[k]!);
    for (let row = 0; row < smoothRows; row++) {
      const k = row;
      const i = partials + row;
      r[i] = smooth.weight * (change(k - 1) - 2 * change(k) + change(k + 1));
      const add = (index: number, value: number): void => {
        const mirrored = index < 0 ? -index : index;
        if (mirrored < m) J[i * m + mirrored]! += smooth.weight * value;
      };
      add(k - 1, 1);
      add(k, -2);
      add(k + 1, 1);
    }
  }
  return { r, J };
}

function halfSquare(r: Float64Array): number {
  let s = 0;
  for (const v of r) s += 0.5 * v * v;
  return s;
}

/**
 * Fits a family's parameters to the targets by Levenberg–Marquardt on the cents errors
 * (scaled by each partial's tolerance), each step a quadratic program (Goldfarb–Idnani) with the
 * bounds 0 ≤ q ≤ 1 and the slope and tool-radius limits linearised at the current shape; a
 * violated limit may not get worse. Damping by Nielsen's gain-ratio rule (Madsen, Nielsen &
 * Tingleff, "Methods for non-linear least squares problems", DTU 2004, §3.2). Exact Jacobians from
 * the solver's eigenvalue sensitivities. Stops at the goal, on convergence, or on the budget.
 */
export function fitShape(problem: DesignProblem, family: ShapeFamily, start: ArrayLike<number>, options: FitOptions): FittedShape {
  const m = family.parameterCount(problem.space);
  const budget = options.budget;
  const evaluate = (q: ArrayLike<number>): { evaluation: ShapeEvaluation; constraints: SurfaceConstraints } => {
    budget.solves++;
    const evaluation = evaluateShape(problem, family, q);
    return { evaluation, constraints: surfaceConstraints(problem, evaluation.depth, evaluation.depthJacobian, m) };
  };
  let current = evaluate(start);
  let least = residuals(problem, current.evaluation, m, options);
  let mu = -1;
  let nu = 2;
  let iterations = 0;
  for (; iterations < options.maxIterations; iterations++) {
    if (withinGoal(problem, current.evaluation, options.goal) && !options.smoothness) break;
    if (budget.solves >= budget.maxSolves || budget.cancelled()) break;
    const { r, J } = least;
    const rows = r.length;
    const normal = new Float64Array(m * m);
    const gradient = new Float64Array(m);
    for (let i = 0; i < rows; i++) {
      for (let a = 0; a < m; a++) {
        const Ja = J[i * m + a]!;
        if (Ja === 0) continue;
        gradient[a]! += Ja * r[i]!;
        for (let b = 0; b < m; b++) normal[a * m + b]! += Ja * J[i * m + b]!;
      }
    }
    let largestDiagonal = 0;
    for (let a = 0; a < m; a++) largestDiagonal = Math.max(largestDiagonal, normal[a * m + a]!);
    if (mu < 0) mu = 1e-3;
    const step = constrainedStep(current, normal, gradient, m, mu, largestDiagonal);
    if (!step) {
      mu *= nu;
      nu *= 2;
      continue;
    }
    let stepNorm = 0;
    let predicted = 0;
    for (let a = 0; a < m; a++) {
      stepNorm = Math.max(stepNorm, Math.abs(step[a]!));
      let row = 0;
      for (let b = 0; b < m; b++) row += normal[a * m + b]! * step[b]!;
      predicted -= gradient[a]! * step[a]! + 0.5 * step[a]! * row;
    }
    if (stepNorm < 1e-7) break;
    const q = Float64Array.from(current.evaluation.q, (v, a) => Math.min(1, Math.max(0, v + step[a]!)));
    const trial = evaluate(q);
    const trialLeast = residuals(problem, trial.evaluation, m, options);
    const actual = halfSquare(least.r) - halfSquare(trialLeast.r);
    const violationBefore = worstViolation(current.constraints);
    const acceptable = actual > 0 && worstViolation(trial.constraints) <= Math.max(violationBefore, acceptSlack);
    if (acceptable) {
      const gain = predicted > 0 ? actual / predicted : 0;
      current = trial;
      least = trialLeast;
      mu *= Math.max(1 / 3, 1 - (2 * gain - 1) ** 3);
      nu = 2;
      if (options.smoothness && actual < 1e-6 * (1 + halfSquare(least.r)) && withinGoal(problem, current.evaluation, options.goal)) break;
    } else {
      mu *= nu;
      nu *= 2;
      if (mu > 1e10) break;
    }
  }
  return {
    evaluation: current.evaluation,
    constraints: current.constraints,
    cost: centsCost(problem, current.evaluation),
    iterations,
    reachedGoal: withinGoal(problem, current.evaluation, options.goal),
  };
}

/** One damped, constrained Gauss–Newton step: a QP in the step Δ. */
function constrainedStep(
  current: { evaluation: ShapeEvaluation; constraints: SurfaceConstraints },
  normal: Float64Array,
  gradient: Float64Array,
  m: number,
  mu: number,
  largestDiagonal: number,
): Float64Array | null {
  const floor = 1e-9 + 1e-6 * largestDiagonal;
  const hessian = Float64Array.from(normal);
  for (let a = 0; a < m; a++) hessian[a * m + a]! += mu * (normal[a * m + a]! + floor) + 1e-12 * (1 + largestDiagonal);
  const q = current.evaluation.q;
  const surface = current.constraints;
  const count = 2 * m + surface.count;
  const constraints = new Float64Array(count * m);
  const lowerBounds = new Float64Array(count);
  for (let a = 0; a < m; a++) {
    constraints[2 * a * m + a] = 1;
    lowerBounds[2 * a] = -q[a]!;
    constraints[(2 * a + 1) * m + a] = -1;
    lowerBounds[2 * a + 1] = q[a]! - 1;
  }
  // Surface rows in mm so they are of the order of the bounds: g + GΔ ≥ min(margin, g), a limit
  // already broken may not get worse.
  for (let c = 0; c < surface.count; c++) {
    const row = 2 * m + c;
    const g = surface.values[c]!;
    for (let a = 0; a < m; a++) constraints[row * m + a] = surface.jacobian[c * m + a]! * 1e3;
    lowerBounds[row] = (Math.min(constraintMargin, g) - g) * 1e3;
  }
  const solution = solveQuadraticProgram({ size: m, hessian, gradient, constraintCount: count, constraints, lowerBounds });
  return solution.status === 'optimal' || solution.status === 'iteration-limit' ? solution.x : null;
}
