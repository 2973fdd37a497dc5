import type { BarFile } from '../fileFormats/barFile.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { thicknessAt, uniformProfile, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';

function roundTo(value: number, step: number): number {
  return Math.round(value / step) * step;
}

/** A bar file's thickness profile in mm (uniform when it has none). */
function fileProfileMm(bar: BarFile): ThicknessProfile {
  const t = bar.section.shape === 'rect' ? bar.section.thickness_mm : 0;
  const pairs = bar.profile_mm ?? [
    [0, t],
    [bar.length_mm, t],
  ];
  return { positions: Float64Array.from(pairs, ([x]) => x), thicknesses: Float64Array.from(pairs, ([, th]) => th) };
}

/**
 * The bar file after a planned cut. The cut is planned on `nowModel` (the bar now as the
 * calibration estimates it, on a cutting grid that holds every station of `now`) and gives
 * `afterModel` (the same stations, possibly trimmed equally at both ends); the depth it removes at
 * each station, D = now − after, is applied to `now`, the bar file as recorded — the session log's
 * shape stays the maker's record, and the maker removes D. Shortening is rounded to 0.01 mm.
 * Thicknesses are rounded up to 0.01 mm (never more comes off than planned) and never exceed
 * `now`'s; stations are `now`'s own, shifted by the trim, so the file never adds wood; the
 * material is `now`'s (the maker's guess, which the session keeps calibrating).
 */
export function barFileFromModel(now: BarFile, nowModel: BarModel, afterModel: BarModel, depthFactor = 1): BarFile {
  const shorteningMm = Math.max(0, roundTo((nowModel.length - afterModel.length) / mm, 0.01));
  const lengthMm = now.length_mm - shorteningMm;
  const bar: BarFile = { ...structuredClone(now), length_mm: lengthMm };
  if (now.section.shape !== 'rect') return bar;
  const trimMm = shorteningMm / 2;
  const modelTrim = 0.5 * (nowModel.length - afterModel.length);
  const recorded = fileProfileMm(now);
  const profile: [number, number][] = [];
  const grid = nowModel.profile.positions;
  const push = (x: number, thickness: number): void => {
    if (profile.length > 0 && x <= profile[profile.length - 1]![0] + 1e-9) return;
    profile.push([x, thickness]);
  };
  push(0, thicknessAt(recorded, trimMm));
  for (let j = 0; j < grid.length; j++) {
    const p = Number((grid[j]! / mm).toFixed(9));
    if (p <= trimMm + 1e-9 || p >= now.length_mm - trimMm - 1e-9) continue;
    const cap = thicknessAt(recorded, p);
    const depth = (depthFactor * Math.max(0, thicknessAt(nowModel.profile, p * mm) - thicknessAt(afterModel.profile, p * mm - modelTrim))) / mm;
    // A guard: a record far thicker than the bar really is must not be written below 2 % of the blank.
    const planned = Math.max(roundTo(0.02 * now.section.thickness_mm, 0.01), roundTo(Math.ceil((cap - depth) / 0.01 - 1e-6) * 0.01, 0.01));
    push(p - trimMm, depth < 0.005 || planned >= cap - 1e-9 ? cap : planned);
  }
  const last = thicknessAt(recorded, now.length_mm - trimMm);
  if (profile[profile.length - 1]![0] >= lengthMm - 1e-9) profile.pop();
  profile.push([lengthMm, last]);
  bar.profile_mm = profile;
  return bar;
}

/**
 * The shape the maker will really have after cutting `after` (a bar file) from `now` (the bar
 * file as recorded): the estimated shape now (`nowModel`) minus the depth the two files differ by,
 * at `after`'s stations (times `handScale`, how deep the maker's cuts run against the file) — so
 * predictions follow the rounded file, not the unrounded plan.
 */
export function shapeAfterFile(now: BarFile, nowModel: BarModel, after: BarFile, handScale = 1): BarModel {
  if (now.section.shape !== 'rect' || !after.profile_mm) return { ...nowModel, length: after.length_mm * mm, profile: uniformProfile(after.length_mm * mm, nowModel.profile.thicknesses[0]!) };
  const recorded = fileProfileMm(now);
  const trimMm = (now.length_mm - after.length_mm) / 2;
  const positions = Float64Array.from(after.profile_mm, ([x]) => x * mm);
  const thicknesses = Float64Array.from(after.profile_mm, ([x, t]) => {
    const depth = handScale * Math.max(0, thicknessAt(recorded, x + trimMm) - t);
    return thicknessAt(nowModel.profile, (x + trimMm) * mm) - depth * mm;
  });
  return { ...nowModel, length: after.length_mm * mm, profile: { positions, thicknesses } };
}

