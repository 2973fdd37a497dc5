import { barModelFromFile } from '../modes/BarModel.ts';
import type { SessionLog } from '../fileFormats/sessionFile.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';

/** Thickness (mm) by which a later step may exceed an earlier one before it counts as added material (caliper slack). */
const addedSlackMm = 0.2;
/** Length (mm) by which a later step may exceed an earlier one (steel rule slack). */
const longerSlackMm = 0.5;

/**
 * Plain warnings about a session log that do not stop a calibration: a step recorded with more
 * wood than the one before (the shape was recorded wrongly: wood cannot be put back), some steps
 * with an air temperature and others without (those are taken as read at the playing temperature),
 * and a last step with fewer partials than the target tunes.
 */
export function sessionLogWarnings(log: SessionLog): string[] {
  const warnings: string[] = [];
  for (let k = 1; k < log.steps.length; k++) {
    const before = barModelFromFile(log.steps[k - 1]!.bar);
    const after = barModelFromFile(log.steps[k]!.bar);
    if (after.length * 1e3 > before.length * 1e3 + longerSlackMm) {
      warnings.push(`step ${k + 1}'s bar is longer than step ${k}'s: wood cannot be put back; check the recorded lengths`);
      continue;
    }
    const offset = (before.length - after.length) / 2;
    let worst = 0;
    let where = 0;
    for (const x of [...after.profile.positions, ...Array.from(before.profile.positions, (p) => p - offset)]) {
      if (x < 0 || x > after.length) continue;
      const excess = (thicknessAt(after.profile, x) - thicknessAt(before.profile, x + offset)) * 1e3;
      if (excess > worst) [worst, where] = [excess, x];
    }
    if (worst > addedSlackMm) warnings.push(`step ${k + 1}'s bar is ${worst.toFixed(2)} mm thicker than step ${k}'s at ${(where * 1e3).toFixed(0)} mm: wood cannot be put back; check the recorded shape`);
  }
  const recorded = log.steps.filter((s) => s.air_temperature_c !== undefined).length;
  if (recorded > 0 && recorded < log.steps.length)
    warnings.push(`${log.steps.length - recorded} of ${log.steps.length} steps give no air_temperature_c: they are taken as read at the playing temperature`);
  const last = log.steps[log.steps.length - 1];
  if (last && last.measured_hz.length < log.target.ratios.length)
    warnings.push(`the last step measured ${last.measured_hz.length} partial${last.measured_hz.length === 1 ? '' : 's'} but the target tunes ${log.target.ratios.length}: the others are taken from the calibrated model`);
  return warnings;
}
