import { evaluateShape, type DesignProblem } from './evaluateShape.ts';
import { fitShape, type FittedShape, type SolveBudget } from './fitShape.ts';
import { freeFormArch, freeFormParameters } from './freeFormArch.ts';
import { powerArch } from './powerArch.ts';
import { reduceRemoval } from './reduceRemoval.ts';
import { searchShapes, withinTolerance, type ShapeStart } from './searchShapes.ts';
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
/** The free form polishes a best shape that misses by more than this fraction of a tolerance… */
const polishFrom = 0.55;
/** …and within this many tolerances. */
const polishReach = 12;
/** Smoothness weight of the free-form polish (per normalised second difference). */
const smoothnessWeight = 3;

/**
 * Finds the arch for a design problem: multi-start Levenberg–Marquardt over the parametric
 * families, the least removed material among those within tolerance (and, when there are fewer
 * partials than parameters, a removal-reducing SQP within the tolerance band), then — if the
 * best still misses — a free-form polish with a smoothness penalty for the last cents.
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
  const missesBy = Math.max(...Array.from(best.evaluation.cents, (c, k) => Math.abs(c) / problem.target.toleranceCents[k]!));
  if ((options.polish ?? true) && missesBy > polishFrom && missesBy < polishReach && budget.solves < budget.maxSolves && !budget.cancelled()) {
    const base = freeFormParameters(problem.space, best.evaluation.depth);
    const polished = fitShape(problem, freeFormArch, base, {
      maxIterations: 25,
      goal: searchGoal,
      smoothness: { weight: smoothnessWeight, base },
      budget,
    });
    const polishedMiss = Math.max(...Array.from(polished.evaluation.cents, (c, k) => Math.abs(c) / problem.target.toleranceCents[k]!));
    if (polishedMiss < missesBy) best = polished;
  }
  return { best, uncutCents: uncut.cents, starts: search.starts, fits: search.fits };
}
