import { centsCost, fitShape, type FittedShape, type SolveBudget } from './fitShape.ts';
import type { DesignProblem } from './evaluateShape.ts';
import type { ShapeFamily } from './ShapeFamily.ts';
import { surfaceConstraints, worstViolation } from './surfaceConstraints.ts';

/** Slack (m) below which a start counts as within the slope and radius limits (the fit's own acceptance slack). */
const startSlack = 5e-6;

/**
 * A start within the slope and tool-radius limits: the same shape made shallower (every depth
 * parameter scaled by 0.7 until the limits hold, at most 12 times; the other parameters kept).
 * The fit never makes a broken limit worse, so a start beyond the limits would stay stuck
 * there; every family's depth is proportional to its depth parameters, so scaling them down
 * eases both the slope (∝ depth) and the curvature (∝ depth). No solve is needed.
 */
export function withinLimitsStart(problem: DesignProblem, family: ShapeFamily, q: ArrayLike<number>): Float64Array {
  const m = family.parameterCount(problem.space);
  const n = problem.space.grid.positions.length;
  const start = Float64Array.from(q);
  const depthParameters = family.name === 'free-form' ? Array.from({ length: m }, (_, k) => k) : [0];
  const depth = new Float64Array(n);
  const jacobian = new Float64Array(n * m);
  for (let round = 0; round < 12; round++) {
    family.depths(problem.space, start, depth, jacobian);
    if (worstViolation(surfaceConstraints(problem, depth, jacobian, m)) <= startSlack) break;
    for (const k of depthParameters) start[k]! *= 0.7;
  }
  return start;
}

/** Options of searchShapes. */
export interface SearchOptions {
  readonly families: readonly ShapeFamily[];
  readonly budget: SolveBudget;
  /** Levenberg–Marquardt iterations per start. */
  readonly maxIterations: number;
  /** Goal as a fraction of each tolerance. */
  readonly goal: number;
  /** Starting points to use instead of the families' own (e.g. a neighbouring bar's solution). */
  readonly starts?: readonly ShapeStart[];
}

/** A starting point of the search: a family and its normalised parameters. */
export interface ShapeStart {
  readonly family: ShapeFamily;
  readonly q: ArrayLike<number>;
}

/** Every start's result, best first: those within tolerance by removed volume, then the rest by cost. */
export interface SearchResult {
  readonly fits: FittedShape[];
  readonly starts: number;
}

/** True when every partial is within its tolerance times `fraction`. */
export function withinTolerance(problem: DesignProblem, fit: FittedShape, fraction = 1): boolean {
  return fit.evaluation.cents.every((c, k) => Math.abs(c) <= fraction * problem.target.toleranceCents[k]!);
}

/** Iterations every start gets before the search keeps only the most promising. */
const screeningIterations = 6;
/** How many unfinished starts are carried on to convergence. */
const carriedOn = 2;

function ranking(problem: DesignProblem): (a: FittedShape, b: FittedShape) => number {
  return (a, b) => {
    const aIn = withinTolerance(problem, a);
    const bIn = withinTolerance(problem, b);
    if (aIn !== bIn) return aIn ? -1 : 1;
    return aIn ? a.evaluation.volume - b.evaluation.volume : centsCost(problem, a.evaluation) - centsCost(problem, b.evaluation);
  };
}

/**
 * Multi-start search over the parametric families, since the problem is multimodal (different
 * arches reach the same partials, and the limits make local minima): every start gets a few
 * Levenberg–Marquardt iterations (fitShape), then the two most promising unfinished ones are
 * carried on to convergence. Results sorted: shapes within tolerance by least removed volume
 * first, then the others by cents cost. Shapes found twice (same family, parameters within 1e-3)
 * are kept once.
 */
export function searchShapes(problem: DesignProblem, options: SearchOptions): SearchResult {
  const order = ranking(problem);
  const screened: FittedShape[] = [];
  let starts = 0;
  const points = options.starts ?? options.families.flatMap((family) => family.starts(problem.space).map((q) => ({ family, q })));
  const exhausted = (): boolean => options.budget.solves >= options.budget.maxSolves || options.budget.cancelled();
  for (const { family, q } of points) {
    if (exhausted()) break;
    starts++;
    screened.push(fitShape(problem, family, withinLimitsStart(problem, family, q), { maxIterations: Math.min(screeningIterations, options.maxIterations), goal: options.goal, budget: options.budget }));
  }
  screened.sort(order);
  const fits: FittedShape[] = [];
  let carried = 0;
  for (const fit of screened) {
    let result = fit;
    if (!fit.reachedGoal && carried < carriedOn && !exhausted() && options.maxIterations > screeningIterations) {
      carried++;
      result = fitShape(problem, fit.evaluation.family, fit.evaluation.q, { maxIterations: options.maxIterations - screeningIterations, goal: options.goal, budget: options.budget });
    }
    const duplicate = fits.some((other) => other.evaluation.family === result.evaluation.family && other.evaluation.q.every((v, i) => Math.abs(v - result.evaluation.q[i]!) < 1e-3));
    if (!duplicate) fits.push(result);
  }
  fits.sort(order);
  return { fits, starts };
}
