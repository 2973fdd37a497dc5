import type { ShapeFamily, ShapeSpace } from './ShapeFamily.ts';

const minimumSpanFraction = 0.3;
/** Exponent range: p = 2·6^q₁, from 2 (a parabola) to 12 (nearly flat-bottomed). */
const smallestExponent = 2;
const exponentGrowth = Math.log(6);

/**
 * Power-law arch, symmetric about the centre: d = D·(1 − u^p) for u = |x − c|/H < 1, 0 beyond.
 * Parameters: q₀ depth D = q₀·maxDepth; q₁ exponent p = 2·6^q₁ (2 … 12; p ≥ 2 keeps the bottom
 * curvature finite); q₂ half-span H = (0.3 + 0.7·q₂)·maxHalfSpan.
 * Derivatives analytic: ∂d/∂p = −D·u^p·ln u, ∂d/∂H = D·p·u^p/H.
 */
export const powerArch: ShapeFamily = {
  name: 'power-arch',
  parameterCount: () => 3,
  parameterNames: () => ['depth', 'exponent', 'span'],
  starts: () => [
    Float64Array.of(0.5, 0.1, 0.8),
    Float64Array.of(0.5, 0.5, 0.95),
    Float64Array.of(0.6, 0.8, 0.6),
  ],
  depths(space: ShapeSpace, q: ArrayLike<number>, depth: Float64Array, jacobian?: Float64Array): void {
    const D = q[0]! * space.maxDepth;
    const p = smallestExponent * Math.exp(exponentGrowth * q[1]!);
    const H = (minimumSpanFraction + (1 - minimumSpanFraction) * q[2]!) * space.grid.maxHalfSpan;
    const offsets = space.grid.offset;
    for (let j = 0; j < offsets.length; j++) {
      const u = offsets[j]! / H;
      let shape = 0;
      let dShapeDp = 0;
      let dShapeDH = 0;
      if (u < 1) {
        const power = u > 0 ? u ** p : 0;
        shape = 1 - power;
        dShapeDp = u > 0 ? -power * Math.log(u) : 0;
        dShapeDH = (p * power) / H;
      }
      depth[j] = D * shape;
      if (jacobian) {
        jacobian[3 * j] = shape * space.maxDepth;
        jacobian[3 * j + 1] = D * dShapeDp * p * exponentGrowth;
        jacobian[3 * j + 2] = D * dShapeDH * (1 - minimumSpanFraction) * space.grid.maxHalfSpan;
      }
    }
  },
  describe(space, q) {
    return {
      depth_mm: q[0]! * space.maxDepth * 1e3,
      exponent: smallestExponent * Math.exp(exponentGrowth * q[1]!),
      half_span_mm: (minimumSpanFraction + (1 - minimumSpanFraction) * q[2]!) * space.grid.maxHalfSpan * 1e3,
    };
  },
};
