import type { CutLimits } from '../design/cutLimits.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { applyCut } from './applyCut.ts';
import type { SessionCalibration } from './calibrateSession.ts';
import type { PlannedCut } from './planCut.ts';
import { predictShape } from './predictShape.ts';
import { millimetre as mm } from '../units/units.ts';

/** What stuckReason looks at. */
export interface StuckInput {
  readonly calibration: SessionCalibration;
  readonly model: BarModel;
  readonly errorCents: readonly number[];
  readonly toleranceCents: readonly number[];
  readonly limits: CutLimits;
  readonly plan: PlannedCut;
}

/** How a maker allows shortening: the workbench's switch, or the session file's limit. */
const allowShorteningHint = 'allow shortening with the switch "Advice may shorten the bar" (in a session file: "allow_shortening": true in its limits)';

function signed(value: number): string {
  return `${value >= 0 ? '+' : ''}${value.toFixed(1)}`;
}

/** Cents the fundamental rises per mm of shortening (trimmed equally from both ends), by the calibrated model. */
function centsPerMmShortening(input: StuckInput): number {
  const now = predictShape(input.calibration, input.model, false);
  const shorter = predictShape(input.calibration, applyCut(input.model, null, { amplitudes: [], shorteningMm: 1 }), false);
  return shorter.cents[0]! - now.cents[0]!;
}

/**
 * Why no removal helps, in a sentence that says what would: a fundamental flat beyond tolerance
 * (shortening by about N mm would raise it, if the limits allowed it); the minimum thickness
 * reached where the cut would go (a thinner limit or a longer blank); a tube or rod that cannot be
 * undercut; an overtone flat beyond tolerance that no allowed cut raises on its own; or partials that no allowed cut moves toward their targets without sending another
 * flat (the overshoot rule), with each partial's standing.
 */
export function stuckReason(input: StuckInput): string {
  const { errorCents, toleranceCents, limits, model, plan } = input;
  const standing = errorCents.map((e, n) => `partial ${n + 1} ${signed(e)} cents`).join(', ');
  const flatFundamental = errorCents[0]! < -toleranceCents[0]!;
  const anySharp = errorCents.some((e, n) => e > toleranceCents[n]!);
  if (flatFundamental) {
    const rate = centsPerMmShortening(input);
    const needed = rate > 0 ? -errorCents[0]! / rate : 0;
    // A tube or rod hangs from one end and is trimmed at its free end; a bar on cords at both ends.
    const where = model.section.shape === 'rect' ? `${(needed / 2).toFixed(1)} mm from each end` : 'off the free end';
    const trim = `shortening by about ${needed.toFixed(1)} mm (${where}; ${rate.toFixed(1)} cents per mm) would bring the fundamental up`;
    if (!limits.allowShortening) return `the fundamental is ${signed(errorCents[0]!)} cents, flat beyond its tolerance, and removal in the arch only lowers it: ${trim}; ${allowShorteningHint} (${standing})`;
    if (limits.maxShortening <= 1e-6) return `the fundamental is ${signed(errorCents[0]!)} cents, flat, and the shortening allowance (max_shortening_mm) is used up: ${trim} (${standing})`;
  }
  if (model.section.shape !== 'rect') {
    return anySharp
      ? `a ${model.section.shape} cannot be undercut and shortening only raises it: it is sharp (${standing}); only a longer piece would lower it`
      : `a ${model.section.shape} cannot be undercut: ${standing}`;
  }
  if (anySharp && plan.binding.includes('min-thickness')) {
    return `the cut would go below the minimum thickness of ${(limits.minThickness / mm).toFixed(2)} mm where it is needed: ${standing}. A thinner minimum (limits.min_thickness_mm) or a longer blank would be needed`;
  }
  const flatOvertone = errorCents.findIndex((e, n) => n > 0 && e < -toleranceCents[n]!);
  if (flatOvertone > 0) {
    const n = flatOvertone;
    return `partial ${n + 1} is ${signed(errorCents[n]!)} cents, flat beyond its tolerance, and no cut within the limits raises it without taking the others down with it (${standing}). Shortening raises every partial; undercutting the middle after it lowers the fundamental most${limits.allowShortening ? '' : ` (${allowShorteningHint})`}; or this blank cannot reach these ratios`;
  }
  if (plan.binding.includes('overshoot')) {
    return `no cut within the limits moves the sharp partials without risking another going flat beyond its tolerance (${standing})${limits.allowShortening ? '' : '; shortening (allow_shortening) then re-cutting the arch may recover it'}`;
  }
  const rules = plan.binding.filter((b) => b !== 'overshoot');
  return `no removal within the limits${rules.length ? ` (${rules.join(', ')} binding)` : ''} moves the partials toward their targets: ${standing}`;
}

