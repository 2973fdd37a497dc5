import { evaluateShape, type DesignProblem, type ShapeEvaluation } from './evaluateShape.ts';
import { centsCost, type FittedShape, type SolveBudget } from './fitShape.ts';
import { solveQuadraticProgram } from '../optimize/quadraticProgram.ts';
import { surfaceConstraints, worstViolation } from './surfaceConstraints.ts';

/** Fraction of each tolerance the linearised steps aim inside, and the fraction a trial may reach. */
const stepBand = 0.35;
const acceptBand = 0.5;
/**
 * The fundamental may not be planned flat by more than this fraction of its tolerance: wood cannot
 * be put back, so a plan that saves material leans sharp (common practice: tune sharp, creep down).
 */
const flatBand = 0.1;
const acceptSlack = 5e-6;
const constraintMargin = 1e-5;

/**
 * Among shapes of one family that keep every partial within half its tolerance (the fundamental no
 * more than a tenth of its tolerance flat), moves towards the
 * one that removes the least material: sequential quadratic programming on the removed volume,
 * min ∇V·Δ + ½μ‖Δ‖² subject to the cents linearised within ±0.35·tolerance, the bounds and the
 * linearised slope and radius limits; μ grows when a trial leaves the band or removes more.
 * Only useful when the family has more parameters than there are tuned partials (1:3, fundamental
 * only); returns the input unchanged otherwise or when nothing improves.
 */
export function reduceRemoval(problem: DesignProblem, fit: FittedShape, budget: SolveBudget, maxIterations = 10): FittedShape {
  const family = fit.evaluation.family;
  const m = family.parameterCount(problem.space);
  const partials = problem.target.hz.length;
  if (m <= partials) return fit;
  let current: ShapeEvaluation = fit.evaluation;
  let constraints = fit.constraints;
  let mu = 1;
  let iterations = 0;
  const volumeScale = Math.max(current.volume, 1e-9);
  for (; iterations < maxIterations; iterations++) {
    if (budget.solves >= budget.maxSolves || budget.cancelled() || mu > 1e6) break;
    const rows = 2 * m + 2 * partials + constraints.count;
    const A = new Float64Array(rows * m);
    const b = new Float64Array(rows);
    let row = 0;
    for (let a = 0; a < m; a++) {
      A[row * m + a] = 1;
      b[row++] = -current.q[a]!;
      A[row * m + a] = -1;
      b[row++] = current.q[a]! - 1;
    }
    // −β ≤ r + jΔ ≤ β with r = cents/tolerance (the fundamental's lower edge −flatBand), relaxed so
    // Δ = 0 is always allowed.
    for (let k = 0; k < partials; k++) {
      const tolerance = problem.target.toleranceCents[k]!;
      const r = current.cents[k]! / tolerance;
      const lower = k === 0 ? flatBand : stepBand;
      for (let a = 0; a < m; a++) A[row * m + a] = current.centsJacobian[k * m + a]! / tolerance;
      b[row++] = Math.min(-lower - r, 0);
      for (let a = 0; a < m; a++) A[row * m + a] = -current.centsJacobian[k * m + a]! / tolerance;
      b[row++] = Math.min(r - stepBand, 0);
    }
    for (let c = 0; c < constraints.count; c++) {
      const g = constraints.values[c]!;
      for (let a = 0; a < m; a++) A[row * m + a] = constraints.jacobian[c * m + a]! * 1e3;
      b[row++] = (Math.min(constraintMargin, g) - g) * 1e3;
    }
    const hessian = new Float64Array(m * m);
    for (let a = 0; a < m; a++) hessian[a * m + a] = mu;
    const gradient = Float64Array.from(current.volumeGradient, (v) => v / volumeScale);
    const solution = solveQuadraticProgram({ size: m, hessian, gradient, constraintCount: rows, constraints: A, lowerBounds: b });
    const step = solution.status === 'optimal' || solution.status === 'iteration-limit' ? solution.x : null;
    if (!step) {
      mu *= 4;
      continue;
    }
    let largest = 0;
    for (const v of step) largest = Math.max(largest, Math.abs(v));
    if (largest < 1e-6) break;
    const q = Float64Array.from(current.q, (v, a) => Math.min(1, Math.max(0, v + step[a]!)));
    budget.solves++;
    const trial = evaluateShape(problem, family, q);
    const trialConstraints = surfaceConstraints(problem, trial.depth, trial.depthJacobian, m);
    const inBand = trial.cents.every((c, k) => c <= acceptBand * problem.target.toleranceCents[k]! && c >= -(k === 0 ? 1.5 * flatBand : acceptBand) * problem.target.toleranceCents[k]!);
    const better = trial.volume < current.volume * (1 - 1e-4);
    if (inBand && better && worstViolation(trialConstraints) <= Math.max(worstViolation(constraints), acceptSlack)) {
      current = trial;
      constraints = trialConstraints;
      mu = Math.max(mu / 2, 1e-3);
    } else mu *= 4;
  }
  if (current === fit.evaluation) return fit;
  return { evaluation: current, constraints, cost: centsCost(problem, current), iterations: fit.iterations + iterations, reachedGoal: fit.reachedGoal };
}
