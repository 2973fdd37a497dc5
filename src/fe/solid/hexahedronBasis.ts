import { gaussLegendre } from '../gaussLegendre.ts';

/** Which quadratic hexahedron: 20-node serendipity or 27-node Lagrange (triquadratic). */
export type HexahedronKind = 'serendipity-20' | 'lagrange-27';

/**
 * A quadratic hexahedron on the reference cube [−1, 1]³. Its nodes sit on the 3 × 3 × 3 lattice
 * of the cube (offsets 0, 1, 2 ↔ coordinates −1, 0, 1 along ξ, η, ζ): the 27-node element uses
 * all of them, the 20-node one only the points with at most one middle coordinate (8 corners and
 * 12 edge midpoints).
 */
export interface HexahedronType {
  readonly kind: HexahedronKind;
  readonly nodeCount: number;
  /** Lattice offsets (0, 1, 2) of local node a along ξ, η, ζ at [3a], [3a + 1], [3a + 2]. */
  readonly offsets: Int8Array;
  /**
   * Shape functions N_a at (ξ, η, ζ) into `values[a]` and their natural derivatives
   * ∂N_a/∂ξ, ∂N_a/∂η, ∂N_a/∂ζ into `derivatives[3a … 3a + 2]`.
   */
  evaluate(xi: number, eta: number, zeta: number, values: Float64Array, derivatives: Float64Array): void;
}

function latticeOffsets(keep: (oddCount: number) => boolean): Int8Array {
  const offsets: number[] = [];
  // ζ slowest, ξ fastest: any fixed order works, this one lists the bottom face first.
  for (let k = 0; k < 3; k++) for (let j = 0; j < 3; j++) for (let i = 0; i < 3; i++) if (keep((i & 1) + (j & 1) + (k & 1))) offsets.push(i, j, k);
  return Int8Array.from(offsets);
}

/**
 * The 20-node serendipity hexahedron (Zienkiewicz, Taylor & Zhu, The Finite Element Method:
 * Its Basis and Fundamentals, 7th ed. (2013), §6.5): with nodal coordinates (ξ_a, η_a, ζ_a),
 * corners N = ⅛(1 + ξξ_a)(1 + ηη_a)(1 + ζζ_a)(ξξ_a + ηη_a + ζζ_a − 2), edge midpoints (say
 * ξ_a = 0) N = ¼(1 − ξ²)(1 + ηη_a)(1 + ζζ_a). Complete quadratic, plus some cubic terms.
 */
export const serendipityHexahedron: HexahedronType = (() => {
  const offsets = latticeOffsets((odd) => odd <= 1);
  const nodeCount = offsets.length / 3;
  const f = new Float64Array(3);
  const df = new Float64Array(3);
  return {
    kind: 'serendipity-20',
    nodeCount,
    offsets,
    evaluate(xi, eta, zeta, values, derivatives) {
      const s = [xi, eta, zeta];
      for (let a = 0; a < nodeCount; a++) {
        let middle = -1;
        for (let d = 0; d < 3; d++) {
          const c = offsets[3 * a + d]! - 1;
          const t = s[d]!;
          if (c === 0) {
            middle = d;
            f[d] = 1 - t * t;
            df[d] = -2 * t;
          } else {
            f[d] = 1 + t * c;
            df[d] = c;
          }
        }
        if (middle >= 0) {
          values[a] = 0.25 * f[0]! * f[1]! * f[2]!;
          derivatives[3 * a] = 0.25 * df[0]! * f[1]! * f[2]!;
          derivatives[3 * a + 1] = 0.25 * f[0]! * df[1]! * f[2]!;
          derivatives[3 * a + 2] = 0.25 * f[0]! * f[1]! * df[2]!;
        } else {
          // g = ξξ_a + ηη_a + ζζ_a − 2 = f_ξ + f_η + f_ζ − 5 (each f = 1 + s·c), ∂g/∂s_d = c_d = ∂f_d/∂s_d,
          // so ∂(f_ξ f_η f_ζ g)/∂ξ = c_ξ·f_η·f_ζ·(g + f_ξ).
          const g = f[0]! + f[1]! + f[2]! - 5;
          values[a] = 0.125 * f[0]! * f[1]! * f[2]! * g;
          derivatives[3 * a] = 0.125 * df[0]! * f[1]! * f[2]! * (g + f[0]!);
          derivatives[3 * a + 1] = 0.125 * df[1]! * f[0]! * f[2]! * (g + f[1]!);
          derivatives[3 * a + 2] = 0.125 * df[2]! * f[0]! * f[1]! * (g + f[2]!);
        }
      }
    },
  };
})();

