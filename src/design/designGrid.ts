import { mergeStations, type CutLimits } from './cutLimits.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';

/**
 * The stations a design is computed on, and the geometry of the arch region (SI, metres).
 * The grid is symmetric about the bar's centre over the arch (spacing `spacing`), with the ends
 * and the original profile's own stations added so `min(original, arch)` stays exact.
 */
export interface DesignGrid {
  readonly length: number;
  /** Bar centre (m). */
  readonly centre: number;
  /** Largest half-span of a symmetric arch that keeps clear of both uncut ends (m). */
  readonly maxHalfSpan: number;
  /** Station spacing over the arch (m). */
  readonly spacing: number;
  /** Station positions (m), ascending from 0 to length. */
  readonly positions: Float64Array;
  /** The original (current) thickness at each station (m). */
  readonly original: Float64Array;
  /** Distance of each station from the centre, |x − centre| (m). */
  readonly offset: Float64Array;
}

/**
 * Default station spacing over the arch (m): length/64 kept within 4–8 mm (a smooth arch is
 * followed to well under 0.05 mm between stations; the contract asks for at most 10 mm).
 */
export function defaultStationSpacing(length: number): number {
  return Math.min(0.008, Math.max(0.004, length / 64));
}
/** Fewest stations over a symmetric half arch, so short treble bars are still resolved. */
const minimumHalfStations = 10;

/**
 * The design grid for a bar of `original` profile under `limits`: symmetric stations c ± k·h over
 * the largest symmetric arch the uncut ends allow (h ≤ spacing, default defaultStationSpacing; at least 10 per half), the ends,
 * and every station of the original profile.
 */
export function designGrid(original: ThicknessProfile, limits: CutLimits, spacing?: number): DesignGrid {
  const length = original.positions[original.positions.length - 1]!;
  spacing ??= defaultStationSpacing(length);
  const centre = length / 2;
  const maxHalfSpan = Math.min(centre - limits.uncutLeft, length - limits.uncutRight - centre);
  if (!(maxHalfSpan > 0)) throw new RangeError('designGrid: the uncut ends leave no arch');
  const steps = Math.max(minimumHalfStations, Math.ceil(maxHalfSpan / spacing - 1e-9));
  const h = maxHalfSpan / steps;
  const symmetric: number[] = [];
  for (let k = -steps; k <= steps; k++) symmetric.push(centre + k * h);
  const positions = mergeStations([original.positions, symmetric], Math.min(1e-5, h / 100));
  positions[0] = 0;
  positions[positions.length - 1] = length;
  return {
    length,
    centre,
    maxHalfSpan,
    spacing: h,
    positions,
    original: Float64Array.from(positions, (x) => thicknessAt(original, x)),
    offset: Float64Array.from(positions, (x) => Math.abs(x - centre)),
  };
}
