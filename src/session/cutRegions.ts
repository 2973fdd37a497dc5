/**
 * The regions a session's cut is made of: symmetric pairs of smooth bumps (raised cosines)
 * spread over the cuttable span between the uncut ends, each removing depth `amplitude · shape(x)`.
 * A cut is a non-negative combination of them, so it only ever removes wood, varies smoothly
 * (no single-station pits) and keeps the bar's symmetry about the span's centre.
 */
export interface CutRegions {
  /** Where the cuttable span starts and ends (m from the left end). */
  readonly start: number;
  readonly end: number;
  /** Centre of the cuttable span (m from the left end). */
  readonly centre: number;
  /** Distance of each region's bumps from the centre (m): 0 for the middle one. */
  readonly offsets: Float64Array;
  /** Half-width of every bump (m): it falls from full depth to zero over this distance. */
  readonly halfWidth: number;
  /** Each region's shape at each station (0…1 per bump, summed over its pair). */
  readonly shapes: Float64Array[];
  /** Each region's removed area per unit amplitude (m²/m): ∫shape dx. */
  readonly areas: Float64Array;
}

/** Regions on each side of the centre (the middle one included): resolution of the cut. */
export const defaultRegionCount = 9;

/** Raised cosine: 1 at 0, falling smoothly to 0 at ±halfWidth. */
function bump(distance: number, halfWidth: number): number {
  const u = Math.abs(distance) / halfWidth;
  return u >= 1 ? 0 : 0.5 * (1 + Math.cos(Math.PI * u));
}

/**
 * Builds `count` symmetric regions over [start, end] (m) sampled at `stations` (m): centres at
 * the span's centre ± k·s with s = half-span/(count + ½), half-width 1.5·s so neighbours overlap
 * and the outermost bump just reaches the span's ends.
 */
export function cutRegions(stations: ArrayLike<number>, start: number, end: number, count = defaultRegionCount): CutRegions {
  const centre = 0.5 * (start + end);
  const halfSpan = 0.5 * (end - start);
  const spacing = halfSpan / (count + 0.5);
  const halfWidth = 1.5 * spacing;
  const offsets = Float64Array.from({ length: count }, (_, k) => k * spacing);
  const shapes = Array.from(offsets, (offset) =>
    Float64Array.from(stations as ArrayLike<number>, (x) => (offset === 0 ? bump(x - centre, halfWidth) : bump(x - centre - offset, halfWidth) + bump(x - centre + offset, halfWidth))),
  );
  const areas = Float64Array.from(shapes, (shape) => {
    let area = 0;
    for (let j = 0; j + 1 < stations.length; j++) area += 0.5 * (shape[j]! + shape[j + 1]!) * (stations[j + 1]! - stations[j]!);
    return area;
  });
  return { start, end, centre, offsets, halfWidth, shapes, areas };
}
