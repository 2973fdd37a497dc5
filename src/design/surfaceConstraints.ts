import type { DesignProblem } from './evaluateShape.ts';

/** Which limit a surface constraint row expresses. */
type SurfaceConstraintKind = 'max-slope' | 'tool-radius';

/** Linear(ised) workshop constraints on an arch surface, g(q) ≥ 0, in metres of thickness. */
export interface SurfaceConstraints {
  readonly count: number;
  /** g at the current shape (m); negative means violated. */
  readonly values: Float64Array;
  /** ∂g/∂q, row-major constraint × parameter (m per unit q). */
  readonly jacobian: Float64Array;
  readonly kinds: SurfaceConstraintKind[];
  /** Station (index into the grid) each row belongs to. */
  readonly stations: Int32Array;
}

/**
 * The slope and tool-radius limits on the family's cut surface s = T − d over the arch, as
 * functions g ≥ 0 of the depths (linear in d, so exact for the free form and linearised through
 * ∂d/∂q for the parametric families):
 * slope  g = maxSlope·h − |d_{j+1} − d_j| (two rows per span);
 * radius g = −d_j + (d_{j+1}/h₁ + d_{j−1}/h₀ + (h₀ + h₁)/(2R))/(1/h₀ + 1/h₁), the same discrete
 * curvature checkProfile uses (how far t_j sits above the thinnest the tool allows).
 */
export function surfaceConstraints(problem: DesignProblem, depth: Float64Array, depthJacobian: Float64Array, m: number): SurfaceConstraints {
  const grid = problem.space.grid;
  const x = grid.positions;
  const n = x.length;
  const inside = (j: number): boolean => grid.offset[j]! <= grid.maxHalfSpan * (1 + 1e-9);
  const values: number[] = [];
  const rows: number[] = [];
  const kinds: SurfaceConstraintKind[] = [];
  const stations: number[] = [];
  const { maxSlope, minToolRadius } = problem.limits;
  for (let j = 0; j + 1 < n; j++) {
    if (!inside(j) && !inside(j + 1)) continue;
    const h = x[j + 1]! - x[j]!;
    const rise = depth[j + 1]! - depth[j]!;
    for (const sign of [1, -1]) {
      values.push(maxSlope * h - sign * rise);
      for (let p = 0; p < m; p++) rows.push(-sign * (depthJacobian[(j + 1) * m + p]! - depthJacobian[j * m + p]!));
      kinds.push('max-slope');
      stations.push(j);
    }
  }
  if (minToolRadius > 0) {
    const curvature = 1 / minToolRadius;
    for (let j = 1; j + 1 < n; j++) {
      if (!inside(j)) continue;
      const h0 = x[j]! - x[j - 1]!;
      const h1 = x[j + 1]! - x[j]!;
      const sum = 1 / h0 + 1 / h1;
      values.push(-depth[j]! + (depth[j + 1]! / h1 + depth[j - 1]! / h0 + (curvature * (h0 + h1)) / 2) / sum);
      for (let p = 0; p < m; p++) rows.push(-depthJacobian[j * m + p]! + (depthJacobian[(j + 1) * m + p]! / h1 + depthJacobian[(j - 1) * m + p]! / h0) / sum);
      kinds.push('tool-radius');
      stations.push(j);
    }
  }
  return { count: values.length, values: Float64Array.from(values), jacobian: Float64Array.from(rows), kinds, stations: Int32Array.from(stations) };
}

/** The worst violation (m, ≥ 0) among the constraints. */
export function worstViolation(constraints: SurfaceConstraints): number {
  let worst = 0;
  for (const g of constraints.values) worst = Math.max(worst, -g);
  return worst;
}
