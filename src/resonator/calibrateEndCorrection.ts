import { InputError } from '../fileFormats/InputError.ts';
import { speedOfSound, type AirConditions } from './speedOfSound.ts';

/** A tube that was built and measured. */
export interface MeasuredTube {
  /** Physical length, closed bottom to open end, m. */
  lengthM: number;
  /** Inner diameter, m. */
  innerDiameterM: number;
  /** Its lowest resonance as measured (e.g. tapping or a sweep), Hz. */
  measuredHz: number;
  /** Air during the measurement. */
  air: AirConditions;
}

/** The end correction a measured tube reveals. */
export interface EndCorrectionCalibration {
  /** δ = c / (4 f) − L, m. */
  endCorrectionM: number;
  /** δ / r: apply to the other tubes of the set (same open-end shape), scaled by their own radius. */
  factorOfRadius: number;
}

/**
 * Calibrates the end correction from one measured tube: inverting f = c / (4 (L + δ)) gives
 * δ = c / (4 f) − L, and δ / r carries over to tubes of the same end shape (the end correction
 * scales with the radius: Levine & Schwinger 1948). Throws InputError when the measurement
 * implies δ outside 0…2 r (a mismeasured length or a wrong resonance).
 */
export function calibrateEndCorrection(tube: MeasuredTube, source = 'measured tube'): EndCorrectionCalibration {
  const { lengthM, innerDiameterM, measuredHz } = tube;
  if (!(lengthM > 0) || !Number.isFinite(lengthM)) throw new InputError(source, 'length', 'must be a positive number');
  if (!(innerDiameterM > 0) || !Number.isFinite(innerDiameterM)) throw new InputError(source, 'inner diameter', 'must be a positive number');
  if (!(measuredHz > 0) || !Number.isFinite(measuredHz)) throw new InputError(source, 'measured frequency', 'must be a positive number');
  const radius = innerDiameterM / 2;
  const endCorrectionM = speedOfSound(tube.air) / (4 * measuredHz) - lengthM;
  const factorOfRadius = endCorrectionM / radius;
  if (!(factorOfRadius > 0 && factorOfRadius < 2)) {
    throw new InputError(source, 'measured frequency', `${measuredHz} Hz on a ${(lengthM * 1000).toFixed(1)} mm tube implies an end correction of ${(factorOfRadius).toFixed(2)} × the radius; expected about 0.6 (0…2)`);
  }
  return { endCorrectionM, factorOfRadius };
}
