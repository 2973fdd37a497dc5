/**
 * A piecewise-linear thickness profile along a rect bar (metres): `positions` strictly
 * increasing from 0 to the bar length, `thicknesses` the thickness at each station, linear
 * between stations. The top is flat; the undercut is on the underside.
 */
export interface ThicknessProfile {
  readonly positions: Float64Array;
  readonly thicknesses: Float64Array;
}

/** A uniform profile (no undercut) of the given length and thickness, metres. */
export function uniformProfile(length: number, thickness: number): ThicknessProfile {
  return { positions: Float64Array.of(0, length), thicknesses: Float64Array.of(thickness, thickness) };
}

/**
 * Index k of the profile interval [positions[k], positions[k+1]] that holds x (clamped to the
 * first/last interval). Binary search.
 */
export function profileInterval(profile: ThicknessProfile, x: number): number {
  const p = profile.positions;
  let lo = 0;
  let hi = p.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (p[mid]! <= x) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Thickness (m) at position x (m) by linear interpolation between stations. */
export function thicknessAt(profile: ThicknessProfile, x: number): number {
  const k = profileInterval(profile, x);
  const x0 = profile.positions[k]!;
  const x1 = profile.positions[k + 1]!;
  const s = x1 > x0 ? (x - x0) / (x1 - x0) : 0;
  return profile.thicknesses[k]! + s * (profile.thicknesses[k + 1]! - profile.thicknesses[k]!);
}
