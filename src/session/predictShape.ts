import type { BarModel } from '../modes/BarModel.ts';
import { archDepth } from './archDepth.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';
import type { SessionCalibration } from './calibrateSession.ts';
import { centsPerNeper, evaluatePartials, type PartialEvaluation } from './partialModel.ts';

/** What the calibrated model says about one shape of the bar. */
export interface ShapePrediction {
  readonly model: BarModel;
  readonly depth: number;
  /** Calibrated pitch of each partial, cents above 1 Hz: Timoshenko at the fitted E, G plus c_n·depth. */
  readonly cents: Float64Array;
  readonly evaluation: PartialEvaluation;
}

/**
 * The calibrated model's partials for a shape (its own moduli are replaced by the calibrated
 * ones): cents_n(E, G; shape) + (1200/ln 2)·c_n·depth(shape), plus the solid model's first-order
 * difference when the calibration carries one (SolidSlope). With `derivatives`, also the
 * moduli derivatives needed for the uncertainty of a change (one more solve).
 */
export function predictShape(calibration: SessionCalibration, model: BarModel, derivatives = true): ShapePrediction {
  const evaluation = evaluatePartials(model, calibration.youngModulus, calibration.shearModulus, calibration.modes, derivatives);
  const depth = archDepth(model);
  const cents = Float64Array.from(evaluation.cents, (c, n) => c + centsPerNeper * (calibration.corrections[n] ?? 0) * depth);
  const slope = calibration.solidSlope;
  if (slope) {
    // Stations of the bar now, mapped onto this shape about its centre (a shortened bar loses its ends equally).
    const offset = 0.5 * (model.length - slope.positions[slope.positions.length - 1]!);
    slope.centsPerMetre.forEach((perStation, n) => {
      if (n >= cents.length) return;
      let sum = 0;
      for (let j = 0; j < perStation.length; j++) {
        const x = slope.positions[j]! + offset;
        if (x >= 0 && x <= model.length) sum += perStation[j]! * (thicknessAt(model.profile, x) - slope.thicknesses[j]!);
      }
      cents[n]! += sum;
    });
  }
  return { model, depth, cents, evaluation };
}

/**
 * One-sigma uncertainty (cents) of the predicted change of each partial between two shapes, from
 * the calibration: the posterior covariance of [ln E, ln G, c_n] projected on the change's
 * Jacobian (what E and G do differently to the two shapes, and c_n·Δdepth), plus the allowance
 * for the correction's linear form over the change in depth. Both shapes need derivatives.
 */
export function changeUncertaintyCents(calibration: SessionCalibration, now: ShapePrediction, after: ShapePrediction): Float64Array {
  const size = calibration.parameters.length;
  const deltaDepth = after.depth - now.depth;
  return Float64Array.from({ length: Math.min(now.cents.length, after.cents.length) }, (_, n) => {
    const row = new Array<number>(size).fill(0);
    row[0] = after.evaluation.perLnYoung[n]! - now.evaluation.perLnYoung[n]!;
    row[1] = after.evaluation.perLnShear[n]! - now.evaluation.perLnShear[n]!;
    if (2 + n < size) row[2 + n] = centsPerNeper * deltaDepth;
    const form = calibration.priors.correctionFormSigma * centsPerNeper * Math.abs(deltaDepth);
    return Math.sqrt(Math.max(0, quadraticForm(row, calibration.covariance)) + form * form);
  });
}

/** v·C·vᵀ for a row vector v and a square matrix C (a variance from a covariance). */
function quadraticForm(vector: readonly number[], matrix: readonly (readonly number[])[]): number {
  let sum = 0;
  for (let i = 0; i < vector.length; i++) {
    let row = 0;
    for (let j = 0; j < vector.length; j++) row += matrix[i]![j]! * vector[j]!;
    sum += vector[i]! * row;
  }
  return sum;
}
