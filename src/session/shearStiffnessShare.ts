import { elementOffset } from '../fe/assembleBending.ts';
import type { BendingSolution } from '../modes/solveBending.ts';

/**
 * For each mode of a bending solution, the share of its stiffness that is shear:
 * uᵀK_shear u / λ = (∫ κGA·γ² dx)/λ for the M-normalised mode u (λ = uᵀKu), integrated with the
 * elements' own Gauss rule, so it is exact for the discrete model. Because K_shear is
 * proportional to G, this is d ln λ / d ln G at fixed E, and half of it is d ln f / d ln G
 * (Rayleigh quotient stationarity: the eigenvalue derivative is uᵀ(dK)u). Zero for
 * Euler–Bernoulli solutions.
 */
export function shearStiffnessShare(solution: BendingSolution): Float64Array {
  const { system, line } = solution;
  const result = new Float64Array(solution.vectors.length);
  if (system.theory !== 'timoshenko') return result;
  const { nodes, thickness, element } = system;
  const n = element.localDofs;
  const { points, weights } = element.quadrature;
  const properties = new Float64Array(4);
  const deflection = new Float64Array(n);
  const rotation = new Float64Array(n);
  const curvature = new Float64Array(n);
  const shear = new Float64Array(n);
  for (let e = 0; e + 1 < nodes.length; e++) {
    const h = nodes[e + 1]! - nodes[e]!;
    const t0 = thickness.start[e]!;
    const t1 = thickness.end[e]!;
    const offset = elementOffset(system, e);
    for (let g = 0; g < points.length; g++) {
      line.law.evaluate(t0 + points[g]! * (t1 - t0), properties);
      element.evaluateAtQuadraturePoint(g, h, deflection, rotation, curvature, shear);
      const weight = weights[g]! * h * properties[1]!;
      solution.vectors.forEach((u, mode) => {
        let strain = 0;
        for (let a = 0; a < n; a++) strain += shear[a]! * u[offset + a]!;
        result[mode]! += weight * strain * strain;
      });
    }
  }
  for (let mode = 0; mode < result.length; mode++) result[mode] = result[mode]! / solution.eigenvalues[mode]!;
  return result;
}
