/**
 * The priors and error allowances of a session's calibration, each with its reason. Wood varies
 * blank to blank and the 1D model differs from the real 3D bar, so the fit starts from the
 * maker's guess with these widths and lets the measurements move it.
 */
export interface CalibrationPriors {
  /** One-sigma prior width of ln E around the maker's guess. */
  readonly lnYoungSigma: number;
  /** One-sigma prior width of ln G around the maker's guess. */
  readonly lnShearSigma: number;
  /** One-sigma prior width of each per-partial correction c_n (fraction of frequency per unit arch depth), mean 0. */
  readonly correctionSigma: number;
  /** How wrong the correction's linear-in-depth form may be: one-sigma per unit of depth × depth away from the current shape. */
  readonly correctionFormSigma: number;
  /** What no per-partial correction captures (how the real gap depends on the arch's shape, not just its depth): one-sigma per unit depth of the shape itself. */
  readonly modelFormSigma: number;
  /** One-sigma relative error of a cut recorded as planned (the maker's cut differs from the plan). */
  readonly plannedCutSigma: number;
  /**
   * One-sigma relative error of the model's account of the change between two steps, used when
   * deciding whether a measurement is contradictory (not as a weight of the fit).
   */
  readonly changeFormSigma: number;
}

/**
 * Default priors: E ±20 % and G ±35 % one sigma (brief.md: wood varies E by ±20 % blank to blank,
 * G more); corrections ±5 % per unit depth (brief.md: the 1D model is 2.0–3.2 % high on modes 1–3
 * for a bar cut to 8/22 of its thickness, depth 0.64, i.e. 3–5 % per unit depth); the linear form
 * allowed ±3 % per unit depth² (at most ±0.3 % of frequency halfway to a 0.64 depth, about a tenth
 * of the gap) and the shape's own remainder ±0.4 % per unit depth (barwright's own allowances); a cut
 * recorded as planned ±10 % of its depth (common practice: a careful maker removes the planned
 * depth to about a tenth); and the model's account of a change between steps good to ±15 % when
 * judging whether a measurement contradicts the rest (on a simulated bar with 2–3 % of 1D-model
 * error, test/session, the prediction of a rough cut missed by up to about that share).
 */
export const defaultCalibrationPriors: CalibrationPriors = {
  lnYoungSigma: 0.2,
  lnShearSigma: 0.35,
  correctionSigma: 0.05,
  correctionFormSigma: 0.03,
  modelFormSigma: 0.004,
  plannedCutSigma: 0.1,
  changeFormSigma: 0.15,
};

/**
 * A measurement is flagged as contradictory when its leave-one-out residual is more than this many
 * sigmas (about 1 in 16 000 for a Gaussian error), the sigma including the model's allowance for
 * the change since the step before…
 */
export const flagSigmas = 4;
/** …and more than this many cents (below it, a measurement is merely noisy). */
export const flagFloorCents = 10;
/** Most measurements set aside as contradictory in one calibration. */
export const maxFlagged = 3;
