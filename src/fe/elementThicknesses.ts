import { profileInterval, type ThicknessProfile } from '../section/ThicknessProfile.ts';

/**
 * For each element [nodes[e], nodes[e+1]] (which lies inside one profile interval, since the
 * mesh has a node at every station): the interval index and the thickness at both ends (m).
 */
export function elementThicknesses(nodes: Float64Array, profile: ThicknessProfile): { interval: Int32Array; start: Float64Array; end: Float64Array } {
  const elements = nodes.length - 1;
  const interval = new Int32Array(elements);
  const start = new Float64Array(elements);
  const end = new Float64Array(elements);
  for (let e = 0; e < elements; e++) {
    const x0 = nodes[e]!;
    const x1 = nodes[e + 1]!;
    const k = profileInterval(profile, (x0 + x1) / 2);
    const p0 = profile.positions[k]!;
    const p1 = profile.positions[k + 1]!;
    const t0 = profile.thicknesses[k]!;
    const t1 = profile.thicknesses[k + 1]!;
    const slope = (t1 - t0) / (p1 - p0);
    interval[e] = k;
    start[e] = t0 + slope * (x0 - p0);
    end[e] = t0 + slope * (x1 - p0);
  }
  return { interval, start, end };
}
