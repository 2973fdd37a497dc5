import type { SessionLog } from '../fileFormats/sessionFile.ts';
import type { SessionCalibration } from './calibrateSession.ts';

/** How deep this maker's cuts run against their plans, learnt from the cuts checked with a caliper. */
export interface HandBias {
  /** Depth removed ÷ depth planned, on average (1: as planned). */
  readonly scale: number;
  /** One-sigma of that average. */
  readonly sigma: number;
  /** The caliper-checked cuts it was learnt from (steps, 1-based). */
  readonly steps: number[];
}

/**
 * One-sigma scatter of one cut's depth around the maker's habit (barwright's own: a careful maker
 * repeats a cut to about 5 %), added to each cut's own uncertainty when averaging.
 */
export const handCutScatter = 0.05;
/** Prior one-sigma of a maker's habit around "as planned": 10 % (the planned-cut prior, calibrationPriors). */
const habitPrior = 0.1;

/**
 * A maker's habit from the session's cuts recorded as planned and checked with the caliper (steps
 * with `measured_thickness_mm`): the precision-weighted mean of their fitted depth scales (each
 * weighed by its own sigma and a 5 % cut-to-cut scatter), shrunk toward "as planned" by a ±10 %
 * prior. Null without a checked cut. A cut that ran 15 % deep every time gives a scale near 1.15,
 * and the next plan asks for 1/1.15 of the depth the model needs, so the cut lands where planned.
 */
export function handBias(log: SessionLog, calibration: SessionCalibration): HandBias | null {
  const checked = calibration.cutDepths.filter((estimate) => (log.steps[estimate.step - 1]?.measured_thickness_mm?.length ?? 0) > 0);
  if (checked.length === 0) return null;
  let precision = 1 / habitPrior ** 2;
  let sum = 0;
  for (const estimate of checked) {
    const weight = 1 / (estimate.sigma ** 2 + handCutScatter ** 2);
    precision += weight;
    sum += weight * estimate.scale;
  }
  return { scale: 1 + sum / precision, sigma: 1 / Math.sqrt(precision), steps: checked.map((estimate) => estimate.step) };
}
