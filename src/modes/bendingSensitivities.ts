import { elementOffset } from '../fe/assembleBending.ts';
import { drilledElementRule, lineHoleAt } from '../fe/holeQuadrature.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';
import { bendingFieldsAt } from './modeShape.ts';
import type { BendingSolution } from './solveBending.ts';

/**
 * Eigenvalue sensitivities dλ/dt_j (rad²·s⁻²·m⁻¹) of each bending mode with respect to the
 * thickness t_j at each profile station j. The profile is linear between stations, so t_j acts
 * through the hat function of station j: dλ/dt_j = uᵀ(∂K/∂t_j − λ·∂M/∂t_j)u for the
 * M-normalised mode u (Fox & Kapoor, AIAA J. 6 (1968) 2426), with ∂K, ∂M the exact derivatives
 * of the assembled matrices (same Gauss rule, shape functions independent of the section), so
 * this is the exact first derivative of the discrete eigenvalue (over a cord hole with the same
 * angle rule as the assembly). One array per mode, one entry per station; zeros for round
 * sections (no thickness profile).
 */
export function bendingSensitivities(solution: BendingSolution): Float64Array[] {
  const { system, line } = solution;
  const { nodes, thickness, element } = system;
  const profile = line.profile;
  const timoshenko = element.theory === 'timoshenko';
  const n = element.localDofs;
  const { points, weights } = element.quadrature;
  const result = solution.vectors.map(() => new Float64Array(profile.positions.length));
  const properties = new Float64Array(4);
  const slopes = new Float64Array(4);
  const nw = new Float64Array(n);
  const nt = new Float64Array(n);
  const bb = new Float64Array(n);
  const bs = new Float64Array(n);
  for (let e = 0; e + 1 < nodes.length; e++) {
    const x0 = nodes[e]!;
    const h = nodes[e + 1]! - x0;
    const k = thickness.interval[e]!;
    const p0 = profile.positions[k]!;
    const span = profile.positions[k + 1]! - p0;
    const t0 = thickness.start[e]!;
    const t1 = thickness.end[e]!;
    const offset = elementOffset(system, e);
    const hole = system.holes[e]!;
    const drilled = hole >= 0 ? drilledElementRule(x0, x0 + h, line.holes![hole]!) : undefined;
    const count = drilled ? drilled.xi.length : points.length;
    for (let g = 0; g < count; g++) {
      let xi: number;
      let weight: number;
      if (drilled) {
        xi = drilled.xi[g]!;
        weight = drilled.weight[g]!;
        line.law.evaluateDrilled!(t0 + xi * (t1 - t0), drilled.chord[g]!, drilled.depthBelowTop, properties, slopes);
        element.evaluate(xi, h, nw, nt, bb, bs);
      } else {
        xi = points[g]!;
        weight = weights[g]! * h;
        line.law.evaluate(t0 + xi * (t1 - t0), properties, slopes);
        element.evaluateAtQuadraturePoint(g, h, nw, nt, bb, bs);
      }
      const s = (x0 + xi * h - p0) / span;
      solution.vectors.forEach((u, mode) => {
        let w = 0;
        let theta = 0;
        let curvature = 0;
        let shear = 0;
        for (let a = 0; a < n; a++) {
          const value = u[offset + a]!;
          w += nw[a]! * value;
          theta += nt[a]! * value;
          curvature += bb[a]! * value;
          shear += bs[a]! * value;
        }
        const lambda = solution.eigenvalues[mode]!;
        let density = slopes[0]! * curvature * curvature - lambda * slopes[2]! * w * w;
        if (timoshenko) density += slopes[1]! * shear * shear - lambda * slopes[3]! * theta * theta;
        const out = result[mode]!;
        out[k]! += weight * density * (1 - s);
        out[k + 1]! += weight * density * s;
      });
    }
  }
  return result;
}

const values = new Float64Array(4);
const derivative = new Float64Array(4);

/**
 * The local density of dλ/dt along the bar at x (rad²·s⁻²·m⁻²: change of λ per metre of
 * thickness removed over one metre of length), for a where-to-cut map:
 * EI′·κ_b² + κGA′·γ² − λ(ρA′·w² + ρI′·θ²), primes d/dt of the section law, fields of the
 * M-normalised mode at x.
 */
export function bendingSensitivityDensity(solution: BendingSolution, mode: number, x: number): number {
  const fields = bendingFieldsAt(solution, mode, x);
  const line = solution.line;
  const drilled = lineHoleAt(line.holes, x);
  if (drilled && line.law.evaluateDrilled) line.law.evaluateDrilled(thicknessAt(line.profile, x), drilled.chord, drilled.depthBelowTop, values, derivative);
  else line.law.evaluate(thicknessAt(line.profile, x), values, derivative);
  const lambda = solution.eigenvalues[mode]!;
  let density = derivative[0]! * fields.curvature ** 2 - lambda * derivative[2]! * fields.deflection ** 2;
  if (solution.system.theory === 'timoshenko') density += derivative[1]! * fields.shear ** 2 - lambda * derivative[3]! * fields.rotation ** 2;
  return density;
}
