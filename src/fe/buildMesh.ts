import type { ThicknessProfile } from '../section/ThicknessProfile.ts';

/**
 * Mesh node positions (m) along a bar: a node at every profile station (where the section's
 * slope changes), each interval between stations divided evenly so no element is longer than
 * length/targetElements. Returns ascending positions from 0 to the bar's length.
 */
export function buildMesh(profile: ThicknessProfile, targetElements: number): Float64Array {
  const positions = profile.positions;
  const length = positions[positions.length - 1]! - positions[0]!;
  const largest = length / Math.max(1, targetElements);
  const nodes: number[] = [positions[0]!];
  for (let k = 0; k + 1 < positions.length; k++) {
    const a = positions[k]!;
    const b = positions[k + 1]!;
    const pieces = Math.max(1, Math.ceil((b - a) / largest - 1e-9));
    for (let p = 1; p <= pieces; p++) nodes.push(p === pieces ? b : a + ((b - a) * p) / pieces);
  }
  return Float64Array.from(nodes);
}
