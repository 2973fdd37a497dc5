import type { ThicknessProfile } from '../section/ThicknessProfile.ts';
import type { LineHole } from './BeamLine.ts';

/**
 * Mesh node positions (m) along a bar: a node at every profile station (where the section's
 * slope changes) and at each cord hole's edges and centre (where the section starts and stops
 * losing the hole, see holeQuadrature.ts), each interval between them divided evenly so no
 * element is longer than length/targetElements. Returns ascending positions from 0 to the bar's length.
 */
export function buildMesh(profile: ThicknessProfile, targetElements: number, holes?: readonly LineHole[]): Float64Array {
  const positions = profile.positions;
  const first = positions[0]!;
  const last = positions[positions.length - 1]!;
  const length = last - first;
  const largest = length / Math.max(1, targetElements);
  let breaks: number[] = Array.from(positions);
  if (holes && holes.some((hole) => hole.radius > 0)) {
    // Stations win over hole edges closer than a nanometre-scale gap (a station must stay a node).
    const gap = 1e-10 * length;
    const all = [...breaks.map((x) => ({ x, station: true }))];
    for (const hole of holes) if (hole.radius > 0) for (const x of [hole.position - hole.radius, hole.position, hole.position + hole.radius]) if (x > first && x < last) all.push({ x, station: false });
    all.sort((a, b) => a.x - b.x || Number(b.station) - Number(a.station));
    const kept: { x: number; station: boolean }[] = [];
    for (const point of all) {
      const previous = kept[kept.length - 1];
      if (previous && point.x - previous.x < gap) {
        if (point.station && !previous.station) kept[kept.length - 1] = point;
        continue;
      }
      kept.push(point);
    }
    breaks = kept.map((point) => point.x);
  }
  const nodes: number[] = [breaks[0]!];
  for (let k = 0; k + 1 < breaks.length; k++) {
    const a = breaks[k]!;
    const b = breaks[k + 1]!;
    const pieces = Math.max(1, Math.ceil((b - a) / largest - 1e-9));
    for (let p = 1; p <= pieces; p++) nodes.push(p === pieces ? b : a + ((b - a) * p) / pieces);
  }
  return Float64Array.from(nodes);
}
