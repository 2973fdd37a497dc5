import type { LineHole } from './BeamLine.ts';
import { gaussLegendre } from './gaussLegendre.ts';

/**
 * The quadrature of one element lying inside a cord hole's span: reference positions ξ ∈ [0, 1],
 * weights in metres (∫ f dx ≈ Σ weight_g·f(x_g)), and the hole's chord at each point (m).
 */
export interface DrilledRule {
  readonly xi: Float64Array;
  readonly weight: Float64Array;
  readonly chord: Float64Array;
  readonly depthBelowTop: number;
}

/**
 * Points of the angle rule. Over a hole the section changes with the chord 2√(r² − s²), whose
 * slope is infinite at the hole's edges: polynomial Gauss rules converge slowly there. With
 * s = r·sin φ the chord is 2r·cos φ and dx = r·cos φ dφ, so every element integrand (shape
 * functions, polynomial in s, times the net section's properties) becomes an analytic function
 * of φ and Gauss–Legendre in φ converges faster than geometrically. Measured on the Timoshenko
 * element's stiffness and mass over a half hole (test/fe/drilledElement.test.ts): the difference
 * from 80 points falls from 1e-4 at 10 points to 1e-13 at 16 and stays at rounding (≈ 1e-14)
 * from 20 on; 20 are used.
 */
export const holeQuadraturePoints = 20;

const angleRules = new Map([[holeQuadraturePoints, gaussLegendre(holeQuadraturePoints)]]);

/**
 * The angle rule (see holeQuadraturePoints; `points` for convergence checks) for the element
 * [x0, x1] (m), which must lie within the hole's span [position − radius, position + radius]
 * (the mesh has nodes at the hole's edges).
 */
export function drilledElementRule(x0: number, x1: number, hole: LineHole, points = holeQuadraturePoints): DrilledRule {
  let angleRule = angleRules.get(points);
  if (!angleRule) {
    angleRule = gaussLegendre(points);
    angleRules.set(points, angleRule);
  }
  const r = hole.radius;
  const clamp = (value: number): number => Math.min(1, Math.max(-1, value));
  const phi0 = Math.asin(clamp((x0 - hole.position) / r));
  const phi1 = Math.asin(clamp((x1 - hole.position) / r));
  const span = phi1 - phi0;
  const h = x1 - x0;
  const n = angleRule.points.length;
  const xi = new Float64Array(n);
  const weight = new Float64Array(n);
  const chord = new Float64Array(n);
  for (let g = 0; g < n; g++) {
    const phi = phi0 + angleRule.points[g]! * span;
    const cos = Math.cos(phi);
    xi[g] = Math.min(1, Math.max(0, (hole.position + r * Math.sin(phi) - x0) / h));
    weight[g] = angleRule.weights[g]! * span * r * cos;
    chord[g] = 2 * r * cos;
  }
  return { xi, weight, chord, depthBelowTop: hole.depthBelowTop };
}

/**
 * For each element [nodes[e], nodes[e+1]] the index of the hole whose span holds it, or −1.
 * Holes with no diameter drill nothing. Throws if an element straddles a hole's edge (the mesh
 * must have nodes there: buildMesh puts them).
 */
export function elementHoles(nodes: Float64Array, holes: readonly LineHole[] | undefined): Int32Array {
  const result = new Int32Array(Math.max(0, nodes.length - 1)).fill(-1);
  if (!holes || holes.length === 0) return result;
  const slack = 1e-9 * (nodes[nodes.length - 1]! - nodes[0]!);
  for (let e = 0; e + 1 < nodes.length; e++) {
    const x0 = nodes[e]!;
    const x1 = nodes[e + 1]!;
    holes.forEach((hole, k) => {
      if (!(hole.radius > 0)) return;
      const start = hole.position - hole.radius;
      const end = hole.position + hole.radius;
      if (x1 <= start + slack || x0 >= end - slack) return;
      if (x0 < start - slack || x1 > end + slack) throw new Error(`internal: element ${e} straddles the edge of cord hole ${k} (no mesh node there)`);
      result[e] = k;
    });
  }
  return result;
}

/** The chord (m) of the line's holes at x: the largest of any hole crossing there, else 0. */
export function lineHoleAt(holes: readonly LineHole[] | undefined, x: number): { chord: number; depthBelowTop: number } | undefined {
  if (!holes) return undefined;
  for (const hole of holes) {
    const offset = x - hole.position;
    const inside = hole.radius * hole.radius - offset * offset;
    if (inside > 0) return { chord: 2 * Math.sqrt(inside), depthBelowTop: hole.depthBelowTop };
  }
  return undefined;
}
