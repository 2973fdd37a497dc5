import { evaluateShape, type DesignProblem } from './evaluateShape.ts';
import { centsCost, fitShape, type FittedShape, type SolveBudget } from './fitShape.ts';
import { freeFormArch, freeFormParameters } from './freeFormArch.ts';
import { powerArch } from './powerArch.ts';
import { reduceRemoval } from './reduceRemoval.ts';
import { searchShapes, withinLimitsStart, withinTolerance, type ShapeStart } from './searchShapes.ts';
import type { ShapeFamily } from './ShapeFamily.ts';
import { shoulderArch } from './shoulderArch.ts';
import { surfaceConstraints } from './surfaceConstraints.ts';

/** The shape families by name (the parametric ones are searched; free-form polishes). */
export const shapeFamilies: Readonly<Record<string, ShapeFamily>> = {
  'shoulder-arch': shoulderArch,
  'power-arch': powerArch,
  'free-form': freeFormArch,
};

/** Options of designShape. */
export interface DesignShapeOptions {
  /** Parametric families to search (default shoulder-arch and power-arch). */
  readonly families?: readonly ShapeFamily[];
  /** Polish with the free form when the best arch misses (default true). */
  readonly polish?: boolean;
  /** Iterations per start (default 30). */
  readonly maxIterations?: number;
  /** Starting points instead of the families' own. */
  readonly starts?: readonly ShapeStart[];
  /** Look for less removal within tolerance (default true). */
  readonly reduce?: boolean;
}

/** What designShape found. */
export interface ShapeOutcome {
  readonly best: FittedShape;
  /** The uncut bar's partials, cents from the targets. */
  readonly uncutCents: Float64Array;
  /** How many starts the search ran. */
  readonly starts: number;
  /** Every distinct shape the search found, best first. */
  readonly fits: readonly FittedShape[];
}

/** Goal of the search as a fraction of each tolerance (aim well inside). */
const searchGoal = 0.05;
/** The free form polishes a best shape that misses by more than this fraction of a tolerance. */
const polishFrom = 0.55;
/** Smoothness weight of the free-form polish (per normalised second difference of the change). */
const smoothnessWeight = 3;
/**
 * Smoothness weight of the free form started afresh: lighter, since it has to find its own
 * shape (measured: a wide undercut with two grooves and a thicker middle, which a single arch
 * cannot make, puts a 300 × 40 × 20 mm G4 blank on 1 : 3 within the default limits).
 */
const freshSmoothnessWeight = 1;
/** A refit stops once every partial is within this fraction of its tolerance (it only has to get back inside). */
const refitGoal = 0.3;
/** Depth (fraction of the deepest cut) of the fresh free form's start at the centre: a shallow dome. */
const freshStartDepth = 0.05;

/**
 * Finds the arch for a design problem: multi-start Levenberg–Marquardt over the parametric
 * families (each start first brought within the slope and radius limits), the least removed
 * material among those within tolerance (and, when there are fewer partials than parameters, a
 * removal-reducing SQP within the tolerance band), then — if the best still misses — the free
 * form with a smoothness penalty: a polish of the best arch for the last cents and, when that
 * still misses, a fresh free form from a shallow dome, which finds shapes no single arch makes
 * (a wide undercut with two grooves and a thicker middle).
 */
export function designShape(problem: DesignProblem, budget: SolveBudget, options: DesignShapeOptions = {}): ShapeOutcome {
  const families = options.families ?? [shoulderArch, powerArch];
  budget.solves++;
  const uncut = evaluateShape(problem, shoulderArch, [0, 0, 0]);
  const search = searchShapes(problem, { families, budget, maxIterations: options.maxIterations ?? 30, goal: searchGoal, ...(options.starts ? { starts: options.starts } : {}) });
  let best = search.fits[0] ?? {
    evaluation: uncut,
    constraints: surfaceConstraints(problem, uncut.depth, uncut.depthJacobian, 3),
    cost: Number.POSITIVE_INFINITY,
    iterations: 0,
    reachedGoal: false,
  };
  if ((options.reduce ?? true) && withinTolerance(problem, best)) best = reduceRemoval(problem, best, budget);
  const missRatio = (fit: FittedShape): number => Math.max(...Array.from(fit.evaluation.cents, (c, k) => Math.abs(c) / problem.target.toleranceCents[k]!));
  if ((options.polish ?? true) && missRatio(best) > polishFrom && budget.solves < budget.maxSolves && !budget.cancelled()) {
    // The free form, twice: polishing the best arch (the last cents), and started afresh from a
    // shallow dome (shapes no single arch makes, when the arches are far off).
    const m = freeFormArch.parameterCount(problem.space);
    const base = withinLimitsStart(problem, freeFormArch, freeFormParameters(problem.space, best.evaluation.depth));
    const candidates: FittedShape[] = [fitShape(problem, freeFormArch, base, { maxIterations: 25, goal: searchGoal, smoothness: { weight: smoothnessWeight, base }, budget })];
    if (missRatio(candidates[0]!) > 1 && budget.solves < budget.maxSolves && !budget.cancelled()) {
      const dome = Float64Array.from({ length: m }, (_, k) => freshStartDepth * (1 - (k / m) ** 2));
      candidates.push(fitShape(problem, freeFormArch, dome, { maxIterations: 40, goal: searchGoal, smoothness: { weight: freshSmoothnessWeight, base: new Float64Array(m) }, budget }));
    }
    for (const candidate of candidates) if (missRatio(candidate) < missRatio(best)) best = candidate;
    if ((options.reduce ?? true) && withinTolerance(problem, best) && best.evaluation.family === freeFormArch) best = reduceRemoval(problem, best, budget);
  }
  return { best, uncutCents: uncut.cents, starts: search.starts, fits: search.fits };
}

/**
 * The previous outcome's best shape on a problem that differs from its own only a little, on the
 * same grid (the cord holes moved within the uncut ends, which moves the partials by hundredths
 * of a cent): kept as it is when it is still within tolerance — reshaping it would move the nodes
 * the holes are following — else fitted again from where it was, and the full search
 * (designShape) only when that misses. A shape that missed before is kept as the closest.
 */
export function refitShape(problem: DesignProblem, previous: ShapeOutcome, budget: SolveBudget, options: DesignShapeOptions = {}): ShapeOutcome {
  const family = previous.best.evaluation.family;
  const q = previous.best.evaluation.q;
  if (family.parameterCount(problem.space) !== q.length) return designShape(problem, budget, options);
  budget.solves++;
  const evaluation = evaluateShape(problem, family, q);
  const m = family.parameterCount(problem.space);
  const kept: FittedShape = { evaluation, constraints: surfaceConstraints(problem, evaluation.depth, evaluation.depthJacobian, m), cost: centsCost(problem, evaluation), iterations: 0, reachedGoal: false };
  // A shape that missed before is the closest one still: searching again for a hole moved by a
  // millimetre would only repeat the search.
  if (withinTolerance(problem, kept) || !withinTolerance(problem, previous.best)) return { best: kept, uncutCents: previous.uncutCents, starts: 1, fits: [kept] };
  const best = fitShape(problem, family, q, { maxIterations: 12, goal: refitGoal, budget });
  if (!withinTolerance(problem, best)) return designShape(problem, budget, options);
  return { best, uncutCents: previous.uncutCents, starts: 1, fits: [best] };
}
