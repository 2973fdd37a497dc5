import { gaussLegendre, type QuadratureRule } from './gaussLegendre.ts';
import { lagrangeBasis } from './lagrangeBasis.ts';

/** Which classical beam theory an element follows. */
export type BeamTheory = 'timoshenko' | 'euler-bernoulli';

/**
 * A beam element's interpolation. Local dofs are ordered [w_left, θ_left, internal…, w_right,
 * θ_right], so consecutive elements share their end pairs and the global matrices stay banded.
 * `evaluate` writes, at reference ξ ∈ [0, 1] on an element of length h (m), for every local dof:
 * deflection N_w, rotation N_θ, curvature B_b = dθ/dx and shear strain B_s = dw/dx − θ.
 */
export interface BeamElementType {
  readonly theory: BeamTheory;
  readonly localDofs: number;
  readonly internalDofs: number;
  /** 0 for a deflection dof, 1 for a rotation dof, in local order. */
  readonly dofKind: Uint8Array;
  /** Reference position ξ of each local dof. */
  readonly dofPosition: Float64Array;
  readonly quadrature: QuadratureRule;
  evaluate(xi: number, h: number, deflection: Float64Array, rotation: Float64Array, curvature: Float64Array, shear: Float64Array): void;
  /** Same as evaluate at quadrature point g (from tables computed once: the assembly hot path). */
  evaluateAtQuadraturePoint(g: number, h: number, deflection: Float64Array, rotation: Float64Array, curvature: Float64Array, shear: Float64Array): void;
}

/**
 * Euler–Bernoulli element: Hermite cubic deflection with θ = w′ (the classical C¹ beam element),
 * dofs [w₁, θ₁, w₂, θ₂], no shear strain. Eigenvalue error O(h⁴). The 4-point Gauss rule
 * integrates its mass and stiffness exactly for a linearly tapering rectangle.
 */
export const hermiteCubicElement: BeamElementType = {
  theory: 'euler-bernoulli',
  localDofs: 4,
  internalDofs: 0,
  dofKind: Uint8Array.of(0, 1, 0, 1),
  dofPosition: Float64Array.of(0, 0, 1, 1),
  quadrature: gaussLegendre(4),
  evaluate(xi, h, deflection, rotation, curvature, shear) {
    const xi2 = xi * xi;
    const xi3 = xi2 * xi;
    deflection[0] = 1 - 3 * xi2 + 2 * xi3;
    deflection[1] = h * (xi - 2 * xi2 + xi3);
    deflection[2] = 3 * xi2 - 2 * xi3;
    deflection[3] = h * (xi3 - xi2);
    rotation[0] = (-6 * xi + 6 * xi2) / h;
    rotation[1] = 1 - 4 * xi + 3 * xi2;
    rotation[2] = (6 * xi - 6 * xi2) / h;
    rotation[3] = 3 * xi2 - 2 * xi;
    curvature[0] = (-6 + 12 * xi) / (h * h);
    curvature[1] = (-4 + 6 * xi) / h;
    curvature[2] = (6 - 12 * xi) / (h * h);
    curvature[3] = (6 * xi - 2) / h;
    shear.fill(0);
  },
  evaluateAtQuadraturePoint(g, h, deflection, rotation, curvature, shear) {
    this.evaluate(this.quadrature.points[g]!, h, deflection, rotation, curvature, shear);
  },
};

/**
 * Timoshenko element with independent Lagrange interpolations: rotation θ of degree p and
 * deflection w of degree p + 1 (equally spaced points), so w′ and θ live in the same space and
 * the shear strain w′ − θ can vanish exactly — no shear locking at any thickness. Eigenvalue
 * error O(h^{2p}) (Strang & Fix, An Analysis of the Finite Element Method, §6.3). Gauss rule of
 * p + 2 points: exact for a linearly tapering rectangle's integrands (degree ≤ 2p + 3).
 */
export function timoshenkoLagrangeElement(p: number): BeamElementType {
  const wPoints = Array.from({ length: p + 2 }, (_, k) => k / (p + 1));
  const thetaPoints = Array.from({ length: p + 1 }, (_, k) => k / p);
  const internalW = p;
  const internalTheta = p - 1;
  const localDofs = 4 + internalW + internalTheta;
  // Local index of each w and θ basis function.
  const wIndex = [0, ...Array.from({ length: internalW }, (_, k) => 2 + k), localDofs - 2];
  const thetaIndex = [1, ...Array.from({ length: internalTheta }, (_, k) => 2 + internalW + k), localDofs - 1];
  const dofKind = new Uint8Array(localDofs);
  const dofPosition = new Float64Array(localDofs);
  wIndex.forEach((index, k) => {
    dofKind[index] = 0;
    dofPosition[index] = wPoints[k]!;
  });
  thetaIndex.forEach((index, k) => {
    dofKind[index] = 1;
    dofPosition[index] = thetaPoints[k]!;
  });
  const wValues = new Float64Array(p + 2);
  const wSlopes = new Float64Array(p + 2);
  const tValues = new Float64Array(p + 1);
  const tSlopes = new Float64Array(p + 1);
  const quadrature = gaussLegendre(p + 2);
  // Reference values and ξ-slopes of every basis function at every quadrature point.
  const tables = Array.from(quadrature.points, (xi) => {
    const wv = new Float64Array(p + 2);
    const ws = new Float64Array(p + 2);
    const tv = new Float64Array(p + 1);
    const ts = new Float64Array(p + 1);
    lagrangeBasis(wPoints, xi, wv, ws);
    lagrangeBasis(thetaPoints, xi, tv, ts);
    return { wv, ws, tv, ts };
  });
  const fill = (
    wv: Float64Array,
    ws: Float64Array,
    tv: Float64Array,
    ts: Float64Array,
    h: number,
    deflection: Float64Array,
    rotation: Float64Array,
    curvature: Float64Array,
    shear: Float64Array,
  ) => {
    deflection.fill(0);
    rotation.fill(0);
    curvature.fill(0);
    shear.fill(0);
    for (let k = 0; k < wIndex.length; k++) {
      const index = wIndex[k]!;
      deflection[index] = wv[k]!;
      shear[index] = ws[k]! / h;
    }
    for (let k = 0; k < thetaIndex.length; k++) {
      const index = thetaIndex[k]!;
      rotation[index] = tv[k]!;
      curvature[index] = ts[k]! / h;
      shear[index]! -= tv[k]!;
    }
  };
  return {
    theory: 'timoshenko',
    localDofs,
    internalDofs: internalW + internalTheta,
    dofKind,
    dofPosition,
    quadrature,
    evaluate(xi, h, deflection, rotation, curvature, shear) {
      lagrangeBasis(wPoints, xi, wValues, wSlopes);
      lagrangeBasis(thetaPoints, xi, tValues, tSlopes);
      fill(wValues, wSlopes, tValues, tSlopes, h, deflection, rotation, curvature, shear);
    },
    evaluateAtQuadraturePoint(g, h, deflection, rotation, curvature, shear) {
      const table = tables[g]!;
      fill(table.wv, table.ws, table.tv, table.ts, h, deflection, rotation, curvature, shear);
    },
  };
}

/** The Timoshenko element barwright uses: θ cubic, w quartic (eigenvalue error O(h⁶)). */
export const timoshenkoElementType: BeamElementType = timoshenkoLagrangeElement(3);

/** The element type for a theory. */
export function elementTypeFor(theory: BeamTheory): BeamElementType {
  return theory === 'timoshenko' ? timoshenkoElementType : hermiteCubicElement;
}
