import type { ShapeFamily, ShapeSpace } from './ShapeFamily.ts';

/** Narrowest half-span as a fraction of the largest the uncut ends allow. */
const minimumSpanFraction = 0.3;
/** Widest flat bottom as a fraction of the half-span. */
const maximumFlatFraction = 0.85;

/** Cubic smooth step S(σ) = σ²(3 − 2σ) and its slope 6σ(1 − σ) (C¹ at both ends). */
function smoothStep(sigma: number): number {
  return sigma * sigma * (3 - 2 * sigma);
}
function smoothStepSlope(sigma: number): number {
  return 6 * sigma * (1 - sigma);
}

/**
 * Flat-bottomed arch with smooth shoulders, symmetric about the centre. Parameters:
 * q₀ depth D = q₀·maxDepth; q₁ flat fraction w = 0.85·q₁ of the half-span; q₂ half-span
 * H = (0.3 + 0.7·q₂)·maxHalfSpan. With u = |x − c|/H:
 * d = D for u ≤ w, D·S((1 − u)/(1 − w)) for w < u < 1 (S the cubic smooth step), 0 beyond.
 * Derivatives analytic: ∂d/∂w = D·S′·σ/(1 − w), ∂d/∂H = D·S′·u/((1 − w)H).
 */
export const shoulderArch: ShapeFamily = {
  name: 'shoulder-arch',
  parameterCount: () => 3,
  parameterNames: () => ['depth', 'flat', 'span'],
  starts: () => [Float64Array.of(0.6, 0.3, 0.5), Float64Array.of(0.7, 0.7, 0.7), Float64Array.of(0.5, 0.5, 0.95), Float64Array.of(0.5, 0.15, 0.75)],
  depths(space: ShapeSpace, q: ArrayLike<number>, depth: Float64Array, jacobian?: Float64Array): void {
    const D = q[0]! * space.maxDepth;
    const w = maximumFlatFraction * q[1]!;
    const H = (minimumSpanFraction + (1 - minimumSpanFraction) * q[2]!) * space.grid.maxHalfSpan;
    const offsets = space.grid.offset;
    for (let j = 0; j < offsets.length; j++) {
      const u = offsets[j]! / H;
      let shape = 0;
      let dShapeDw = 0;
      let dShapeDH = 0;
      if (u <= w) shape = 1;
      else if (u < 1) {
        const sigma = (1 - u) / (1 - w);
        const slope = smoothStepSlope(sigma);
        shape = smoothStep(sigma);
        dShapeDw = (slope * sigma) / (1 - w);
        dShapeDH = (slope * u) / ((1 - w) * H);
      }
      depth[j] = D * shape;
      if (jacobian) {
        jacobian[3 * j] = shape * space.maxDepth;
        jacobian[3 * j + 1] = D * dShapeDw * maximumFlatFraction;
        jacobian[3 * j + 2] = D * dShapeDH * (1 - minimumSpanFraction) * space.grid.maxHalfSpan;
      }
    }
  },
  describe(space, q) {
    const H = (minimumSpanFraction + (1 - minimumSpanFraction) * q[2]!) * space.grid.maxHalfSpan;
    return { depth_mm: q[0]! * space.maxDepth * 1e3, flat_fraction: maximumFlatFraction * q[1]!, half_span_mm: H * 1e3 };
  },
};
