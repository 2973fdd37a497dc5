/**
 * How boldly a session steps. Wood cannot be put back, so each step aims where, even if the cut
 * does more than predicted by `confidence` sigmas, no partial ends flatter than its tolerance; and
 * the fundamental is held a little sharp until the overtones are in place.
 */
export interface StepPolicy {
  /** Sigmas of pessimism in the overshoot rule (2: about 1 step in 40 lands beyond it, one-sided Gaussian). */
  readonly confidence: number;
  /** How sharp (cents) the fundamental is held while the overtones are still out of tolerance. */
  readonly holdCents: number;
  /** One-sigma relative error of a predicted change (cut execution and model): 12 %. */
  readonly changeSigma: number;
}

/**
 * Defaults: 2 sigma; hold the fundamental 5 cents sharp (common practice: "rough-cut a few cents
 * sharp, then creep down", brief.md §3); a predicted change good to 12 % one sigma (a careful
 * maker's cut matches the plan to about 10 %, common practice, combined with a few percent of
 * model error in the change after calibration).
 */
export const defaultStepPolicy: StepPolicy = { confidence: 2, holdCents: 5, changeSigma: 0.12 };

/** What a step aims at, per tuned partial (cents, relative to the current error). */
export interface StepAims {
  /** Desired change of each partial (cents). */
  readonly desired: number[];
  /** Lowest change allowed for each partial (cents, ≤ 0): the overshoot rule. */
  readonly lowestChange: number[];
  /** `hold`: fundamental held sharp while the overtones are placed; `close-in`: all aimed at target. */
  readonly phase: 'hold' | 'close-in';
}

/**
 * The aims of the next step from the current errors (cents, + sharp), the tolerances (cents) and
 * each partial's one-sigma uncertainty of a change apart from its size (cents). Overshoot rule, for
 * a partial lowered by |Δ|: error + Δ − z·(u + ρ·|Δ|) ≥ −tolerance, i.e. Δ ≥ (−tol − e + z·u)/(1 + z·ρ)
 * (with `sizeIncluded`, u already holds the size term and Δ ≥ −tol − e + z·u);
 * a partial already below that is not lowered further (only raising, which is recoverable, is
 * allowed). Aims: the overtones at their targets; the fundamental held `holdCents` sharp (never
 * pushed up to it) until every overtone is within tolerance, then at its target; a flat
 * fundamental aimed back up to the hold. On a big step the floors differ from partial to partial
 * (the uncertainty grows with the change), so every partial that must come down is aimed no lower
 * than the highest floor: the bar is left evenly sharp with its ratios right, and the next step is
 * a plain lowering (common practice: rough-cut sharp, then creep down).
 */
export function stepAims(errors: readonly number[], tolerances: readonly number[], uncertainty: readonly number[], policy: StepPolicy = defaultStepPolicy, sizeIncluded = false): StepAims {
  const z = policy.confidence;
  const growth = sizeIncluded ? 1 : 1 + z * policy.changeSigma;
  const overtonesInPlace = errors.every((e, n) => n === 0 || Math.abs(e) <= tolerances[n]!);
  const phase = overtonesInPlace ? 'close-in' : 'hold';
  const lowestChange = errors.map((e, n) => Math.min(0, (-tolerances[n]! - e + z * uncertainty[n]!) / growth));
  const floors = errors.map((e, n) => e + lowestChange[n]!);
  const evenMargin = Math.max(...floors.filter((_, n) => lowestChange[n]! < 0), -Infinity);
  const aimOf = (e: number, n: number): number => {
    if (n > 0 || phase === 'close-in') return 0;
    if (e > policy.holdCents) return policy.holdCents;
    if (e >= -tolerances[0]!) return e;
    return policy.holdCents;
  };
  const desired = errors.map((e, n) => {
    const aim = aimOf(e, n);
    if (aim >= e || !(evenMargin > aim)) return aim - e;
    return e <= evenMargin ? 0 : evenMargin - e;
  });
  return { desired, lowestChange, phase };
}
