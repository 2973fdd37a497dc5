import { mergeStations } from '../design/cutLimits.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';

/**
 * The bar's shape corrected by thicknesses measured with a caliper (`[position_mm,
 * thickness_mm]` pairs): at each measured station the thickness is the measured one; between
 * them the profile moves by the linearly interpolated difference, which falls to zero at the bar's
 * ends unless a measurement is taken there (ends are usually uncut, full blank thickness).
 * Thicknesses stay within (0, blank]. Non-rect sections and empty lists return the model as is.
 */
export function shapeWithMeasuredThicknesses(model: BarModel, measured: readonly (readonly [number, number])[] | undefined): BarModel {
  if (!measured || measured.length === 0 || model.section.shape !== 'rect') return model;
  const length = model.length;
  const anchors: [number, number][] = measured.map(([x, t]) => [Math.min(length, Math.max(0, x * mm)), t * mm - thicknessAt(model.profile, Math.min(length, Math.max(0, x * mm)))]);
  if (anchors[0]![0] > 1e-9) anchors.unshift([0, 0]);
  if (anchors[anchors.length - 1]![0] < length - 1e-9) anchors.push([length, 0]);
  const differenceAt = (x: number): number => {
    for (let k = 1; k < anchors.length; k++) {
      const [x1, d1] = anchors[k]!;
      if (x <= x1 + 1e-12) {
        const [x0, d0] = anchors[k - 1]!;
        return x1 > x0 ? d0 + ((x - x0) / (x1 - x0)) * (d1 - d0) : d1;
      }
    }
    return anchors[anchors.length - 1]![1];
  };
  const positions = mergeStations([model.profile.positions, anchors.map(([x]) => x)], 1e-6);
  positions[0] = 0;
  positions[positions.length - 1] = length;
  const blank = model.section.thickness;
  const thicknesses = Float64Array.from(positions, (x) => Math.min(blank, Math.max(0.02 * blank, thicknessAt(model.profile, x) + differenceAt(x))));
  const profile: ThicknessProfile = { positions, thicknesses };
  return { ...model, profile };
}
