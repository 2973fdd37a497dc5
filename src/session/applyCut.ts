import { trimProfile } from '../design/cutLimits.ts';
import type { BarModel } from '../modes/BarModel.ts';
import type { CutRegions } from './cutRegions.ts';
import { millimetre as mm } from '../units/units.ts';

/** A cut in region amplitudes: depth (mm) of each region's bump pair, and the total shortening (mm). */
export interface CutAmounts {
  readonly amplitudes: readonly number[];
  readonly shorteningMm: number;
}

/** No cut at all. */
export function noCut(regionCount: number): CutAmounts {
  return { amplitudes: new Array<number>(regionCount).fill(0), shorteningMm: 0 };
}

/**
 * The bar after a cut: each station of the (cutting-grid) model thinned by Σ amplitude_k ·
 * shape_k (never below 2 % of the blank, a guard; the constraints keep it far above), then
 * `shorteningMm` trimmed off equally at both ends. Pure: a new model.
 */
export function applyCut(model: BarModel, regions: CutRegions | null, cut: CutAmounts): BarModel {
  let profile = model.profile;
  if (regions && model.section.shape === 'rect') {
    const floor = 0.02 * model.section.thickness;
    const thicknesses = Float64Array.from(profile.thicknesses, (t, j) => {
      let removed = 0;
      regions.shapes.forEach((shape, k) => (removed += shape[j]! * cut.amplitudes[k]! * mm));
      return Math.max(floor, t - removed);
    });
    profile = { positions: profile.positions, thicknesses };
  }
  if (cut.shorteningMm <= 0) return { ...model, profile };
  const half = 0.5 * cut.shorteningMm * mm;
  return { ...model, length: model.length - 2 * half, profile: trimProfile(profile, half, half) };
}

/** Largest depth removed anywhere by a cut (mm), shortening aside. */
export function largestDepthMm(regions: CutRegions | null, cut: CutAmounts): number {
  if (!regions) return 0;
  let largest = 0;
  for (let j = 0; j < (regions.shapes[0]?.length ?? 0); j++) {
    let removed = 0;
    regions.shapes.forEach((shape, k) => (removed += shape[j]! * cut.amplitudes[k]!));
    largest = Math.max(largest, removed);
  }
  return largest;
}
