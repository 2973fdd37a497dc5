import type { BarFile } from '../fileFormats/barFile.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';
import type { SessionLog } from '../fileFormats/sessionFile.ts';
import type { SessionCalibration } from './calibrateSession.ts';
import { fileThicknessMm } from './cutInstructions.ts';

/** A place to put the caliper after a cut: position from the left end of the bar after it, and the thickness to expect, mm. */
export interface Checkpoint {
  x_mm: number;
  thickness_mm: number;
}

/** Fewest and most checkpoints named with a cut. */
const fewest = 3;
const most = 5;
/** Checkpoints lie where the cut removes at least this share of its deepest… */
const shareOfDeepest = 0.3;
/** …at least this far apart (mm: a caliper's jaw and a pencil mark)… */
const spacingMm = 12;
/** …and only for a cut at least this deep (mm): a sanding pass is not worth measuring. */
const smallestMeasurableMm = 0.05;
/**
 * A percentage of the plan is given over the readings where at least 0.2 mm was planned, and only
 * when 0.5 mm or more was planned there on average (mm): on a lighter pass the caliper's and the
 * estimate's errors (a tenth of a mm or two) would swamp it, and the mm off plan say more.
 */
const smallestComparedMm = 0.2;
const smallestMeanComparedMm = 0.5;

/**
 * Where to check a cut with the caliper: 3–5 positions on the bar after the cut (whole mm from its
 * left end), the deepest point of the cut first, then each next the one farthest from those chosen
 * among the positions where the cut removes at least 30 % of its deepest (12 mm apart at least),
 * so they cover the cut's extent; with the thickness the bar should have there after the cut
 * (`expectedAfter`, the session's estimate of the real bar after it, so a caliper reading that
 * agrees means the cut went as planned). Empty for no undercut or one under 0.05 mm.
 */
export function cutCheckpoints(now: BarFile, after: BarFile, expectedAfter: BarModel): Checkpoint[] {
  if (now.section.shape !== 'rect' || after.section.shape !== 'rect') return [];
  const trim = (now.length_mm - after.length_mm) / 2;
  const positions = Array.from({ length: Math.floor(after.length_mm) + 1 }, (_, i) => i);
  const depth = positions.map((x) => fileThicknessMm(now, x + trim) - fileThicknessMm(after, x));
  const deepest = Math.max(...depth);
  if (!(deepest >= smallestMeasurableMm)) return [];
  const candidates = positions.filter((_, i) => depth[i]! >= shareOfDeepest * deepest);
  const plateau = positions.filter((_, i) => depth[i]! >= 0.98 * deepest);
  const centre = Math.round(plateau.reduce((a, b) => a + b, 0) / plateau.length);
  const chosen = [candidates.reduce((best, x) => (Math.abs(x - centre) < Math.abs(best - centre) ? x : best), candidates[0]!)];
  while (chosen.length < most) {
    let best: number | null = null;
    let bestDistance = spacingMm - 1e-9;
    for (const x of candidates) {
      const distance = Math.min(...chosen.map((c) => Math.abs(c - x)));
      if (distance > bestDistance) [best, bestDistance] = [x, distance];
    }
    if (best === null) break;
    chosen.push(best);
  }
  // A narrow cut: add points beside it, still inside the bar, so there are at least three.
  for (let offset = spacingMm; chosen.length < fewest && offset < after.length_mm; offset += spacingMm)
    for (const x of [chosen[0]! - offset, chosen[0]! + offset]) if (chosen.length < fewest && x >= 0 && x <= after.length_mm && !chosen.includes(x)) chosen.push(x);
  return chosen
    .sort((a, b) => a - b)
    .map((x) => ({ x_mm: x, thickness_mm: round(thicknessAt(expectedAfter.profile, x * mm) / mm, 2) }));
}

/** How one step's cut compared with its plan at the places the caliper measured. */
export interface CutAgainstPlan {
  /** The step (1-based) whose caliper readings these are. */
  step: number;
  /** Depth removed as a percentage of the depth planned, over the checkpoints where a cut was planned (null if none was). */
  percent: number | null;
  checkpoints: { x_mm: number; planned_remove_mm: number; measured_remove_mm: number; off_mm: number }[];
}

/**
 * For each step with caliper readings (`measured_thickness_mm`) after a cut: at each reading the
 * depth planned (the step before's bar file minus this step's, as recorded) and the depth really
 * removed (the calibration's estimate of the bar before, minus the reading), and how far apart
 * they are (+ deeper than planned); the percentage is Σ removed / Σ planned over the readings
 * where at least 0.2 mm was planned, when they average 0.5 mm or more (null otherwise: a light pass
 * is judged in mm only).
 */
export function cutsAgainstPlan(log: SessionLog, calibration: SessionCalibration): CutAgainstPlan[] {
  const report: CutAgainstPlan[] = [];
  log.steps.forEach((step, k) => {
    if (k === 0 || !step.measured_thickness_mm?.length || step.bar.section.shape !== 'rect') return;
    const before = log.steps[k - 1]!.bar;
    const estimateBefore = calibration.steps[k - 1]!.model;
    const trim = (before.length_mm - step.bar.length_mm) / 2;
    let planned = 0;
    let removed = 0;
    let compared = 0;
    const checkpoints = step.measured_thickness_mm.map(([x, thickness]) => {
      const plannedRemove = fileThicknessMm(before, x + trim) - fileThicknessMm(step.bar, x);
      const measuredRemove = thicknessAt(estimateBefore.profile, (x + trim) * mm) / mm - thickness;
      if (plannedRemove >= smallestComparedMm) {
        planned += plannedRemove;
        removed += measuredRemove;
        compared++;
      }
      return { x_mm: x, planned_remove_mm: round(plannedRemove, 2), measured_remove_mm: round(measuredRemove, 2), off_mm: round(measuredRemove - plannedRemove, 2) };
    });
    report.push({ step: k + 1, percent: compared > 0 && planned / compared >= smallestMeanComparedMm ? round((100 * removed) / planned, 1) : null, checkpoints });
  });
  return report;
}
