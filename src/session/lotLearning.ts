import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import type { LotBarRecord } from '../fileFormats/lotFile.ts';
import type { SessionCalibration } from './calibrateSession.ts';

/**
 * What a finished bar's calibrated session teaches its lot (a lot file record): the calibrated E
 * and G with the density they go with (the partials decide E/ρ and G/ρ), their posterior
 * uncertainties, each partial's correction per unit arch depth with its posterior sigma, the
 * finished arch depth, and the temperature coefficient used (marked learnt when the bar's own
 * readings decided it). `bar` names the bar within the lot; `at` is the time (ISO 8601).
 */
export function lotRecordFromCalibration(calibration: SessionCalibration, bar: string, at: string, note?: string): LotBarRecord {
  const corrections = calibration.corrections.length;
  const record: LotBarRecord = {
    bar,
    learnt_at: at,
    steps: calibration.steps.length,
    E_GPa: round(calibration.youngModulus / 1e9, 4),
    G_GPa: round(calibration.shearModulus / 1e9, 5),
    density_kg_m3: round(calibration.density, 2),
    E_uncertainty_percent: round(100 * calibration.lnYoungSigma, 3),
    G_uncertainty_percent: round(100 * calibration.lnShearSigma, 3),
    correction_per_depth: calibration.corrections.map((c) => round(c, 5)),
    correction_sigma: Array.from({ length: corrections }, (_, n) => round(Math.max(1e-5, Math.sqrt(calibration.covariance[2 + n]![2 + n]!)), 5)),
    arch_depth: round(calibration.steps[calibration.steps.length - 1]!.depth, 4),
    pitch_cents_per_c: round(calibration.temperature.centsPerC, 3),
    pitch_sigma: round(Math.max(1e-3, calibration.temperature.sigma), 3),
    pitch_learnt: calibration.temperature.from === 'learnt',
  };
  if (note !== undefined) record.note = note;
  return record;
}
