import { mergeStations } from '../design/cutLimits.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';

/** Below this depth of cut (m) at a checkpoint, the arch is not what moved the thickness there: 0.05 mm. */
const smallestScaledDepth = 5e-5;

/** Linear interpolation of [x, value] anchors (ascending x), constant beyond the first and last. */
function interpolate(anchors: readonly (readonly [number, number])[], x: number): number {
  if (x <= anchors[0]![0]) return anchors[0]![1];
  for (let k = 1; k < anchors.length; k++) {
    const [x1, v1] = anchors[k]!;
    if (x <= x1 + 1e-12) {
      const [x0, v0] = anchors[k - 1]!;
      return x1 > x0 ? v0 + ((x - x0) / (x1 - x0)) * (v1 - v0) : v1;
    }
  }
  return anchors[anchors.length - 1]![1];
}

/**
 * The bar's shape corrected by thicknesses measured with a caliper (`[position_mm,
 * thickness_mm]` pairs): at each measured station the thickness is the measured one. Between
 * them, when the depth of the arch is given (`depth`, m below the blank at a position in m) and is
 * at least 0.05 mm at every checkpoint, the arch is taken as r(x) times as deep as the shape says,
 * r measured at each checkpoint and interpolated linearly between them (constant beyond the
 * outermost): a cut made 15 % too deep, or deeper on one side, is followed along the arch's own
 * shape, and nothing changes where nothing was cut. Otherwise the profile moves by the linearly
 * interpolated difference, which falls to zero at the bar's ends unless a measurement is taken
 * there (ends are usually uncut, full blank thickness). Thicknesses stay within (0, blank].
 * Non-rect sections and empty lists return the model as is.
 */
export function shapeWithMeasuredThicknesses(model: BarModel, measured: readonly (readonly [number, number])[] | undefined, depth?: (x: number) => number): BarModel {
  if (!measured || measured.length === 0 || model.section.shape !== 'rect') return model;
  const length = model.length;
  const anchors: [number, number][] = measured.map(([x, t]) => [Math.min(length, Math.max(0, x * mm)), t * mm - thicknessAt(model.profile, Math.min(length, Math.max(0, x * mm)))]);
  const scaled = depth !== undefined && anchors.every(([x]) => depth(x) >= smallestScaledDepth);
  let differenceAt: (x: number) => number;
  if (scaled) {
    const ratios = anchors.map(([x, d]) => [x, d / depth(x)] as [number, number]);
    differenceAt = (x) => interpolate(ratios, x) * depth(x);
  } else {
    const ends = [...anchors];
    if (ends[0]![0] > 1e-9) ends.unshift([0, 0]);
    if (ends[ends.length - 1]![0] < length - 1e-9) ends.push([length, 0]);
    differenceAt = (x) => interpolate(ends, x);
  }
  const positions = mergeStations([model.profile.positions, anchors.map(([x]) => x), [0, length]], 1e-6);
  positions[0] = 0;
  positions[positions.length - 1] = length;
  const blank = model.section.thickness;
  const thicknesses = Float64Array.from(positions, (x) => Math.min(blank, Math.max(0.02 * blank, thicknessAt(model.profile, x) + differenceAt(x))));
  const profile: ThicknessProfile = { positions, thicknesses };
  return { ...model, profile };
}