/** The 1D quadratic Lagrange basis on nodes −1, 0, 1 and its derivative. */
function quadratic(t: number, index: number): number {
  return index === 0 ? 0.5 * t * (t - 1) : index === 1 ? 1 - t * t : 0.5 * t * (t + 1);
}
function quadraticDerivative(t: number, index: number): number {
  return index === 0 ? t - 0.5 : index === 1 ? -2 * t : t + 0.5;
}

/** The 27-node Lagrange (triquadratic) hexahedron: N = l_i(ξ)·l_j(η)·l_k(ζ), l the 1D quadratics on −1, 0, 1. */
export const lagrangeHexahedron: HexahedronType = (() => {
  const offsets = latticeOffsets(() => true);
  const nodeCount = offsets.length / 3;
  return {
    kind: 'lagrange-27',
    nodeCount,
    offsets,
    evaluate(xi, eta, zeta, values, derivatives) {
      for (let a = 0; a < nodeCount; a++) {
        const i = offsets[3 * a]!;
        const j = offsets[3 * a + 1]!;
        const k = offsets[3 * a + 2]!;
        const fx = quadratic(xi, i);
        const fy = quadratic(eta, j);
        const fz = quadratic(zeta, k);
        values[a] = fx * fy * fz;
        derivatives[3 * a] = quadraticDerivative(xi, i) * fy * fz;
        derivatives[3 * a + 1] = fx * quadraticDerivative(eta, j) * fz;
        derivatives[3 * a + 2] = fx * fy * quadraticDerivative(zeta, k);
      }
    },
  };
})();

/** The hexahedron of a kind. */
export function hexahedronType(kind: HexahedronKind): HexahedronType {
  return kind === 'serendipity-20' ? serendipityHexahedron : lagrangeHexahedron;
}

/**
 * A hexahedron's shape functions tabulated at the points of a tensor Gauss–Legendre rule on the
 * reference cube: what every element integral reads.
 */
export interface HexahedronTable {
  readonly type: HexahedronType;
  readonly pointCount: number;
  /** Weights on [−1, 1]³ (they sum to 8). */
  readonly weights: Float64Array;
  /** Natural coordinates of point q at [3q … 3q + 2]. */
  readonly points: Float64Array;
  /** N_a at point q: values[q·n + a]. */
  readonly values: Float64Array;
  /** ∂N_a/∂(ξ, η, ζ) at point q: derivatives[(q·n + a)·3 + d]. */
  readonly derivatives: Float64Array;
}

const tables = new Map<string, HexahedronTable>();

/**
 * The table of a hexahedron at the n × n × n Gauss–Legendre rule (default 3: "full" integration
 * for quadratic elements, exact for the mass matrix of an affine element and for the stiffness of
 * a parallelepiped; Zienkiewicz, Taylor & Zhu, §6.8). Built once per (type, n).
 */
export function hexahedronTable(type: HexahedronType, order = 3): HexahedronTable {
  const key = `${type.kind}/${order}`;
  const cached = tables.get(key);
  if (cached) return cached;
  const rule = gaussLegendre(order);
  const n = type.nodeCount;
  const pointCount = order * order * order;
  const weights = new Float64Array(pointCount);
  const points = new Float64Array(3 * pointCount);
  const values = new Float64Array(pointCount * n);
  const derivatives = new Float64Array(pointCount * n * 3);
  const value = new Float64Array(n);
  const derivative = new Float64Array(3 * n);
  let q = 0;
  for (let k = 0; k < order; k++) {
    for (let j = 0; j < order; j++) {
      for (let i = 0; i < order; i++, q++) {
        const xi = 2 * rule.points[i]! - 1;
        const eta = 2 * rule.points[j]! - 1;
        const zeta = 2 * rule.points[k]! - 1;
        weights[q] = 8 * rule.weights[i]! * rule.weights[j]! * rule.weights[k]!;
        points.set([xi, eta, zeta], 3 * q);
        type.evaluate(xi, eta, zeta, value, derivative);
        values.set(value, q * n);
        derivatives.set(derivative, q * n * 3);
      }
    }
  }
  const table = { type, pointCount, weights, points, values, derivatives };
  tables.set(key, table);
  return table;
}
