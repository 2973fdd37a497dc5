// The advised cut in workshop terms: thickness checkpoints at round positions (every 5 or 10 mm)
// measured from the end or the centre the maker chooses, each with the depth to take; and, for a
// cut too shallow to set with a caliper, the span to go over with fine paper.
import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { roundDecimals } from '../fileFormats/roundDecimals.ts';
import { fileThicknessMm, smallestListedDepthMm, type CutInstructions } from './cutInstructions.ts';

/** Where the maker measures from: the left end, the right end, or the centre of the bar now. */
export type MeasureOrigin = 'left' | 'right' | 'centre';

/** The spacings offered for checkpoints, mm (common practice: a steel rule's 5 mm and 10 mm marks). */
export const checkpointSteps = [5, 10] as const;

/** One checkpoint: where (from the chosen origin and from the left end), the thickness now and after, the depth to take (mm). */
export interface RoundCheckpoint {
  /** Distance from the origin, mm: a multiple of the step; from the centre negative toward the left end. */
  from_origin_mm: number;
  /** The same place from the left end of the bar now, mm. */
  x_mm: number;
  thickness_now_mm: number;
  thickness_after_mm: number;
  remove_mm: number;
}

/** Where the origin lies on the bar now, mm from its left end. */
function originAt(lengthMm: number, origin: MeasureOrigin): number {
  return origin === 'left' ? 0 : origin === 'right' ? lengthMm : lengthMm / 2;
}

/** Position from the left end of a distance from the origin (toward the other end for 'right'). */
function fromLeft(lengthMm: number, origin: MeasureOrigin, distance: number): number {
  return origin === 'right' ? lengthMm - distance : originAt(lengthMm, origin) + distance;
}

/**
 * The cut from `now` to `after` (bar files, mm; `after` may be shorter, trimmed equally from both
 * ends as in cutInstructions) at every multiple of `stepMm` from `origin` that lies on the bar,
 * keeping those where at least 0.01 mm comes off. Thicknesses are the plan's profiles interpolated
 * linearly between its stations (as the bar file defines them); depths = now − after there.
 */
export function roundCheckpoints(now: BarFile, after: BarFile, stepMm: number, origin: MeasureOrigin): RoundCheckpoint[] {
  if (!(Number.isFinite(stepMm) && stepMm >= 1 && stepMm <= 50)) throw new InputError('checkpoints', 'step', 'must lie within 1–50 mm');
  if (now.section.shape !== 'rect') return [];
  const length = now.length_mm;
  const offset = Math.max(0, now.length_mm - after.length_mm) / 2;
  const reach = origin === 'centre' ? length / 2 : length;
  const count = Math.floor(reach / stepMm + 1e-9);
  const distances: number[] = [];
  for (let k = origin === 'centre' ? -count : 0; k <= count; k++) distances.push(k * stepMm);
  const points: RoundCheckpoint[] = [];
  for (const distance of distances) {
    const x = fromLeft(length, origin, distance);
    const before = fileThicknessMm(now, x);
    const inside = x >= offset - 1e-9 && x <= length - offset + 1e-9;
    const later = inside ? fileThicknessMm(after, x - offset) : 0;
    const remove = before - later;
    if (remove < smallestListedDepthMm - 1e-9) continue;
    points.push({ from_origin_mm: distance, x_mm: roundDecimals(x, 3), thickness_now_mm: roundDecimals(before, 2), thickness_after_mm: roundDecimals(later, 2), remove_mm: roundDecimals(remove, 2) });
  }
  return points.sort((a, b) => a.x_mm - b.x_mm);
}

/**
 * Below this deepest removal (mm) a cut is told as a few passes with fine paper, not as depths per
 * station: a workshop caliper reads to 0.01–0.02 mm with about ±0.02 mm repeatability on wood, so a
 * depth under 0.05 mm cannot be set or checked station by station, and a few passes with fine
 * (240–320 grit) paper take off a few hundredths (common practice).
 */
export const fineSandingDepthMm = 0.05;

/** A light sanding: the span to go over (mm from the chosen origin, and from the left end), and the deepest removal in it. */
export interface FineSanding {
  from_origin_mm: [number, number];
  x_mm: [number, number];
  max_depth_mm: number;
}

/**
 * The span of a tiny cut to go over with fine paper, or null when the cut is deep enough to set
 * with a caliper (max depth ≥ fineSandingDepthMm), shortens the bar, or takes nothing off. The
 * span runs over the stations where at least half the deepest removal comes off (where the paper
 * works; it feathers out beyond), from the chosen origin, rounded outward to whole millimetres.
 */
export function fineSanding(cut: CutInstructions, lengthMm: number, origin: MeasureOrigin): FineSanding | null {
  if (cut.shortening_mm > 0.005 || cut.stations.length === 0 || cut.max_depth_mm >= fineSandingDepthMm) return null;
  const working = cut.stations.filter((station) => station.remove_mm >= 0.5 * cut.max_depth_mm - 1e-9);
  const left = Math.min(...working.map((station) => station.position_mm));
  const right = Math.max(...working.map((station) => station.position_mm));
  const ends = [left, right].map((x) => (origin === 'right' ? lengthMm - x : x - originAt(lengthMm, origin)));
  const [from, to] = [Math.min(...ends), Math.max(...ends)];
  return { from_origin_mm: [Math.floor(from), Math.ceil(to)], x_mm: [roundDecimals(left, 1), roundDecimals(right, 1)], max_depth_mm: cut.max_depth_mm };
}
