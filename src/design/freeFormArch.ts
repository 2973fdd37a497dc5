import type { ShapeFamily, ShapeSpace } from './ShapeFamily.ts';

/** Number of free control depths: one per grid station on the half arch, the edge one fixed at 0. */
function knotCount(space: ShapeSpace): number {
  return Math.round(space.grid.maxHalfSpan / space.grid.spacing);
}

/**
 * Free-form symmetric arch: a control depth at each station of the half arch (spacing h, from the
 * centre out; the depth at the arch edge is 0), linear between controls and mirrored about the
 * centre: d(x) = Σ_k q_k·maxDepth·hat_k(|x − c|). Linear in q, so its Jacobian is the
 * interpolation weights. Used for the last few cents, with a smoothness penalty on second
 * differences applied by the designer.
 */
export const freeFormArch: ShapeFamily = {
  name: 'free-form',
  parameterCount: knotCount,
  parameterNames: (space) => Array.from({ length: knotCount(space) }, (_, k) => `depth_at_${+(k * space.grid.spacing * 1e3).toFixed(2)}mm`),
  starts: (space) => [new Float64Array(knotCount(space)).fill(0.4)],
  depths(space: ShapeSpace, q: ArrayLike<number>, depth: Float64Array, jacobian?: Float64Array): void {
    const count = knotCount(space);
    const h = space.grid.spacing;
    const offsets = space.grid.offset;
    if (jacobian) jacobian.fill(0, 0, offsets.length * count);
    for (let j = 0; j < offsets.length; j++) {
      const position = offsets[j]! / h;
      const k = Math.floor(position + 1e-9);
      const fraction = Math.min(1, Math.max(0, position - k));
      let value = 0;
      if (k < count) {
        value += (1 - fraction) * q[k]!;
        if (jacobian) jacobian[j * count + k] = (1 - fraction) * space.maxDepth;
        if (k + 1 < count) {
          value += fraction * q[k + 1]!;
          if (jacobian) jacobian[j * count + k + 1] = fraction * space.maxDepth;
        }
      }
      depth[j] = value * space.maxDepth;
    }
  },
  describe: (space, q) => Object.fromEntries(Array.from(q, (value, k) => [`depth_mm_at_${+(k * space.grid.spacing * 1e3).toFixed(2)}`, value * space.maxDepth * 1e3])),
};

/**
 * Free-form parameters that reproduce a symmetric depth profile at the grid's half stations
 * (depth in m at each grid station): q_k = depth at offset k·h / maxDepth, clamped to [0, 1].
 */
export function freeFormParameters(space: ShapeSpace, depth: ArrayLike<number>): Float64Array {
  const count = knotCount(space);
  const h = space.grid.spacing;
  const q = new Float64Array(count);
  const weight = new Float64Array(count);
  space.grid.offset.forEach((offset, j) => {
    const k = Math.round(offset / h);
    if (k < count && Math.abs(offset - k * h) < 1e-3 * h) {
      q[k]! += depth[j]! / space.maxDepth;
      weight[k]! += 1;
    }
  });
  for (let k = 0; k < count; k++) q[k] = Math.min(1, Math.max(0, weight[k]! > 0 ? q[k]! / weight[k]! : 0));
  return q;
}
