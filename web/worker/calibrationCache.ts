// The calibrations a worker made lately, by the fingerprint of the session and lot they came from:
// a drag, or a 3D check after a partials update, re-uses its bar's calibration.
import { calibrateSession, calibrationSummary, parseSessionFile, stableHash, type CalibrationSummary, type LotPrior, type SessionFile } from '../../src/index.ts';

/** Calibrations of the sessions analysed lately, by fingerprint: a drag re-uses its bar's calibration. */
const calibrations = new Map<string, CalibrationSummary>();
const keptCalibrations = 8;

/** The calibration summary of a session (calibrated once, then remembered). */
export function summaryOf(session: SessionFile, lot: LotPrior | null | undefined): CalibrationSummary {
  const key = stableHash([session, lot ?? null]);
  const known = calibrations.get(key);
  if (known) return known;
  const log = parseSessionFile(session, 'session');
  const summary = calibrationSummary(calibrateSession(log, { lot: lot ?? null }), log);
  calibrations.set(key, summary);
  if (calibrations.size > keptCalibrations) calibrations.delete(calibrations.keys().next().value!);
  return summary;
}

